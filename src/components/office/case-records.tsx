// The case's side column: office notes (list and add), the e-mails sent, and the audit trail.
import { useEffect, useId, useState, type FormEvent } from 'react';
import type { UploadKind } from '@/lib/schemas/uploads';
import { SpinnerIcon } from '@/components/icons';
import { apiCall } from './api';
import { actorWords, describeAudit } from './audit-words';
import type { AuditItem, MessageItem, NoteItem } from './case-types';
import { checkUkPhone } from '@/lib/validation/phone';
import { formatDayTime } from './format';

/** Loads `{ items }` from a case's sub-resource, again whenever refreshKey changes. */
function useItems<T>(url: string, refreshKey: number) {
  const [items, setItems] = useState<T[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => {
    let live = true;
    apiCall<{ items: T[] }>('GET', url).then((r) => {
      if (!live) return;
      if (r.ok) {
        setItems(r.data.items);
        setError(null);
      } else setError(r.error.message);
    });
    return () => {
      live = false;
    };
  }, [url, refreshKey]);
  return { items, setItems, error };
}

function Loading({ what }: { what: string }) {
  return <p className="flex items-center gap-2 text-sm text-ground-700"><SpinnerIcon className="h-4 w-4" />Loading {what}…</p>;
}

export function NotesPanel({ caseId, refreshKey, onAdded }: { caseId: string; refreshKey: number; onAdded(): void }) {
  const id = useId();
  const { items, setItems, error } = useItems<NoteItem>(`/api/cases/${caseId}/notes`, refreshKey);
  const [body, setBody] = useState('');
  const [sendError, setSendError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function add(e: FormEvent) {
    e.preventDefault();
    if (!body.trim()) {
      setSendError('Write a note first.');
      return;
    }
    setBusy(true);
    const r = await apiCall<NoteItem>('POST', `/api/cases/${caseId}/notes`, { body });
    setBusy(false);
    if (!r.ok) {
      setSendError(r.error.fields?.body ?? r.error.message);
      return;
    }
    setItems((list) => [...(list ?? []), r.data]);
    setBody('');
    setSendError(null);
    onAdded();
  }
  return (
    <section aria-labelledby="notes-heading" className="card" id="notes">
      <h2 id="notes-heading" className="text-lg font-bold text-ground-900">Notes</h2>
      {error && <p className="field-error">{error}</p>}
      {!items && !error && <Loading what="notes" />}
      {items && items.length === 0 && <p className="text-sm text-ground-700">No notes yet. Notes are for the office and the surveyor; the customer never sees them.</p>}
      {items && items.length > 0 && (
        <ol className="mt-2 space-y-3" data-testid="notes">
          {items.map((n) => (
            <li key={n.id} className="rounded-md bg-paper p-2 text-sm">
              <p className="whitespace-pre-wrap text-ink">{n.body}</p>
              <p className="mt-1 text-xs text-ground-600">{n.authorName ?? 'Staff'} · {formatDayTime(n.createdAt)}</p>
            </li>
          ))}
        </ol>
      )}
      <form method="post" onSubmit={add} className="mt-3" noValidate>
        <label htmlFor={`${id}-note`} className="field-label text-sm">Add a note</label>
        <textarea
          id={`${id}-note`}
          className="field-input min-h-[72px] text-sm"
          value={body}
          maxLength={5000}
          aria-invalid={!!sendError}
          aria-describedby={sendError ? `${id}-note-error` : undefined}
          onChange={(e) => setBody(e.target.value)}
        />
        {sendError && <p id={`${id}-note-error`} className="field-error">{sendError}</p>}
        <button type="submit" className="btn-secondary mt-2 min-h-[36px] px-3 py-1.5 text-sm" disabled={busy}>
          {busy && <SpinnerIcon className="h-4 w-4" />}Add note
        </button>
      </form>
    </section>
  );
}

const messageKindWords: Record<string, string> = {
  invitation: 'Invitation',
  chase: 'Chase',
  reminder: 'Automatic reminder',
  rejection: 'Upload rejected',
  survey_booked: 'Survey booked',
  stop: 'Reply: STOP',
  reply: 'Reply',
};

// The provider's delivery states in the office's words; an e-mail is logged once it has gone.
const statusWords: Record<string, { text: string; tone: string }> = {
  sent: { text: 'Sent', tone: 'text-ground-700' },
  queued: { text: 'Sending', tone: 'text-ground-700' },
  submitted: { text: 'With the network', tone: 'text-ground-700' },
  delivered: { text: 'Delivered', tone: 'text-clear' },
  failed: { text: 'Not delivered', tone: 'text-blocked' },
  rejected: { text: 'Refused by the network', tone: 'text-blocked' },
  expired: { text: 'Not delivered (phone unreachable)', tone: 'text-blocked' },
  received: { text: 'Received', tone: 'text-ground-700' },
};

function displayNumber(e164: string): string {
  const phone = checkUkPhone(e164);
  return phone.ok ? phone.display : e164;
}

/** E-mails and texts about the case, newest first, each with its status. */
export function MessagesPanel({ caseId, refreshKey }: { caseId: string; refreshKey: number }) {
  const { items, error } = useItems<MessageItem>(`/api/cases/${caseId}/messages`, refreshKey);
  return (
    <section aria-labelledby="messages-heading" className="card" id="messages">
      <h2 id="messages-heading" className="text-lg font-bold text-ground-900">Messages</h2>
      <p className="text-xs text-ground-600">E-mails and texts to and from the customer.</p>
      {error && <p className="field-error">{error}</p>}
      {!items && !error && <Loading what="messages" />}
      {items && items.length === 0 && <p className="text-sm text-ground-700">No messages yet.</p>}
      {items && items.length > 0 && (
        <ul className="mt-2 divide-y divide-ground-100" data-testid="messages">
          {items.map((m) => {
            const status = statusWords[m.status] ?? { text: m.status, tone: 'text-ground-700' };
            const who = m.channel === 'email' ? m.to : displayNumber(m.to);
            return (
              <li key={`${m.channel}-${m.id}`} className="py-2" data-testid={`message-${m.channel}`}>
                <details>
                  <summary className="cursor-pointer text-sm">
                    <span className="mr-1.5 rounded bg-clay-100 px-1.5 py-0.5 text-xs font-semibold text-clay-800">{m.channel === 'email' ? 'E-mail' : 'Text'}</span>
                    <span className="mr-2 rounded bg-ground-100 px-1.5 py-0.5 text-xs font-semibold text-ground-800">{messageKindWords[m.kind] ?? m.kind}</span>
                    <span className="font-semibold text-ink">{m.subject ?? (m.text.length > 70 ? `${m.text.slice(0, 70)}…` : m.text)}</span>
                    <span className="block text-xs text-ground-600">
                      {m.direction === 'inbound' ? `From ${who}` : `To ${who}`} · {formatDayTime(m.createdAt)}
                      {m.direction === 'outbound' ? (m.sentByName ? ` · by ${m.sentByName}` : ' · automatic') : ''}
                    </span>
                    <span className={`block text-xs font-semibold ${status.tone}`} data-testid="message-status">
                      {status.text}{m.statusDetail ? ` (${m.statusDetail})` : ''}{m.statusAt && m.status !== 'sent' ? ` · ${formatDayTime(m.statusAt)}` : ''}
                    </span>
                  </summary>
                  <pre className="mt-2 max-h-72 overflow-auto whitespace-pre-wrap rounded bg-paper p-2 font-sans text-xs text-ink">{m.text}</pre>
                </details>
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
}

export function AuditPanel({ caseId, refreshKey, uploadKindById, staffNames }: { caseId: string; refreshKey: number; uploadKindById: Record<string, UploadKind>; staffNames: Record<string, string> }) {
  const { items, error } = useItems<AuditItem>(`/api/cases/${caseId}/audit`, refreshKey);
  const [showAll, setShowAll] = useState(false);
  const shown = showAll ? items : items?.slice(0, 15);
  return (
    <section aria-labelledby="audit-heading" className="card" id="history">
      <h2 id="audit-heading" className="text-lg font-bold text-ground-900">History</h2>
      {error && <p className="field-error">{error}</p>}
      {!items && !error && <Loading what="the history" />}
      {shown && (
        <ol className="mt-2 space-y-2 text-sm" data-testid="audit">
          {shown.map((a) => {
            const s = describeAudit(a, uploadKindById, staffNames);
            return (
              <li key={a.id} className="border-l-2 border-ground-200 pl-2">
                <p><span className="font-semibold">{actorWords(a)}</span> {s.text}</p>
                {s.details.length > 0 && (
                  <ul className="list-disc pl-5 text-xs text-ground-800">{s.details.map((d, i) => <li key={i}>{d}</li>)}</ul>
                )}
                <p className="text-xs text-ground-600"><time dateTime={a.at}>{formatDayTime(a.at)}</time></p>
              </li>
            );
          })}
        </ol>
      )}
      {items && items.length > 15 && (
        <button type="button" className="mt-2 text-sm font-semibold text-ground-700 underline" onClick={() => setShowAll((v) => !v)}>
          {showAll ? 'Show the latest 15' : `Show all ${items.length} entries`}
        </button>
      )}
    </section>
  );
}
