// Moving a case along: only the moves allowed from its stage are offered. "Ready for survey"
// with red checks asks for a written override; "Survey booked" asks for a surveyor and a date.
import { useId, useState } from 'react';
import { allowedMoves, stageLabels, type StageId } from '@/lib/stages';
import { ChevronRightIcon, SpinnerIcon, StopIcon } from '@/components/icons';
import { apiCall, type ApiError } from './api';
import type { OfficeCaseView, StaffMember } from './case-types';
import { todayIso } from './format';

type Props = { caseId: string; stage: StageId; surveyors: StaffMember[]; onMoved(view: OfficeCaseView, surveyor?: StaffMember): void };
type RedCheck = { id: string; title: string; staffText: string };

const moveWords: Partial<Record<StageId, string>> = {
  filling_in: 'Mark as filling in',
  sent_for_review: 'Mark as sent for review',
  in_review: 'Start the review',
  ready_for_survey: 'Mark ready for survey',
  survey_booked: 'Book the survey',
  surveyed: 'Mark as surveyed',
};

type Open = null | 'book' | 'withdraw' | { override: RedCheck[] };

export function StageActions({ caseId, stage, surveyors, onMoved }: Props) {
  const id = useId();
  const moves = allowedMoves(stage);
  const [open, setOpen] = useState<Open>(null);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<ApiError | null>(null);
  const [surveyorId, setSurveyorId] = useState('');
  const [surveyDate, setSurveyDate] = useState('');
  const [reason, setReason] = useState('');

  async function move(to: StageId, extra: Record<string, string> = {}) {
    setBusy(true);
    setError(null);
    const r = await apiCall<OfficeCaseView>('POST', `/api/cases/${caseId}/stage`, { to, ...extra });
    setBusy(false);
    if (r.ok) {
      setOpen(null);
      setReason('');
      onMoved(r.data, surveyors.find((s) => s.id === extra.surveyorId));
      return;
    }
    const red = r.error.red as RedCheck[] | undefined;
    if (r.status === 409 && red && !extra.overrideReason) {
      setOpen({ override: red });
      return;
    }
    setError(r.error);
  }

  function start(to: StageId) {
    setError(null);
    if (to === 'survey_booked') setOpen('book');
    else if (to === 'withdrawn') setOpen('withdraw');
    else void move(to);
  }

  if (moves.length === 0) return <p className="text-sm text-ground-700">This case is closed: no further moves.</p>;
  const forward = moves.filter((m) => m !== 'withdrawn');
  const fieldError = (k: string) => error?.fields?.[k];

  return (
    <div className="space-y-3" data-testid="stage-actions">
      <div className="flex flex-wrap gap-2">
        {forward.map((to) => (
          <button key={to} type="button" className="btn-primary min-h-[40px] px-4 py-2 text-sm" disabled={busy || open !== null} onClick={() => start(to)}>
            {busy && open === null ? <SpinnerIcon className="h-4 w-4" /> : <ChevronRightIcon className="h-4 w-4" />}
            {moveWords[to] ?? `Move to ${stageLabels[to]}`}
          </button>
        ))}
        {moves.includes('withdrawn') && (
          <button type="button" className="btn-secondary min-h-[40px] px-4 py-2 text-sm" disabled={busy || open !== null} onClick={() => start('withdrawn')}>
            Withdraw case…
          </button>
        )}
      </div>

      {open === 'book' && (
        <form
          className="grid gap-3 rounded-md border border-ground-200 bg-paper p-3 sm:grid-cols-[1fr_12rem_auto] sm:items-end"
          onSubmit={(e) => {
            e.preventDefault();
            void move('survey_booked', { ...(surveyorId ? { surveyorId } : {}), ...(surveyDate ? { surveyDate } : {}) });
          }}
          noValidate
          data-testid="book-survey"
        >
          <div>
            <label htmlFor={`${id}-surveyor`} className="field-label text-sm">Surveyor</label>
            <select id={`${id}-surveyor`} className="field-input" value={surveyorId} onChange={(e) => setSurveyorId(e.target.value)} aria-invalid={!!fieldError('surveyorId')}>
              <option value="">Choose a surveyor</option>
              {surveyors.map((s) => <option key={s.id} value={s.id}>{s.name ?? s.email}</option>)}
            </select>
            {fieldError('surveyorId') && <p className="field-error">{fieldError('surveyorId')}</p>}
          </div>
          <div>
            <label htmlFor={`${id}-date`} className="field-label text-sm">Survey date</label>
            <input id={`${id}-date`} type="date" className="field-input" min={todayIso()} value={surveyDate} onChange={(e) => setSurveyDate(e.target.value)} aria-invalid={!!fieldError('surveyDate')} />
            {fieldError('surveyDate') && <p className="field-error">{fieldError('surveyDate')}</p>}
          </div>
          <div className="flex gap-2">
            <button type="submit" className="btn-primary min-h-[44px] px-4 text-sm" disabled={busy}>{busy && <SpinnerIcon className="h-4 w-4" />}Book survey</button>
            <button type="button" className="btn-secondary min-h-[44px] px-4 text-sm" onClick={() => setOpen(null)}>Cancel</button>
          </div>
          <p className="text-xs text-ground-700 sm:col-span-3">The customer is e-mailed the date and the surveyor’s name.</p>
        </form>
      )}

      {open === 'withdraw' && (
        <div className="rounded-md border border-ground-200 bg-paper p-3 text-sm">
          <p className="font-semibold">Withdraw this case?</p>
          <p className="text-ground-800">It leaves the working queue and can no longer move on. Reminders stop. Add a note saying why.</p>
          <div className="mt-2 flex gap-2">
            <button type="button" className="btn-primary min-h-[40px] px-4 text-sm" disabled={busy} onClick={() => void move('withdrawn')}>Withdraw</button>
            <button type="button" className="btn-secondary min-h-[40px] px-4 text-sm" onClick={() => setOpen(null)}>Keep it open</button>
          </div>
        </div>
      )}

      {open !== null && typeof open === 'object' && (
        <form
          className="rounded-md border border-blocked/30 bg-blocked-soft/60 p-3 text-sm"
          onSubmit={(e) => {
            e.preventDefault();
            void move('ready_for_survey', { overrideReason: reason });
          }}
          noValidate
          data-testid="override"
        >
          <p className="flex items-center gap-2 font-semibold text-blocked"><StopIcon className="h-5 w-5" />These checks are red</p>
          <ul className="mt-1 list-disc pl-5">
            {open.override.map((c) => <li key={c.id}><span className="font-semibold">{c.title}:</span> {c.staffText}</li>)}
          </ul>
          <label htmlFor={`${id}-override`} className="field-label mt-3 text-sm">Reason for marking it ready anyway</label>
          <textarea
            id={`${id}-override`}
            className="field-input min-h-[72px] text-sm"
            value={reason}
            onChange={(e) => setReason(e.target.value)}
            aria-invalid={!!fieldError('overrideReason')}
            aria-describedby={`${id}-override-help`}
          />
          <p id={`${id}-override-help`} className="field-help text-xs">At least 10 characters. It is kept in the case history.</p>
          {fieldError('overrideReason') && <p className="field-error">{fieldError('overrideReason')}</p>}
          <div className="mt-2 flex gap-2">
            <button type="submit" className="btn-primary min-h-[40px] px-4 text-sm" disabled={busy}>Override and mark ready</button>
            <button type="button" className="btn-secondary min-h-[40px] px-4 text-sm" onClick={() => setOpen(null)}>Cancel</button>
          </div>
        </form>
      )}

      {error && !error.fields && (
        <p role="alert" className="flex items-start gap-2 rounded-md border border-blocked/30 bg-blocked-soft px-3 py-2 text-sm text-blocked">
          <StopIcon className="mt-0.5 h-4 w-4" />{error.message}
        </p>
      )}
      {error?.fields && open === null && <p role="alert" className="field-error">{Object.values(error.fields).join(' ')}</p>}
    </div>
  );
}
