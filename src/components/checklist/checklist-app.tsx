// The customer's checklist island: loads the case, shows one step at a time (the step lives in
// the URL hash, so a reload stays put), and saves every answer as the customer goes.
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { get, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { customerStage } from '@/lib/vocabulary/stages';
import { ChevronLeftIcon, ChevronRightIcon, InfoIcon, StopIcon, WarningIcon } from '@/components/icons';
import { confirmDetails, loadCase, patchChecklist, type CaseView } from './api-client';
import { AutosaveQueue, type QueueListener, type SaveStatus } from './autosave-queue';
import { ChecklistCtx, fieldId, type ChecklistContext } from './checklist-context';
import { takeEarlyAnswers } from '@/lib/early-answers';
import { fieldByPath, fieldDefs } from './field-defs';
import { checkFormValue, checklistToForm, formSchema, fromApiValue, type FormValues } from './form-values';
import { localChecklist, progressOf, resumeStep, stepFromHash, stepHash, stepOfField, steps, type StepId } from './progress';
import { stepTitle } from '@/lib/checklist-steps';
import { SaveStatusLine } from './save-status';
import { StepList } from './step-list';
import { AboutStep, HomeStep } from './step-about';
import { VehicleStep } from './step-vehicle';
import { SupplyStep } from './step-supply';
import { FuseBoxStep, LoadsStep, SupplyPhotosStep } from './step-loads';
import { ParkingStep } from './step-parking';
import { ChargePointStep, ChargerStep } from './step-charger';
import { isSent, ReviewStep } from './step-review';

type Props = {
  /** The case as the server rendered it, so the step is drawn before any script runs. */
  initialView: CaseView;
};

// Each step's opening words (step titles and these intros are the steps' own words).
const intros: Record<StepId, string> = {
  about: 'Who we’re talking to, and how your installer can reach you.',
  home: 'The home the charge point is for.',
  vehicle: 'The car decides the plug and how far the cable must reach. If it hasn’t arrived yet, answer from your order.',
  supply: 'A few details about the electricity coming into your home. Most are on a bill, or can be read by looking — never touching — at the meter and cut-out.',
  fusebox: 'Where your consumer unit is, and how your supply is earthed and wired. Look only; guesses and “not sure” are fine.',
  supplyphotos: 'A clear photo of each helps your installer plan the visit without guessing. Take them from where you stand.',
  loads: 'The big electrical appliances already in your home. Together with a charge point they decide whether your supply has room.',
  parking: 'Where the car will stand while it charges.',
  charger: 'Where you’d like the charge point and how a cable could reach it. Rough answers are fine: your installer checks everything at the survey.',
  chargepoint: 'The kind of charge point you’d like. If you’re not sure, your installer will talk it through with you at the survey.',
  review: 'Check your answers, fill any gaps you can, then send them to your installer.',
};

/**
 * The island: drawn on the server with the case's answers, then hydrated in the browser.
 * @example <ChecklistApp client:load initialView={toCaseView(row, 'customer')} />
 */
export default function ChecklistApp({ initialView }: Props) {
  return <ChecklistForm initialView={initialView} />;
}

type Notice = { tone: 'info' | 'attention' | 'blocked'; body: ReactNode };

// The server knows no URL hash, so it draws the step a returning customer would resume at; the
// browser then moves to the hash's step (after hydration, so both first draws are the same).
function useHashStep(initial: StepId): { step: StepId; fromHash: boolean } {
  const [state, setState] = useState({ step: initial, fromHash: false });
  useEffect(() => {
    const onHash = () => setState({ step: stepFromHash(window.location.hash) ?? 'about', fromHash: false });
    window.addEventListener('hashchange', onHash);
    const hashed = stepFromHash(window.location.hash);
    if (!hashed) window.history.replaceState(null, '', stepHash(initial));
    else if (hashed !== initial) setState({ step: hashed, fromHash: true });
    return () => window.removeEventListener('hashchange', onHash);
    // Runs once on purpose: after the first render the step comes from the hash alone.
  }, []);
  return state;
}

/** The first invalid field's element on the page (a text box, or a choice's first option). */
function fieldElement(path: string): HTMLElement | null {
  const id = fieldId(path);
  return document.getElementById(id) ?? document.querySelector<HTMLElement>(`[data-testid="${id}"] input`);
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
  const [hydrated, setHydrated] = useState(false);
  useEffect(() => setHydrated(true), []);
  const { step, fromHash } = useHashStep(resumeStep(progressOf(initialView.checklist, initialView.prefilled ?? [])));
  const [problem, setProblem] = useState('');
  const [confirming, setConfirming] = useState(false);
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
      // Changed there too, to something other than what this tab holds (a save of this very
      // value that landed late, e.g. sent as the page reloaded, is no conflict).
      const overlap = kept.filter((path) => {
        const def = fieldByPath[path];
        const there = def ? fromApiValue(def, current.checklist) : '';
        return def && there !== fromApiValue(def, before.checklist) && there !== form.getValues(path);
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

  // Answers typed into the server-drawn step before this script ran (early-answers.ts): back
  // into the form before the first paint, and queued for saving. They are newer than anything
  // kept from an earlier visit, so the restore below leaves those fields alone.
  const early = useRef<string[]>([]);
  useLayoutEffect(() => {
    if (!viewRef.current.editable) return;
    for (const [path, value] of Object.entries(takeEarlyAnswers())) {
      const def = fieldByPath[path];
      if (!def) continue;
      form.setValue(path, value, { shouldDirty: true });
      early.current.push(path);
      if (value !== fromApiValue(def, viewRef.current.checklist)) queue.edit(path, value, 'soon');
    }
  }, [queue, form]);

  // Puts back answers typed in an earlier visit that never reached the server, then sends them.
  useEffect(() => {
    const restored = queue.restore();
    const paths = Object.keys(restored).filter((path) => fieldByPath[path] && !early.current.includes(path));
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
    if (firstRender.current || fromHash) {
      firstRender.current = false;
      return;
    }
    void queue.flush();
    setNotice((n) => (n?.tone === 'info' ? null : n));
    top.current?.scrollIntoView({ block: 'start' });
    heading.current?.focus({ preventScroll: true });
  }, [step, fromHash, queue]);

  // A refused save: take the customer to the first answer marked in red on this step, and say so.
  const refused = status.kind === 'invalid' ? status.paths.join(' ') : '';
  useEffect(() => {
    if (!refused) return setProblem('');
    const found = refused
      .split(' ')
      .map((path) => ({ path, el: fieldElement(path) }))
      .filter((f): f is { path: string; el: HTMLElement } => f.el !== null)
      .sort((a, b) => (a.el.compareDocumentPosition(b.el) & Node.DOCUMENT_POSITION_FOLLOWING ? -1 : 1));
    const first = found[0];
    const path = first?.path ?? refused.split(' ')[0]!;
    const check = checkFormValue(path, String(form.getValues(path) ?? ''));
    const why = (get(form.formState.errors, path) as { message?: string } | undefined)?.message ?? (check.ok ? '' : check.message);
    const label = fieldByPath[path]?.label ?? path;
    if (!first) {
      setProblem(`Not saved: ${label}, on the step “${stepTitle(stepOfField(path))}”. ${why}`);
      return;
    }
    first.el.scrollIntoView({ block: 'center' });
    if (document.activeElement !== first.el) first.el.focus({ preventScroll: true });
    setProblem(`Not saved: please check ${label}. ${why}`);
  }, [refused, form]);

  // "These details from my installer are right": save what is queued, then confirm the rest.
  const confirm = useCallback(async (paths: string[]) => {
    setConfirming(true);
    const saved = await queue.saveAll();
    const result = saved ? await confirmDetails(viewRef.current.id, paths) : null;
    setConfirming(false);
    if (result?.kind === 'saved') {
      queue.version = Math.max(queue.version, result.view.version);
      setView(result.view);
      setNotice({ tone: 'info', body: <p>Thank you — your details are confirmed.</p> });
    } else if (result?.kind === 'locked') {
      setNotice({ tone: 'blocked', body: <p>{result.message}</p> });
    } else {
      setNotice({ tone: 'attention', body: <p>We couldn’t confirm your details just now. Please check your connection and try again.</p> });
    }
  }, [queue, setView]);

  const pending = queue.pending();
  const checklist = localChecklist(view.checklist, pending);
  // Details from the invitation still waiting for the customer's word (an edit makes them theirs).
  const prefilled = (view.prefilled ?? []).filter((path) => !(path in pending));
  const prefilledKey = prefilled.join(' ');
  // The help of questions already answered when a step opens has been read: it starts folded.
  const helpRead = useMemo(
    () => new Set(fieldDefs.filter((d) => stepOfField(d.path) === step && fromApiValue(d, viewRef.current.checklist) !== '' && !viewRef.current.prefilled?.includes(d.path)).map((d) => d.path)),
    [step],
  );

  const ctx = useMemo<ChecklistContext>(
    () => ({
      form,
      prefilled: new Set(prefilledKey ? prefilledKey.split(' ') : []),
      helpRead,
      confirmDetails: confirm,
      confirming,
      hydrated,
      edit(path, value, when) {
        const def = fieldByPath[path];
        if (!def || !viewRef.current.editable) return;
        // Leaving an untouched field is not an edit.
        if (!queue.has(path) && value === fromApiValue(def, viewRef.current.checklist)) return;
        queue.edit(path, value, when);
      },
    }),
    [form, queue, prefilledKey, helpRead, confirm, confirming, hydrated],
  );

  const progress = progressOf(checklist, prefilled);
  const index = steps.findIndex((s) => s.id === step);
  const current = steps[index]!;
  const previous = steps[index - 1];
  const next = steps[index + 1];
  const sent = isSent(view);

  return (
    <ChecklistCtx.Provider value={ctx}>
      {/* data-early-answers: the page notes what is typed in here before hydration (early-answers.ts). */}
      <div ref={top} className="scroll-mt-4" data-early-answers="">
        <header className="mb-5">
          <p className="text-sm font-semibold uppercase tracking-wide text-clay-600">Case {view.reference}</p>
          <h1 className="text-2xl font-bold text-ground-900 sm:text-3xl">Your charge point checklist</h1>
          <p className="mt-2 flex flex-wrap items-center gap-x-2 gap-y-1 text-ground-800" data-testid="case-stage">
            <span className="rounded-full border border-ground-200 bg-white px-2.5 py-0.5 text-sm font-semibold text-ground-900" data-testid="stage-word">{customerStage[view.stage].label}</span>
            <span className="text-ground-700">{customerStage[view.stage].next}</span>
          </p>
        </header>
        <div className="lg:grid lg:grid-cols-[17rem_minmax(0,1fr)] lg:items-start lg:gap-8">
          <StepList current={step} progress={progress} sent={sent} />
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
              <p aria-live="assertive" className="sr-only" data-testid="save-problem">
                {problem}
              </p>
              <p className="mb-6 text-ground-800">{step === 'review' && sent ? 'Your answers are with your installer. You can still fill a gap or correct an answer.' : intros[step]}</p>
              <form method="post" onSubmit={(e) => e.preventDefault()} noValidate>
                {/* Open before hydration: what is typed then is kept (early-answers.ts). */}
                <fieldset disabled={!view.editable} className="min-w-0">
                  {step === 'about' && <AboutStep caseId={view.id} />}
                  {step === 'home' && <HomeStep caseId={view.id} />}
                  {step === 'vehicle' && <VehicleStep caseId={view.id} />}
                  {step === 'supply' && <SupplyStep />}
                  {step === 'fusebox' && <FuseBoxStep />}
                  {step === 'supplyphotos' && <SupplyPhotosStep caseId={view.id} />}
                  {step === 'loads' && <LoadsStep />}
                  {step === 'parking' && <ParkingStep caseId={view.id} />}
                  {step === 'charger' && <ChargerStep caseId={view.id} />}
                  {step === 'chargepoint' && <ChargePointStep caseId={view.id} />}
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
