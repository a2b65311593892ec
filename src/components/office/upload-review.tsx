// The case's photos and documents, grouped by kind, with a large view and accept / reject with a
// reason (a rejection e-mails the customer the reason and what a good one shows).
import { useEffect, useId, useRef, useState } from 'react';
import type { Checklist } from '@/lib/schemas/checklist';
import type { ChecklistAnswers } from '@/lib/readiness/types';
import { requiredUploadKinds, uploadKindStatus } from '@/lib/readiness';
import { formatBytes, uploadKindInfo, uploadKinds, type UploadItem, type UploadKind, type UploadStatus } from '@/lib/schemas/uploads';
import { photoProblemStaffWords, rejectionWords } from '@/lib/photo-quality';
import { CheckIcon, CircleIcon, InfoIcon, SpinnerIcon, StopIcon, WarningIcon } from '@/components/icons';
import { apiCall } from './api';
import { formatDayTime } from './format';

type Props = { caseId: string; checklist: Checklist; refreshKey: number; onChanged(): void };

// Staff words for a file's review status (the customer reads "Not accepted" instead of "Rejected").
const statusWords: Record<UploadStatus, string> = { waiting: 'Waiting for review', accepted: 'Accepted', rejected: 'Rejected' };

const statusLook: Record<UploadStatus, string> = {
  waiting: 'border-attention/30 bg-attention-soft text-attention',
  accepted: 'border-clear/30 bg-clear-soft text-clear',
  rejected: 'border-blocked/30 bg-blocked-soft text-blocked',
};

function StatusPill({ status }: { status: UploadStatus }) {
  const Icon = status === 'accepted' ? CheckIcon : status === 'rejected' ? StopIcon : WarningIcon;
  return (
    <span className={`inline-flex items-center gap-1 whitespace-nowrap rounded-full border px-2 py-0.5 text-xs font-semibold ${statusLook[status]}`} data-testid="upload-status">
      <Icon className="h-3.5 w-3.5" />
      {statusWords[status]}
    </span>
  );
}

const kindStateWords = { accepted: 'Accepted', waiting: 'Waiting for review', rejected: 'Rejected — waiting for a new one', missing: 'Not sent yet' } as const;

/** A modal large view of one image. */
function Lightbox({ item, onClose }: { item: UploadItem | null; onClose(): void }) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (item && !d.open) d.showModal();
    if (!item && d.open) d.close();
  }, [item]);
  return (
    <dialog
      ref={ref}
      onClose={onClose}
      onClick={(e) => {
        if (e.target === ref.current) onClose();
      }}
      className="max-h-[95vh] w-[min(96vw,72rem)] rounded-lg bg-ink p-0 text-white backdrop:bg-ink/80"
      aria-label={item ? uploadKindInfo[item.kind].title : 'Photo'}
      data-testid="lightbox"
    >
      {item && (
        <div className="flex flex-col">
          <div className="flex items-center justify-between gap-3 px-4 py-2">
            <p className="font-semibold">{uploadKindInfo[item.kind].title}{item.originalName ? ` — ${item.originalName}` : ''}</p>
            <div className="flex items-center gap-3">
              <a href={item.url} target="_blank" rel="noreferrer" className="text-sm text-ground-100">Open full size</a>
              <button type="button" className="rounded border border-white/40 px-3 py-1.5 text-sm font-semibold hover:bg-white/10" onClick={onClose} autoFocus>
                Close
              </button>
            </div>
          </div>
          <img src={item.url} alt={`${uploadKindInfo[item.kind].title}, as the customer sent it`} className="max-h-[82vh] w-full bg-black object-contain" />
        </div>
      )}
    </dialog>
  );
}

/** What the photo check at upload found, in staff words with the figure and the setting it crossed. */
function PhotoFlags({ item }: { item: UploadItem }) {
  const problems = item.quality?.problems ?? [];
  if (problems.length === 0) return null;
  return (
    <div className="mt-1 rounded border border-attention/30 bg-attention-soft px-2 py-1 text-xs text-ink" data-testid="photo-flags">
      <p className="flex items-center gap-1 font-semibold text-attention">
        <WarningIcon className="h-3.5 w-3.5" />
        Photo check: {problems.map((p) => photoProblemStaffWords[p.code]).join(', ')}
      </p>
      <ul className="mt-0.5 list-none">
        {problems.map((p) => (
          <li key={p.code} data-code={p.code}>
            {photoProblemStaffWords[p.code]}: {p.measured} against {p.threshold} ({p.measure})
          </li>
        ))}
      </ul>
    </div>
  );
}

