// One case for the office: header with stage and light, stage moves and chase, every check with
// its figures, the answers, the uploads to review, and notes, e-mails and history beside them.
import { gapWords } from '@/lib/vocabulary/pack';
import { useCallback, useEffect, useState } from 'react';
import type { UploadItem, UploadKind } from '@/lib/schemas/uploads';
import { SendIcon, SpinnerIcon } from '@/components/icons';
import { apiCall } from './api';
import { CaseAnswers } from './case-answers';
import { AuditPanel, MessagesPanel, NotesPanel } from './case-records';
import type { CasePeople, OfficeCaseView, Readiness, StaffMember, VehicleLookupInfo } from './case-types';
import { formatDay, formatDayTime, plural } from './format';
import { LightBadge } from '@/components/readiness/light-badge';
import { ReadinessPanel } from './readiness-panel';
import { SiteMeasuresForm } from './site-measures-form';
import { StageActions } from './stage-actions';
import { StagePill } from './stage-pill';
import { UploadReview } from './upload-review';
import { checkUkPhone } from '@/lib/validation/phone';

type Props = { initial: OfficeCaseView; people: CasePeople; surveyors: StaffMember[]; vehicleLookup: VehicleLookupInfo };
type ChaseAnswer = { sent: boolean; items: string[]; text?: { sent: boolean; reason?: string } };

/** The customer's text consent in one line, with when they gave or withdrew it. */
function textConsentWords(t: CasePeople['texts']): string {
  const phone = t.mobile ? checkUkPhone(t.mobile) : null;
  const number = phone?.ok ? phone.display : (t.mobile ?? '');
  if (t.consented) return `Texts: agreed ${formatDayTime(t.consentedAt)}, to ${number}`;
  if (t.withdrawnAt) return `Texts: stopped ${formatDayTime(t.withdrawnAt)}`;
  return 'Texts: not agreed (e-mail only)';
}

function ChaseButton({ caseId, onSent }: { caseId: string; onSent(): void }) {
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ ok: boolean; text: string; items: string[] } | null>(null);
  async function chase() {
    setBusy(true);
    const r = await apiCall<ChaseAnswer>('POST', `/api/cases/${caseId}/chase`);
    setBusy(false);
    if (r.ok) {
      const byText = r.data.text?.sent ? ' and a text' : '';
      setMessage({ ok: true, text: `Chase e-mail${byText} sent, listing ${plural(r.data.items.length, 'item')}:`, items: r.data.items });
      onSent();
    } else setMessage({ ok: false, text: r.error.message, items: [] });
  }
  return (
    <div>
      <button type="button" className="btn-secondary min-h-[40px] px-4 py-2 text-sm" disabled={busy} onClick={chase}>
        {busy ? <SpinnerIcon className="h-4 w-4" /> : <SendIcon className="h-4 w-4" />}Chase the customer
      </button>
      {message && (
        <div role="status" className={`mt-2 rounded-md border px-3 py-2 text-sm ${message.ok ? 'border-clear/30 bg-clear-soft' : 'border-attention/30 bg-attention-soft'}`} data-testid="chase-message">
          <p className="font-semibold">{message.text}</p>
          {message.items.length > 0 && <ul className="list-disc pl-5">{message.items.map((i) => <li key={i}>{i}</li>)}</ul>}
        </div>
      )}
    </div>
  );
}

const changeWords: Record<string, string> = { answers: 'changed answers', upload_added: 'sent a file', upload_removed: 'removed a file' };

