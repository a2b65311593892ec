// Step 6, Check and send: every answer on one page, the gaps and what each holds up, and the
// Send button (with a confirmation that lists the gaps, when there are any).
import { useEffect, useRef, useState } from 'react';
import type { Checklist } from '@/lib/schemas/checklist';
import type { StepId, StepProgress } from '@/lib/checklist-steps';
import { CheckIcon, PencilIcon, SendIcon, SpinnerIcon, StopIcon, WarningIcon } from '@/components/icons';
import { loadCase, submitCase, type CaseView, type Gap } from './api-client';
import { fieldId } from './checklist-context';
import { fieldByPath } from './field-defs';
import { gapWords, stepHash, stepOfField, stepSummaryRows, steps } from './progress';
import { Note } from './notes';
import CustomerReadiness from '@/components/readiness/customer-readiness';

type Props = {
  caseId: string;
  view: CaseView;
  checklist: Checklist;
  progress: StepProgress[];
  /** Unsaved answers that can't be saved as they stand, with why. */
  blocked: Record<string, string>;
  /** Saves everything queued; false if something could not be saved. */
  saveAll(): Promise<boolean>;
  onSent(view: CaseView): void;
};

const dateTime = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', hour: '2-digit', minute: '2-digit' });

/** Whether the customer has already sent this case on. */
export function isSent(view: CaseView): boolean {
  return view.stage !== 'invited' && view.stage !== 'filling_in';
}

/** Gaps grouped by the step that asks for them, with dotted paths. */
type StepGap = { step: StepId; title: string; paths: string[] };

// The server names gaps by data section; the customer meets them by step.
function toStepGaps(gaps: Gap[]): StepGap[] {
  const paths = gaps.flatMap((g) => g.missing.map((field) => `${g.section}.${field}`));
  return steps
    .map(({ id, title }) => ({ step: id, title, paths: paths.filter((p) => stepOfField(p) === id) }))
    .filter((g) => g.paths.length > 0);
}

function EditLink({ section, title }: { section: StepId; title: string }) {
  return (
    <a href={stepHash(section)} className="btn-secondary shrink-0 px-3 py-1.5">
      <PencilIcon className="h-4 w-4" />
      Edit<span className="sr-only"> {title}</span>
    </a>
  );
}

function GapList({ gaps, withLinks }: { gaps: StepGap[]; withLinks: boolean }) {
  return (
    <ul className="space-y-4">
      {gaps.map((gap) => (
        <li key={gap.step}>
          <div className="flex items-center justify-between gap-3">
            <p className="font-bold text-ground-900">{gap.title}</p>
            {withLinks && <EditLink section={gap.step} title={gap.title} />}
          </div>
          <ul className="mt-1 space-y-1.5">
            {gap.paths.map((path) => {
              const words = gapWords(path);
              return (
                <li key={path} className="flex items-start gap-2">
                  <WarningIcon className="mt-0.5 h-4 w-4 text-attention" />
                  <span>
                    <span className="font-semibold">{words.label}</span>
                    {words.blocks && <span className="text-ground-700"> — needed for {words.blocks}.</span>}
                  </span>
                </li>
              );
            })}
          </ul>
        </li>
      ))}
    </ul>
  );
}

function SentConfirmation({ view }: { view: CaseView }) {
  const heading = useRef<HTMLHeadingElement>(null);
  useEffect(() => heading.current?.focus(), []);
  return (
    <div className="rounded-lg border-2 border-clear/40 bg-clear-soft p-5" data-testid="sent-confirmation">
      <div className="flex items-start gap-3">
        <CheckIcon className="h-8 w-8 text-clear" />
        <div>
          <h3 ref={heading} tabIndex={-1} className="text-xl font-bold text-ground-900">
            Thank you: your answers are on their way
          </h3>
          {view.submittedAt && <p className="mt-1 text-ground-700">Sent on {dateTime.format(new Date(view.submittedAt))}.</p>}
          <p className="mt-2">
            Their office will check your answers and get in touch about the survey. If anything changes, you can come back and update an
            answer here.
          </p>
        </div>
      </div>
    </div>
  );
}