function RejectForm({ item, onDone, onCancel }: { item: UploadItem; onDone(updated: UploadItem): void; onCancel(): void }) {
  const id = useId();
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function send() {
    const trimmed = reason.trim();
    if (trimmed.length < 5) {
      setError('Tell the customer why, in a few words (at least 5 characters).');
      return;
    }
    setBusy(true);
    const r = await apiCall<UploadItem>('POST', `/api/uploads/${item.id}/review`, { decision: 'rejected', reason: trimmed });
    setBusy(false);
    if (r.ok) onDone(r.data);
    else setError(r.error.fields?.reason ?? r.error.message);
  }
  return (
    <div className="mt-2 rounded-md border border-blocked/30 bg-blocked-soft/50 p-3">
      <label htmlFor={`${id}-reason`} className="field-label text-sm">Reason the customer will read</label>
      <textarea
        id={`${id}-reason`}
        className="field-input min-h-[80px] text-sm"
        value={reason}
        required
        minLength={5}
        maxLength={1000}
        aria-invalid={!!error}
        aria-describedby={`${id}-help${error ? ` ${id}-error` : ''}`}
        onChange={(e) => setReason(e.target.value)}
        placeholder="For example: the fuse rating is blurred — please take it again closer, in good light."
      />
      {(item.quality?.problems.length ?? 0) > 0 && (
        <button
          type="button"
          className="mt-1 text-xs font-semibold text-ground-700 underline decoration-ground-300 underline-offset-2"
          onClick={() => setReason(rejectionWords(item.kind, item.quality!.problems))}
        >
          Use the photo check’s words
        </button>
      )}
      <p id={`${id}-help`} className="field-help text-xs">
        They are e-mailed this, with what a good one shows: “{uploadKindInfo[item.kind].hint}”
      </p>
      {error && <p id={`${id}-error`} className="field-error">{error}</p>}
      <div className="mt-2 flex gap-2">
        <button type="button" className="btn min-h-[36px] bg-blocked px-3 py-1.5 text-sm text-white hover:bg-blocked/90" disabled={busy} onClick={send}>
          {busy && <SpinnerIcon className="h-4 w-4" />}Reject and tell the customer
        </button>
        <button type="button" className="btn-secondary min-h-[36px] px-3 py-1.5 text-sm" onClick={onCancel}>Cancel</button>
      </div>
    </div>
  );
}

function UploadCard({ item, onOpen, onReviewed }: { item: UploadItem; onOpen(): void; onReviewed(updated: UploadItem): void }) {
  const [rejecting, setRejecting] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const isImage = item.mimeType.startsWith('image/');
  const title = uploadKindInfo[item.kind].title;
  async function accept() {
    setBusy(true);
    setError(null);
    const r = await apiCall<UploadItem>('POST', `/api/uploads/${item.id}/review`, { decision: 'accepted' });
    setBusy(false);
    if (r.ok) onReviewed(r.data);
    else setError(r.error.message);
  }
  return (
    <li className="rounded-md border border-ground-100 bg-white p-2" data-testid="upload-item" data-status={item.status} data-upload-id={item.id}>
      <div className="flex gap-3">
        {isImage ? (
          <button type="button" onClick={onOpen} className="group relative h-24 w-32 shrink-0 overflow-hidden rounded bg-ground-50" aria-label={`Large view of the ${title.toLowerCase()} photo`}>
            <img src={item.thumbUrl ?? item.url} alt="" className="h-full w-full object-cover transition-transform group-hover:scale-105" loading="lazy" />
          </button>
        ) : (
          <a href={item.url} target="_blank" rel="noreferrer" className="flex h-24 w-32 shrink-0 flex-col items-center justify-center rounded bg-ground-50 text-sm font-semibold no-underline">
            <span className="rounded bg-clay-600 px-1.5 py-0.5 text-xs text-white">PDF</span>
            <span className="mt-1">Open document</span>
          </a>
        )}
        <div className="min-w-0 flex-1 text-sm">
          <StatusPill status={item.status} />
          <p className="mt-1 truncate text-ground-800" title={item.originalName ?? undefined}>{item.originalName ?? 'Unnamed file'}</p>
          <p className="text-xs text-ground-600">
            {formatBytes(item.sizeBytes)}
            {item.width && item.height ? ` · ${item.width}×${item.height}` : ''} · sent {formatDayTime(item.createdAt)}
          </p>
          <PhotoFlags item={item} />
          {item.status === 'rejected' && item.reason && <p className="mt-1 text-xs text-blocked">Reason given: “{item.reason}”</p>}
          <div className="mt-2 flex flex-wrap gap-2">
            {item.status !== 'accepted' && (
              <button type="button" className="btn min-h-[36px] bg-clear px-3 py-1 text-sm text-white hover:bg-clear/90" disabled={busy} onClick={accept}>
                {busy ? <SpinnerIcon className="h-4 w-4" /> : <CheckIcon className="h-4 w-4" />}Accept
              </button>
            )}
            {item.status !== 'rejected' && !rejecting && (
              <button type="button" className="btn-secondary min-h-[36px] px-3 py-1 text-sm" onClick={() => setRejecting(true)}>
                <StopIcon className="h-4 w-4" />Reject…
              </button>
            )}
          </div>
          {error && <p className="field-error" role="alert">{error}</p>}
        </div>
      </div>
      {rejecting && (
        <RejectForm
          item={item}
          onCancel={() => setRejecting(false)}
          onDone={(u) => {
            setRejecting(false);
            onReviewed(u);
          }}
        />
      )}
    </li>
  );
}

