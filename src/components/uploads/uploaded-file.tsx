// One file already sent: its preview, its review status in words with an icon, the office's
// reason when it was not accepted, and Remove while the office has not accepted it.
import { useState } from 'react';
import { formatBytes, uploadStatusWords, type UploadItem, type UploadStatus } from '@/lib/schemas/uploads';
import { removeUpload } from './api';
import { AcceptedIcon, BinIcon, ClockIcon, DocumentIcon, NotAcceptedIcon, WarningIcon } from '@/components/icons';

const chipStyle: Record<UploadStatus, string> = {
  waiting: 'border-ground-200 bg-ground-50 text-ground-800',
  accepted: 'border-clear/30 bg-clear-soft text-clear',
  rejected: 'border-blocked/30 bg-blocked-soft text-blocked',
};

/** The review status as a word with its icon (colour is never the only signal). */
export function StatusChip({ status }: { status: UploadStatus }) {
  const Icon = status === 'accepted' ? AcceptedIcon : status === 'rejected' ? NotAcceptedIcon : ClockIcon;
  return (
    <span className={`inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-sm font-semibold ${chipStyle[status]}`} data-status={status}>
      <Icon className="h-4 w-4" />
      {uploadStatusWords[status]}
    </span>
  );
}

const sentAt = (iso: string) =>
  new Date(iso).toLocaleString('en-GB', { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });

type Props = {
  item: UploadItem;
  /** What the slot is for, for the preview's alternative text. */
  title: string;
  canRemove: boolean;
  onRemoved: (id: string) => void;
  /** False while the slot shows the photo check's prompt for this file. */
  showFlag?: boolean;
};

export function UploadedFile({ item, title, canRemove, onRemoved, showFlag = true }: Props) {
  const [confirming, setConfirming] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const name = item.originalName ?? (item.mimeType === 'application/pdf' ? 'Document' : 'Photo');

  const remove = async () => {
    setBusy(true);
    setError(null);
    try {
      await removeUpload(item.id);
      onRemoved(item.id);
    } catch (err) {
      setError((err as Error).message);
      setBusy(false);
      setConfirming(false);
    }
  };

  return (
    <li className="flex gap-3 rounded-md border border-ground-100 bg-white p-2" data-testid="uploaded-file" data-upload-id={item.id}>
      <a href={item.url} target="_blank" rel="noopener" className="shrink-0 no-underline" aria-label={`Open ${name} in a new tab`}>
        {item.thumbUrl ? (
          <img
            src={item.thumbUrl}
            alt={`Your upload for ${title.toLowerCase()}`}
            width={80}
            height={80}
            loading="lazy"
            className="h-20 w-20 rounded border border-ground-100 bg-ground-50 object-cover"
          />
        ) : (
          <span className="flex h-20 w-20 flex-col items-center justify-center gap-1 rounded border border-ground-100 bg-ground-50 text-ground-700">
            <DocumentIcon className="h-8 w-8" />
            <span className="text-xs font-semibold">PDF</span>
          </span>
        )}
      </a>
      <div className="min-w-0 flex-1">
        <p className="truncate font-semibold text-ground-900" title={name}>
          {name}
        </p>
        <p className="text-sm text-ground-700">
          {formatBytes(item.sizeBytes)} · sent {sentAt(item.createdAt)}
        </p>
        <div className="mt-1 flex flex-wrap items-center gap-2">
          <StatusChip status={item.status} />
          {canRemove && item.status !== 'accepted' && !confirming && (
            <button
              type="button"
              className="inline-flex min-h-[36px] items-center gap-1 rounded px-2 text-sm font-semibold text-ground-700 underline decoration-ground-300 underline-offset-2 hover:text-blocked"
              onClick={() => setConfirming(true)}
              aria-label={`Remove ${name}`}
            >
              <BinIcon className="h-4 w-4" />
              Remove
            </button>
          )}
        </div>
        {showFlag && item.status === 'waiting' && item.quality && !item.quality.ok && (
          <p className="mt-1 flex items-start gap-1 text-sm text-attention" data-testid="kept-flag">
            <WarningIcon className="mt-0.5 h-4 w-4" />
            <span>{item.quality.problems.map((p) => p.message).join(' ')} Your installer will decide.</span>
          </p>
        )}
        {item.status === 'rejected' && (
          <p className="mt-1 text-sm text-blocked" data-testid="reject-reason">
            {item.reason ? `The office says: ${item.reason}` : 'The office could not use this file.'} Please send a new one.
          </p>
        )}
        {confirming && (
          <div className="mt-2 flex flex-wrap items-center gap-2 rounded-md bg-blocked-soft p-2 text-sm" role="group" aria-label="Confirm removal">
            <span className="font-semibold text-ink">Remove this file?</span>
            <button type="button" className="rounded-md bg-blocked px-3 py-1.5 font-semibold text-white disabled:opacity-60" disabled={busy} onClick={remove}>
              {busy ? 'Removing…' : 'Yes, remove'}
            </button>
            <button type="button" className="rounded-md border border-ground-300 bg-white px-3 py-1.5 font-semibold text-ground-800" disabled={busy} onClick={() => setConfirming(false)}>
              Keep it
            </button>
          </div>
        )}
        {error && (
          <p role="alert" className="mt-1 text-sm font-semibold text-blocked">
            {error}
          </p>
        )}
      </div>
    </li>
  );
}