export function ReviewStep({ caseId, view, checklist, progress, blocked, saveAll, onSent }: Props) {
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [dialogGaps, setDialogGaps] = useState<StepGap[] | null>(null);
  const dialog = useRef<HTMLDialogElement>(null);
  const gaps: StepGap[] = progress.filter((p) => !p.complete).map((p) => ({ step: p.id, title: p.title, paths: p.missing }));
  const blockedPaths = Object.keys(blocked);
  const sent = isSent(view);

  useEffect(() => {
    if (dialogGaps && !dialog.current?.open) dialog.current?.showModal();
    if (!dialogGaps && dialog.current?.open) dialog.current.close();
  }, [dialogGaps]);

  async function send(acknowledgeGaps: boolean) {
    setBusy(true);
    setProblem(null);
    const saved = await saveAll();
    if (!saved) {
      setDialogGaps(null);
      setProblem('Some answers haven’t been saved yet, so we can’t send them. Please check your connection, or fix the answers listed above, then try again.');
      setBusy(false);
      return;
    }
    const result = await submitCase(caseId, acknowledgeGaps);
    setBusy(false);
    if (result.kind === 'sent') {
      setDialogGaps(null);
      onSent(result.view);
    } else if (result.kind === 'gaps') {
      setDialogGaps(toStepGaps(result.gaps));
    } else if (result.kind === 'already-sent') {
      // Sent already (another tab, or a reply lost on the way): show the case as it now stands.
      setDialogGaps(null);
      const fresh = await loadCase(caseId);
      if (fresh.kind === 'loaded') onSent(fresh.view);
      else setProblem(result.message);
    } else if (result.kind === 'signed-out') {
      setDialogGaps(null);
      setProblem('You have been signed out. Please sign in again; your answers are saved.');
    } else {
      setDialogGaps(null);
      setProblem(result.message);
    }
  }

  return (
    <div className="space-y-6">
      {sent && <SentConfirmation view={view} />}

      {blockedPaths.length > 0 && (
        <div role="alert" className="rounded-lg border-l-4 border-blocked bg-blocked-soft p-4">
          <p className="flex items-center gap-2 font-bold text-blocked">
            <StopIcon className="h-5 w-5" /> Not saved yet
          </p>
          <p className="mt-1">These answers need a fix before they can be saved:</p>
          <ul className="mt-2 space-y-1">
            {blockedPaths.map((path) => (
              <li key={path}>
                <a href={stepHash(stepOfField(path))} onClick={() => setTimeout(() => document.getElementById(fieldId(path))?.focus(), 50)}>
                  {fieldByPath[path]?.label}
                </a>
                : {blocked[path]}
              </li>
            ))}
          </ul>
        </div>
      )}

      {gaps.length > 0 ? (
        <section aria-labelledby="gaps-heading" className="rounded-lg border border-attention/40 bg-attention-soft/60 p-4">
          <h3 id="gaps-heading" className="flex items-center gap-2 text-lg font-bold text-ground-900">
            <WarningIcon className="h-5 w-5 text-attention" />
            Still to answer ({gaps.reduce((n, g) => n + g.paths.length, 0)})
          </h3>
          <p className="mb-3 mt-1 text-ground-800">
            {sent
              ? 'You can still fill these in here; your installer sees each answer as it is saved.'
              : 'You can send now and fill these in later, but each one holds something up.'}
          </p>
          <GapList gaps={gaps} withLinks />
        </section>
      ) : (
        <Note>
          <p className="flex items-center gap-2 font-semibold text-ground-900">
            <CheckIcon className="h-5 w-5 text-clear" /> Every question is answered. Thank you!
          </p>
        </Note>
      )}

      <CustomerReadiness caseId={caseId} version={view.version} />

      {progress.map((section) => {
        const rows = stepSummaryRows(section.id, checklist);
        return (
          <section key={section.id} aria-labelledby={`summary-${section.id}`} className="rounded-lg border border-ground-100" data-testid={`summary-${section.id}`}>
            <div className="flex items-center justify-between gap-3 border-b border-ground-100 bg-ground-50 px-4 py-2">
              <div>
                <h3 id={`summary-${section.id}`} className="font-bold text-ground-900">
                  {section.title}
                </h3>
                <p className={`flex items-center gap-1 text-sm ${section.complete ? 'text-clear' : 'text-attention'}`}>
                  {section.complete ? <CheckIcon className="h-4 w-4" /> : <WarningIcon className="h-4 w-4" />}
                  {section.complete ? 'Complete' : `${section.missing.length} to answer`}
                </p>
              </div>
              <EditLink section={section.id} title={section.title} />
            </div>
            <dl className="divide-y divide-ground-100 px-4">
              {rows.map(({ def, value }) => (
                <div key={def.path} className="py-2.5 sm:grid sm:grid-cols-[15rem_1fr] sm:gap-4">
                  <dt className="text-sm font-semibold text-ground-700">{def.label}</dt>
                  <dd className="break-words text-ink">{value ?? <span className="italic text-ground-600">Not answered yet</span>}</dd>
                </div>
              ))}
            </dl>
          </section>
        );
      })}

      <Note>
        <p>
          Your installer uses these answers to prepare. The charge point is designed, fitted and certified by a qualified electrician under
          BS 7671 and local building rules, who may ask more at the survey.
        </p>
      </Note>

      {!sent && view.editable && (
        <div className="rounded-lg border-2 border-ground-200 bg-white p-4">
          <h3 className="text-lg font-bold text-ground-900">Ready to send?</h3>
          <p className="mt-1 text-ground-800">
            Your installer’s office will check your answers and get in touch about the survey. You can still update answers afterwards.
          </p>
          {problem && (
            <p role="alert" className="field-error mt-3 flex items-start gap-1.5">
              <StopIcon className="mt-0.5 h-4 w-4" />
              {problem}
            </p>
          )}
          <button
            type="button"
            className="btn-primary mt-4 w-full sm:w-auto"
            disabled={busy}
            onClick={() => (gaps.length > 0 ? setDialogGaps(gaps) : void send(false))}
          >
            {busy ? <SpinnerIcon className="h-5 w-5" /> : <SendIcon className="h-5 w-5" />}
            {busy ? 'Sending…' : 'Send to my installer'}
          </button>
        </div>
      )}

      <dialog
        ref={dialog}
        aria-labelledby="send-dialog-title"
        aria-describedby="send-dialog-text"
        onClose={() => setDialogGaps(null)}
        className="m-auto w-[calc(100%-2rem)] max-w-lg rounded-lg border-0 p-0 text-ink shadow-xl backdrop:bg-ground-950/60"
        data-testid="send-dialog"
      >
        {dialogGaps && (
          <div className="max-h-[85vh] overflow-y-auto p-5">
            <h2 id="send-dialog-title" className="flex items-center gap-2 text-xl font-bold text-ground-900">
              <WarningIcon className="h-6 w-6 text-attention" />
              Send with gaps?
            </h2>
            <p id="send-dialog-text" className="mb-4 mt-2 text-ground-800">
              These answers are still missing. You can send now and add them later; your installer will see what is missing.
            </p>
            <GapList gaps={dialogGaps} withLinks={false} />
            <div className="mt-6 flex flex-col-reverse gap-2 sm:flex-row sm:justify-end">
              <button type="button" className="btn-secondary" onClick={() => setDialogGaps(null)}>
                Go back and fill them in
              </button>
              <button type="button" className="btn-primary" disabled={busy} onClick={() => void send(true)}>
                {busy ? <SpinnerIcon className="h-5 w-5" /> : <SendIcon className="h-5 w-5" />}
                {busy ? 'Sending…' : 'Send anyway'}
              </button>
            </div>
          </div>
        )}
      </dialog>
    </div>
  );
}
