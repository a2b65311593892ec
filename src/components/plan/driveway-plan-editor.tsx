// The driveway plan with saving: every change is sent about 800 ms after the last one, retried
// with backoff when the signal drops, and sent at once when the tab is hidden or closed.
import { useEffect, useRef, useState } from 'react';
import { CheckIcon, InfoIcon, SpinnerIcon, WarningIcon } from '@/components/icons';
import type { DrivewayPlan as PlanValue } from '@/lib/readiness/plan';
import type { ChargePort, ChargerPreference, ParkingHabit } from '@/lib/readiness/types';
import { DrivewayPlan, type PlanSettings } from './driveway-plan';
import { retryDelayMs, savePlan, type PlanCaseView } from './plan-save';
import { defaultPlan, readSavedPlan } from '@/lib/plan/plan-view';

export type DrivewayPlanEditorProps = {
  caseId: string;
  /** `checklist.charger.plan` as saved (any JSON); unreadable or missing starts from the default. */
  initialPlan: unknown;
  /** The case version the page was rendered from, sent as If-Match. */
  initialVersion: number;
  chargePort?: ChargePort | null;
  tetherMetres?: number | null;
  preference?: ChargerPreference | null;
  habit?: ParkingHabit | null;
  /** The parking step's number of cars. */
  cars?: number | null;
  settings?: Partial<PlanSettings>;
  /** False once the case can no longer be changed: the plan is shown, not edited. */
  editable?: boolean;
  /** Milliseconds after the last change before saving. */
  debounceMs?: number;
};

type Status =
  | { kind: 'unsaved' }
  | { kind: 'pending' }
  | { kind: 'saving' }
  | { kind: 'saved' }
  | { kind: 'retrying' }
  | { kind: 'invalid'; message: string }
  | { kind: 'signed-out' }
  | { kind: 'locked'; message: string };

type Answers = Pick<DrivewayPlanEditorProps, 'chargePort' | 'tetherMetres' | 'preference' | 'habit' | 'cars'>;

// A save is worth retrying at once after a conflict, but not forever if something keeps saving.
const MAX_QUICK_CONFLICTS = 3;

function answersOf(view: PlanCaseView): Answers {
  const { vehicle, charger, parking } = view.checklist ?? {};
  return {
    chargePort: vehicle?.chargePort ?? null,
    tetherMetres: charger?.tetherMetres ?? null,
    preference: charger?.preference ?? null,
    habit: parking?.habit ?? null,
    cars: parking?.cars ?? null,
  };
}

/**
 * The plan island for a case: draws, measures and saves.
 *
 * @example <DrivewayPlanEditor client:load caseId={row.id} initialPlan={row.checklist.charger?.plan} initialVersion={row.version} chargePort="front-left" />
 */