export function UploadReview({ caseId, checklist, refreshKey, onChanged }: Props) {
  const [items, setItems] = useState<UploadItem[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [open, setOpen] = useState<UploadItem | null>(null);
  useEffect(() => {
    let live = true;
    apiCall<{ items: UploadItem[] }>('GET', `/api/cases/${caseId}/uploads`).then((r) => {
      if (!live) return;
      if (r.ok) {
        setItems(r.data.items);
        setError(null);
      } else setError(r.error.message);
    });
    return () => {
      live = false;
    };
  }, [caseId, refreshKey]);

  const required = new Set(requiredUploadKinds(checklist as ChecklistAnswers));
  const shown = uploadKinds.filter((k) => required.has(k) || items?.some((i) => i.kind === k));
  const summaries = (items ?? []).map((i) => ({ kind: i.kind, status: i.status, reason: i.reason }));
  const waiting = (items ?? []).filter((i) => i.status === 'waiting').length;
  const flagged = (items ?? []).filter((i) => i.status === 'waiting' && i.quality && !i.quality.ok).length;

  function reviewed(updated: UploadItem) {
    setItems((list) => list?.map((i) => (i.id === updated.id ? updated : i)) ?? null);
    onChanged();
  }

  return (
    <section aria-labelledby="uploads-heading" className="card" id="uploads">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="uploads-heading" className="text-lg font-bold text-ground-900">Photos and documents</h2>
        {items && <p className="text-sm text-ground-700">{items.length} {items.length === 1 ? 'file' : 'files'}{waiting ? `, ${waiting} waiting for review` : ''}{flagged ? `, ${flagged} flagged by the photo check` : ''}</p>}
      </div>
      {error && <p className="field-error" role="alert">{error}</p>}
      {!items && !error && <p className="mt-2 flex items-center gap-2 text-sm text-ground-700"><SpinnerIcon className="h-4 w-4" />Loading files…</p>}
      {items && shown.length === 0 && <p className="mt-2 text-sm text-ground-700">No files yet, and none required by the answers so far.</p>}
      <div className="mt-2 divide-y divide-ground-100">
        {items &&
          shown.map((kind: UploadKind) => {
            const ofKind = items.filter((i) => i.kind === kind).reverse();
            const state = uploadKindStatus(kind, summaries).state;
            return (
              <div key={kind} className="py-3" data-testid={`upload-group-${kind}`}>
                <div className="flex flex-wrap items-center gap-2">
                  <h3 className="font-bold text-ground-900">{uploadKindInfo[kind].title}</h3>
                  {required.has(kind) && <span className="rounded bg-ground-100 px-1.5 py-0.5 text-xs font-semibold text-ground-800">Required</span>}
                  <span className={`inline-flex items-center gap-1 text-sm ${state === 'accepted' ? 'text-clear' : state === 'missing' ? 'text-ground-600' : state === 'rejected' ? 'text-blocked' : 'text-attention'}`}>
                    {state === 'accepted' ? <CheckIcon className="h-4 w-4" /> : state === 'missing' ? <CircleIcon className="h-4 w-4" /> : state === 'rejected' ? <StopIcon className="h-4 w-4" /> : <WarningIcon className="h-4 w-4" />}
                    {kindStateWords[state]}
                  </span>
                </div>
                <p className="flex items-start gap-1 text-xs text-ground-600"><InfoIcon className="h-3.5 w-3.5" />A good one shows: {uploadKindInfo[kind].hint}</p>
                {ofKind.length > 0 && (
                  <ul className="mt-2 grid gap-2 xl:grid-cols-2">
                    {ofKind.map((item) => (
                      <UploadCard key={item.id} item={item} onOpen={() => setOpen(item)} onReviewed={reviewed} />
                    ))}
                  </ul>
                )}
              </div>
            );
          })}
      </div>
      <Lightbox item={open} onClose={() => setOpen(null)} />
    </section>
  );
}
