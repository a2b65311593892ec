// The customer's checklist island: loads the case, shows one step at a time (the step lives in
// the URL hash, so a reload stays put), and saves every answer as the customer goes.
import { useCallback, useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { customerStage } from '@/lib/vocabulary/stages';
import { ChevronLeftIcon, ChevronRightIcon, InfoIcon, SpinnerIcon, StopIcon, WarningIcon } from '../icons';
import { loadCase, patchChecklist, type CaseView, type LoadOutcome } from './api-client';
import { AutosaveQueue, type QueueListener, type SaveStatus } from './autosave-queue';
import { ChecklistCtx, fieldId, type ChecklistContext } from './checklist-context';
import { fieldByPath, fieldDefs } from './field-defs';
import { checklistToForm, formSchema, fromApiValue, type FormValues } from './form-values';
import { localChecklist, progressOf, stepFromHash, stepHash, steps, type StepId } from './progress';
import { SaveStatusLine } from './save-status';
import { StepList } from './step-list';
import { AboutStep } from './step-about';
import { VehicleStep } from './step-vehicle';
import { SupplyStep } from './step-supply';
import { ParkingStep } from './step-parking';
import { ChargerStep } from './step-charger';
import { isSent, ReviewStep } from './step-review';

type Props = { caseId: string };

const intros: Record<StepId, string> = {
  about: 'Who we’re talking to, and the home the charge point is for.',
  vehicle: 'The car decides the plug and how far the cable must reach. If it hasn’t arrived yet, answer from your order.',
  supply: 'A few details about the electricity coming into your home. Most are on a bill, or can be read by looking — never touching — at the meter and consumer unit.',
  parking: 'Where the car will stand while it charges.',
  charger: 'Where you’d like the charge point and how a cable could reach it. Rough answers are fine: your installer checks everything at the survey.',
  review: 'Check your answers, fill any gaps you can, then send them to your installer.',
};

/** The island: fetches the case, then hands it to the form. @example <ChecklistApp caseId={id} client:only="react" /> */
export default function ChecklistApp({ caseId }: Props) {
  const [load, setLoad] = useState<LoadOutcome | { kind: 'loading' }>({ kind: 'loading' });
  const fetchCase = useCallback(async () => {
    setLoad({ kind: 'loading' });
    setLoad(await loadCase(caseId));
  }, [caseId]);
  useEffect(() => void fetchCase(), [fetchCase]);

  if (load.kind === 'loaded') return <ChecklistForm initialView={load.view} />;
  return <LoadState state={load} retry={() => void fetchCase()} />;
}

function LoadState({ state, retry }: { state: Exclude<LoadOutcome, { kind: 'loaded' }> | { kind: 'loading' }; retry(): void }) {
  if (state.kind === 'loading') {
    return (
      <p className="card flex items-center gap-2" role="status">
        <SpinnerIcon /> Loading your checklist…
      </p>
    );
  }
  const words = {
    'not-found': ['We couldn’t find that checklist', 'It may have been closed, or it isn’t yours to see.'],
    'signed-out': ['Please sign in again', 'Your sign-in has run out. Your saved answers are safe.'],
    failed: ['We couldn’t load your checklist', 'Please check your connection and try again.'],
  }[state.kind];
  return (
    <div className="card" role="alert">
      <h2 className="flex items-center gap-2 text-xl font-bold">
        <StopIcon className="h-6 w-6 text-blocked" /> {words[0]}
      </h2>
      <p className="mt-2">{words[1]}</p>
      <div className="mt-4">
        {state.kind === 'failed' && (
          <button type="button" className="btn-primary" onClick={retry}>
            Try again
          </button>
        )}
        {state.kind === 'signed-out' && (
          <a className="btn-primary" href={`/signin?callbackUrl=${encodeURIComponent(window.location.pathname)}`}>
            Sign in
          </a>
        )}
        {state.kind === 'not-found' && (
          <a className="btn-primary" href="/my">
            Go to my home
          </a>
        )}
      </div>
    </div>
  );
}

type Notice = { tone: 'info' | 'attention' | 'blocked'; body: ReactNode };

// The first step with something missing, so a returning customer lands where they left off.
function resumeStep(view: CaseView): StepId {
  return view.progress.find((p) => !p.complete)?.id ?? 'review';
}

function useHashStep(view: CaseView): StepId {
  const [step, setStep] = useState<StepId>(() => stepFromHash(window.location.hash) ?? resumeStep(view));
  useEffect(() => {
    const onHash = () => setStep(stepFromHash(window.location.hash) ?? 'about');
    window.addEventListener('hashchange', onHash);
    if (!stepFromHash(window.location.hash)) window.history.replaceState(null, '', stepHash(step));
    return () => window.removeEventListener('hashchange', onHash);
    // Runs once on purpose: after the first render the step comes from the hash alone.
  }, []);
  return step;
}

function ChecklistForm({ initialView }: { initialView: CaseView }) {
  const [view, setViewState] = useState(initialView);
  const viewRef = useRef(initialView);
  const setView = useCallback((next: CaseView) => {
    viewRef.current = next;
    setViewState(next);
  }, []);
  const [status, setStatus] = useState<SaveStatus>({ kind: 'idle' });
  const [notice, setNotice] = useState<Notice | null>(null);
  const step = useHashStep(initialView);
  const heading = useRef<HTMLHeadingElement>(null);
  const top = useRef<HTMLDivElement>(null);
  const form = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    mode: 'onTouched',
    defaultValues: checklistToForm(initialView.checklist),
  });

  // Loads the server's newer answers into every field the customer has not changed here.
  const applyNewer = useCallback(
    (current: CaseView, kept: string[]) => {
      const before = viewRef.current;
      const loaded: string[] = [];
      for (const def of fieldDefs) {
        if (kept.includes(def.path)) continue;
        const value = fromApiValue(def, current.checklist);
        if (form.getValues(def.path) !== value) {
          form.setValue(def.path, value);
          loaded.push(def.label);
        }
      }
      const overlap = kept.filter((path) => {
        const def = fieldByPath[path];
        return def && fromApiValue(def, current.checklist) !== fromApiValue(def, before.checklist);
      });
      setView(current);
      if (loaded.length === 0 && overlap.length === 0) return;
      setNotice({
        tone: 'attention',
        body: (
          <>
            <p className="font-semibold">These answers were changed on another device or tab — we’ve loaded the newer ones.</p>
            {loaded.length > 0 && <p className="mt-1">Updated here: {loaded.join(', ')}.</p>}
            {overlap.length > 0 && (
              <p className="mt-1">
                You had also changed {overlap.map((p) => fieldByPath[p]!.label).join(', ')} here, so we kept your answer from this tab.
              </p>
            )}
          </>
        ),
      });
    },
    [form, setView],
  );

  const queue = useMemo(() => {
    const listener: QueueListener = {
      status: setStatus,
      saved(saved, paths) {
        setView(saved);
        // Show the server's tidy form of each saved answer, except in the field being typed in.
        for (const path of paths) {
          const def = fieldByPath[path];
          if (!def || document.activeElement?.id === fieldId(path)) continue;
          const value = fromApiValue(def, saved.checklist);
          if (form.getValues(path) !== value) form.setValue(path, value);
        }
      },
      conflict: (current, kept) => applyNewer(current, kept),
      invalid(fields) {
        for (const [path, message] of Object.entries(fields)) {
          if (fieldByPath[path]) form.setError(path, { type: 'server', message });
        }
      },
      locked(message) {
        setView({ ...viewRef.current, editable: false });
        setNotice({ tone: 'blocked', body: <p>{message}</p> });
      },
    };
    return new AutosaveQueue({
      caseId: initialView.id,
      version: initialView.version,
      transport: (patch, version) => patchChecklist(initialView.id, patch, version),
      listener,
    });
  }, [initialView, form, setView, applyNewer]);

  // Puts back answers typed in an earlier visit that never reached the server, then sends them.
  useEffect(() => {
    const restored = queue.restore();
    const paths = Object.keys(restored).filter((path) => fieldByPath[path]);
    for (const path of paths) form.setValue(path, restored[path], { shouldDirty: true });
    if (paths.length > 0) {
      void form.trigger(paths);
      setNotice({
        tone: 'info',
        body: <p>We’ve put back {paths.length === 1 ? 'an answer' : `${paths.length} answers`} you typed earlier that hadn’t been saved yet, and we’re saving {paths.length === 1 ? 'it' : 'them'} now.</p>,
      });
      void queue.flush();
    }
    return () => queue.dispose();
  }, [queue, form]);

  // Retry as soon as the signal is back; save before the tab is hidden; catch up on return.
  useEffect(() => {
    const online = () => queue.retryNow();
    const visibility = async () => {
      if (document.visibilityState === 'hidden') return void queue.flush();
      if (queue.busy()) return;
      const fresh = await loadCase(initialView.id);
      if (fresh.kind === 'loaded' && fresh.view.version > queue.version && !queue.busy()) {
        queue.version = fresh.view.version;
        applyNewer(fresh.view, Object.keys(queue.pending()));
      }
    };
    window.addEventListener('online', online);
    document.addEventListener('visibilitychange', visibility);
    return () => {
      window.removeEventListener('online', online);
      document.removeEventListener('visibilitychange', visibility);
    };
  }, [queue, initialView.id, applyNewer]);

  // A new step: save what is queued, and take keyboard and screen-reader users to its heading.
  const firstRender = useRef(true);
  useEffect(() => {
    if (firstRender.current) {
      firstRender.current = false;
      return;
    }
    void queue.flush();
    setNotice((n) => (n?.tone === 'info' ? null : n));
    top.current?.scrollIntoView({ block: 'start' });
    heading.current?.focus({ preventScroll: true });
  }, [step, queue]);

  const ctx = useMemo<ChecklistContext>(
    () => ({
      form,
      edit(path, value, when) {
        const def = fieldByPath[path];
        if (!def || !viewRef.current.editable) return;
        // Leaving an untouched field is not an edit.
        if (!queue.has(path) && value === fromApiValue(def, viewRef.current.checklist)) return;
        queue.edit(path, value, when);
      },
    }),
    [form, queue],
  );

  const pending = queue.pending();
  const checklist = localChecklist(view.checklist, pending);
  const progress = progressOf(checklist);
  const index = steps.findIndex((s) => s.id === step);
  const current = steps[index]!;
  const previous = steps[index - 1];
  const next = steps[index + 1];
  const sent = isSent(view);

  return (
    <ChecklistCtx.Provider value={ctx}>
      <div ref={top} className="scroll-mt-4">
        <header className="mb-5">
          <p className="text-sm font-semibold uppercase tracking-wide text-clay-600">Case {view.reference}</p>
          <h1 className="text-2xl font-bold text-ground-900 sm:text-3xl">Your charge point checklist</h1>
          <p className="mt-2 flex flex-wrap items-center gap-x-2 gap-y-1 text-ground-800" data-testid="case-stage">
            <span className="rounded-full border border-ground-200 bg-white px-2.5 py-0.5 text-sm font-semibold text-ground-900" data-testid="stage-word">{customerStage[view.stage].label}</span>
            <span className="text-ground-700">{customerStage[view.stage].next}</span>
          </p>
        </header>
        <div className="lg:grid lg:grid-cols-[17rem_minmax(0,1fr)] lg:items-start lg:gap-8">
          <StepList current={step} progress={progress} checklist={checklist} sent={sent} />
          <div className="min-w-0 space-y-4">
            {!view.editable && (
              <NoticeBox
                notice={{
                  tone: 'attention',
                  body: <p>These answers can no longer be changed here. If something has changed, please get in touch with your installer.</p>,
                }}
              />
            )}
            {notice && <NoticeBox notice={notice} onClose={() => setNotice(null)} />}
            <section aria-labelledby="step-heading" className="card p-4 sm:p-6">
              <div className="mb-5 flex flex-wrap items-end justify-between gap-x-4 gap-y-1 border-b border-ground-100 pb-4">
                <div>
                  <p className="hidden text-sm font-semibold text-clay-700 lg:block">
                    Step {index + 1} of {steps.length}
                  </p>
                  <h2 id="step-heading" ref={heading} tabIndex={-1} className="text-2xl font-bold text-ground-900">
                    {current.title}
                  </h2>
                </div>
                <SaveStatusLine status={status} />
              </div>
              <p className="mb-6 text-ground-800">{step === 'review' && sent ? 'Your answers are with your installer. You can still fill a gap or correct an answer.' : intros[step]}</p>
              <form method="post" onSubmit={(e) => e.preventDefault()} noValidate>
                <fieldset disabled={!view.editable} className="min-w-0">
                  {step === 'about' && <AboutStep caseId={view.id} />}
                  {step === 'vehicle' && <VehicleStep caseId={view.id} />}
                  {step === 'supply' && <SupplyStep caseId={view.id} />}
                  {step === 'parking' && <ParkingStep caseId={view.id} />}
                  {step === 'charger' && <ChargerStep caseId={view.id} />}
                </fieldset>
                {step === 'review' && (
                  <ReviewStep
                    caseId={view.id}
                    view={view}
                    checklist={checklist}
                    progress={progress}
                    blocked={queue.blocked()}
                    saveAll={() => queue.saveAll()}
                    onSent={setView}
                  />
                )}
              </form>
              <div className="mt-8 border-t border-ground-100 pt-4">
                <div className="mb-3 sm:hidden">
                  <SaveStatusLine status={status} live={false} />
                </div>
                <div className="flex gap-3">
                  {previous ? (
                    <a href={stepHash(previous.id)} className={`btn-secondary sm:flex-none ${next ? 'flex-1' : 'px-6'}`} data-testid="step-back">
                      <ChevronLeftIcon className="h-5 w-5" /> Back
                    </a>
                  ) : (
                    <span className="flex-1 sm:flex-none" />
                  )}
                  {next && (
                    <a href={stepHash(next.id)} className="btn-primary flex-1 sm:ml-auto sm:flex-none" data-testid="step-next">
                      {next.id === 'review' ? 'Check and send' : 'Next'} <ChevronRightIcon className="h-5 w-5" />
                    </a>
                  )}
                </div>
              </div>
            </section>
          </div>
        </div>
      </div>
    </ChecklistCtx.Provider>
  );
}

function NoticeBox({ notice, onClose }: { notice: Notice; onClose?: () => void }) {
  const look = {
    info: 'border-ground-400 bg-ground-50',
    attention: 'border-attention bg-attention-soft',
    blocked: 'border-blocked bg-blocked-soft',
  }[notice.tone];
  const icon = {
    info: <InfoIcon className="mt-0.5 h-5 w-5 text-ground-600" />,
    attention: <WarningIcon className="mt-0.5 h-5 w-5 text-attention" />,
    blocked: <StopIcon className="mt-0.5 h-5 w-5 text-blocked" />,
  }[notice.tone];
  return (
    <div role="status" className={`flex gap-3 rounded-lg border-l-4 p-4 ${look}`} data-testid="checklist-notice">
      {icon}
      <div className="min-w-0 flex-1">{notice.body}</div>
      {onClose && (
        <button type="button" className="btn-secondary -my-1 shrink-0 self-start px-3 py-1 text-sm" onClick={onClose}>
          Dismiss
        </button>
      )}
    </div>
  );
}