export default function CaseWorkspace({ initial, people, surveyors, vehicleLookup }: Props) {
  const [view, setView] = useState(initial);
  const [readiness, setReadiness] = useState<Readiness>({ light: initial.readiness.light, gapCount: initial.readiness.gapCount, checks: initial.readiness.checks });
  const [surveyor, setSurveyor] = useState(people.surveyor);
  const [refreshKey, setRefreshKey] = useState(0);
  const [uploadKinds, setUploadKinds] = useState<Record<string, UploadKind>>({});
  const caseId = view.id;

  // Readiness is worked out afresh (timing depends on today), after every change here.
  useEffect(() => {
    let live = true;
    apiCall<Readiness>('GET', `/api/cases/${caseId}/readiness`).then((r) => {
      if (live && r.ok) setReadiness(r.data);
    });
    return () => {
      live = false;
    };
  }, [caseId, refreshKey]);

  // The history names uploads only by id; the kinds come from the uploads list.
  useEffect(() => {
    apiCall<{ items: UploadItem[] }>('GET', `/api/cases/${caseId}/uploads`).then((r) => {
      if (r.ok) setUploadKinds(Object.fromEntries(r.data.items.map((i) => [i.id, i.kind])));
    });
  }, [caseId, refreshKey]);

  const refresh = useCallback(() => setRefreshKey((k) => k + 1), []);

  const address = [view.address.addressLine1, view.address.addressLine2, view.address.town, view.address.postcode].filter(Boolean).join(', ');
  const customerName = people.customer.name || people.customer.email;
  const phone = people.customer.phone ? checkUkPhone(people.customer.phone) : null;
  const staffNames = Object.fromEntries(surveyors.map((s) => [s.id, s.name ?? s.email]));

  return (
    <div className="space-y-4">
      <header className="card">
        <div className="flex flex-wrap items-start justify-between gap-4">
          <div className="min-w-0">
            <p className="font-mono text-sm font-semibold text-clay-700">Case {view.reference}</p>
            <h1 className="text-2xl font-bold text-ground-900 sm:text-3xl" data-testid="case-heading">{customerName}</h1>
            <p className="text-ground-800">{address || 'No address given yet'}</p>
            <p className="text-sm text-ground-700">
              <a href={`mailto:${people.customer.email}`} className="break-all">{people.customer.email}</a>
              {people.customer.phone && <> · <a href={`tel:${people.customer.phone}`}>{phone?.ok ? phone.display : people.customer.phone}</a></>}
            </p>
            {people.texts.enabled && <p className="text-sm text-ground-700" data-testid="text-consent">{textConsentWords(people.texts)}</p>}
          </div>
          <dl className="grid grid-cols-[auto_auto] items-center gap-x-3 gap-y-1.5 text-sm">
            <dt className="text-ground-700">Stage</dt>
            <dd data-testid="case-stage"><StagePill stage={view.stage} /></dd>
            <dt className="text-ground-700">Readiness</dt>
            <dd data-testid="case-light" className="flex flex-wrap items-center gap-2">
              <LightBadge light={readiness.light} />
              <span className="text-ground-700">{readiness.gapCount === 0 ? 'no open checks' : gapWords.staffOpen(readiness.gapCount)}</span>
            </dd>
            <dt className="text-ground-700">Surveyor</dt>
            <dd>{surveyor ? `${surveyor.name ?? 'Assigned'}${view.surveyDate ? `, ${formatDay(view.surveyDate)}` : ''}` : <span className="text-ground-600">Not assigned</span>}</dd>
            <dt className="text-ground-700">Invited</dt>
            <dd>{formatDay(people.invitedAt)}{view.submittedAt ? ` · sent for review ${formatDay(view.submittedAt)}` : ''}</dd>
          </dl>
        </div>
        <div className="mt-4 flex flex-col gap-3 border-t border-ground-100 pt-4 lg:flex-row lg:items-start lg:justify-between">
          <StageActions
            caseId={caseId}
            stage={view.stage}
            surveyors={surveyors}
            onMoved={(next, chosen) => {
              setView(next);
              if (chosen) setSurveyor({ id: chosen.id, name: chosen.name });
              refresh();
            }}
          />
          <div className="flex flex-wrap items-start gap-2">
            <ChaseButton caseId={caseId} onSent={refresh} />
            <a href={`/surveys/cases/${caseId}`} className="btn-secondary min-h-[40px] px-4 py-2 text-sm">
              Survey pack
            </a>
          </div>
        </div>
        <nav aria-label="On this page" className="mt-4 flex flex-wrap gap-x-4 gap-y-1 border-t border-ground-100 pt-3 text-sm">
          <a href="#checks">Checks</a>
          <a href="#answers">Answers</a>
          <a href="#uploads">Photos and documents</a>
          <a href="#notes">Notes</a>
          <a href="#messages">Messages</a>
          <a href="#history">History</a>
          <span className="ml-auto text-xs text-ground-600">Last change {formatDayTime(view.updatedAt)}</span>
        </nav>
      </header>
      {view.changedSinceReady && (
        <section className="card border-l-4 border-clay-600" data-testid="changed-since-ready" aria-labelledby="changed-heading">
          <h2 id="changed-heading" className="text-lg font-bold text-ground-900">Changed since it was marked ready</h2>
          <p className="text-sm text-ground-700">
            The customer changed these after the case was marked ready for survey. Look at the checks again before booking.
          </p>
          <ul className="mt-2 list-disc pl-5 text-ground-800">
            {view.changedSinceReady.changes.map((c) => (
              <li key={`${c.at}-${c.detail}`}>
                {new Date(c.at).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: 'Europe/London' })}: {changeWords[c.what] ?? c.what} — {c.detail}
              </li>
            ))}
          </ul>
        </section>
      )}

      <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="min-w-0 space-y-4">
          <ReadinessPanel checks={readiness.checks} />
          <UploadReview caseId={caseId} checklist={view.checklist} refreshKey={refreshKey} onChanged={refresh} />
          <CaseAnswers checklist={view.checklist} progress={view.progress} warnings={view.warnings} vehicleLookup={vehicleLookup} />
        </div>
        <div className="min-w-0 space-y-4">
          <SiteMeasuresForm caseId={caseId} initial={view.siteMeasures ?? {}} onSaved={(siteMeasures) => { setView((v) => ({ ...v, siteMeasures })); refresh(); }} />
          <NotesPanel caseId={caseId} refreshKey={refreshKey} onAdded={refresh} />
          <MessagesPanel caseId={caseId} refreshKey={refreshKey} />
          <AuditPanel caseId={caseId} refreshKey={refreshKey} uploadKindById={uploadKinds} staffNames={staffNames} />
        </div>
      </div>
    </div>
  );
}