export function DrivewayPlanEditor({ caseId, initialPlan, initialVersion, settings, editable = true, debounceMs = 800, ...initialAnswers }: DrivewayPlanEditorProps) {
  const [plan, setPlan] = useState<PlanValue | null>(() => readSavedPlan(initialPlan));
  const [answers, setAnswers] = useState<Answers>(initialAnswers);
  const [status, setStatus] = useState<Status>(() => (!editable ? { kind: 'locked', message: 'This case can no longer be changed.' } : plan ? { kind: 'saved' } : { kind: 'unsaved' }));
  const state = useRef({ version: initialVersion, latest: plan, edits: 0, saved: 0, inFlight: false, failures: 0, conflicts: 0, timer: undefined as ReturnType<typeof setTimeout> | undefined });
  const readOnly = status.kind === 'locked';

  const schedule = (ms: number) => {
    clearTimeout(state.current.timer);
    state.current.timer = setTimeout(() => void flush(), ms);
  };

  async function flush(keepalive = false) {
    const s = state.current;
    clearTimeout(s.timer);
    if (s.inFlight || !s.latest || s.edits === s.saved) return;
    s.inFlight = true;
    const sending = s.edits;
    setStatus({ kind: 'saving' });
    const outcome = await savePlan(caseId, s.latest, s.version, keepalive);
    s.inFlight = false;
    if (outcome.kind === 'saved') {
      Object.assign(s, { version: outcome.view.version, saved: sending, failures: 0, conflicts: 0 });
      setAnswers(answersOf(outcome.view));
      if (s.edits === sending) setStatus({ kind: 'saved' });
      else schedule(debounceMs);
    } else if (outcome.kind === 'conflict') {
      // Saved elsewhere first (another tab or step): this page's plan is the newer intent, so
      // take the new version and the other answers, and send the plan again.
      s.version = outcome.current.version;
      setAnswers(answersOf(outcome.current));
      s.conflicts += 1;
      if (s.conflicts <= MAX_QUICK_CONFLICTS) schedule(0);
      else retryLater();
    } else if (outcome.kind === 'failed') {
      retryLater();
    } else if (outcome.kind === 'invalid') {
      setStatus({ kind: 'invalid', message: outcome.message });
    } else if (outcome.kind === 'locked') {
      setStatus({ kind: 'locked', message: outcome.message });
    } else {
      setStatus({ kind: 'signed-out' });
    }
  }

  function retryLater() {
    state.current.failures += 1;
    setStatus({ kind: 'retrying' });
    schedule(retryDelayMs(state.current.failures));
  }

  const change = (next: PlanValue) => {
    if (readOnly) return;
    const s = state.current;
    setPlan(next);
    s.latest = next;
    s.edits += 1;
    if (!s.inFlight) setStatus({ kind: 'pending' });
    schedule(debounceMs);
  };

  useEffect(() => {
    const leave = () => void flush(true);
    const hidden = () => document.visibilityState === 'hidden' && leave();
    const online = () => state.current.failures > 0 && void flush();
    window.addEventListener('pagehide', leave);
    document.addEventListener('visibilitychange', hidden);
    window.addEventListener('online', online);
    return () => {
      window.removeEventListener('pagehide', leave);
      document.removeEventListener('visibilitychange', hidden);
      window.removeEventListener('online', online);
      clearTimeout(state.current.timer);
    };
    // Listeners read everything from the ref, so they are added once.
  }, []);

  return (
    <div className="grid gap-3">
      {/* A slim bar that stays in view, so the save state is visible from any control. */}
      <div className="sticky top-0 z-20 -mx-4 flex min-h-[52px] items-center justify-between gap-3 border-b border-ground-100 bg-paper/95 px-4 py-1.5 backdrop-blur-sm">
        <span className="text-sm font-semibold text-ground-800">Your driveway plan</span>
        <SaveStatus status={status} onSaveNow={() => change(plan ?? defaultPlan())} />
      </div>
      <DrivewayPlan value={plan} onChange={change} {...answers} settings={settings} readOnly={readOnly} />
    </div>
  );
}

function SaveStatus({ status, onSaveNow }: { status: Status; onSaveNow: () => void }) {
  const box = 'flex max-w-full items-center gap-2 rounded-2xl border bg-white px-3 py-1.5 text-sm font-semibold shadow-sm';
  return (
    <div role="status" aria-live="polite" data-testid="plan-save-status" data-status={status.kind}>
      {status.kind === 'unsaved' && (
        <div className={`${box} border-ground-200 text-ground-800`}>
          <InfoIcon className="h-4 w-4" />
          <span>Not saved yet</span>
          <button type="button" className="rounded px-1 text-ground-700 underline underline-offset-2 hover:text-ground-900" onClick={onSaveNow}>
            Save as drawn
          </button>
        </div>
      )}
      {(status.kind === 'pending' || status.kind === 'saving') && (
        <div className={`${box} border-ground-200 text-ground-800`}>
          <SpinnerIcon className="h-4 w-4" />
          <span>Saving…</span>
        </div>
      )}
      {status.kind === 'saved' && (
        <div className={`${box} border-clear/30 text-clear`}>
          <CheckIcon className="h-4 w-4" />
          <span>Saved</span>
        </div>
      )}
      {status.kind === 'retrying' && (
        <div className={`${box} border-attention/40 bg-attention-soft text-attention`}>
          <WarningIcon className="h-4 w-4" />
          <span>Not saved — retrying</span>
        </div>
      )}
      {status.kind === 'invalid' && (
        <div className={`${box} border-blocked/30 bg-blocked-soft text-blocked`}>
          <WarningIcon className="h-4 w-4" />
          <span>Not saved — {status.message}</span>
        </div>
      )}
      {status.kind === 'signed-out' && (
        <div className={`${box} border-blocked/30 bg-blocked-soft text-blocked`}>
          <WarningIcon className="h-4 w-4" />
          <span>
            Not saved — <a href={`/signin?callbackUrl=${encodeURIComponent(typeof location === 'undefined' ? '/my' : location.pathname)}`}>please sign in again</a>
          </span>
        </div>
      )}
      {status.kind === 'locked' && (
        <div className={`${box} border-ground-200 text-ground-800`}>
          <InfoIcon className="h-4 w-4" />
          <span>{status.message}</span>
        </div>
      )}
    </div>
  );
}
