// The list of steps: compact on a phone ("Step 2 of 6", opens on demand), a sidebar on a
// desktop. Each step says in words whether it is complete, has gaps or is not started.
import { useState } from 'react';
import type { StepProgress } from '@/lib/checklist-steps';
import { CameraIcon, CheckIcon, ChevronDownIcon, ChevronUpIcon, CircleIcon, SendIcon, WarningIcon } from '@/components/icons';
import { stepHash, stepState, steps, type StepId, type StepState } from './progress';

type Props = { current: StepId; progress: StepProgress[]; sent: boolean };

type Row = { id: StepId; title: string; state: StepState | 'review' | 'photos'; word: string };

function rows({ progress, sent }: Props): Row[] {
  const allComplete = progress.every((p) => p.complete);
  return steps.map(({ id, title }) => {
    // Photos have no answers to count: their slots say what each one needs.
    if (id === 'supplyphotos') return { id, title, state: 'photos', word: 'Meter, cut-out and consumer unit' };
    if (id === 'review') {
      return { id, title, state: 'review', word: sent ? 'Sent' : allComplete ? 'Ready to send' : 'Not sent yet' };
    }
    const p = progress.find((s) => s.id === id)!;
    const state = stepState(p);
    return { id, title, state, word: stepWord(p, state) };
  });
}

/** "Complete", "3 to answer", "2 to answer, 5 to check" (details from the installer to confirm) or "Not started". */
export function stepWord(p: StepProgress, state: StepState): string {
  if (state === 'complete') return 'Complete';
  if (state === 'not-started') return 'Not started';
  const answer = p.missing.length - p.toConfirm.length;
  const parts = [answer > 0 ? `${answer} to answer` : null, p.toConfirm.length > 0 ? `${p.toConfirm.length} to check` : null];
  return parts.filter(Boolean).join(', ');
}

function StateIcon({ state }: { state: Row['state'] }) {
  if (state === 'complete') return <CheckIcon className="h-6 w-6 text-clear" />;
  if (state === 'gaps') return <WarningIcon className="h-6 w-6 text-attention" />;
  if (state === 'review') return <SendIcon className="h-6 w-6 text-ground-600" />;
  if (state === 'photos') return <CameraIcon className="h-6 w-6 text-ground-600" />;
  return <CircleIcon className="h-6 w-6 text-ground-300" />;
}

/** @example <StepList current="supply" progress={view.progress} checklist={view.checklist} sent={false} /> */
export function StepList(props: Props) {
  const [open, setOpen] = useState(false);
  const list = rows(props);
  const index = steps.findIndex((s) => s.id === props.current);
  const done = list.filter((r) => r.state === 'complete').length;
  const here = list[index]!;

  return (
    <nav aria-label="Checklist steps" className="mb-5 lg:sticky lg:top-4 lg:mb-0">
      <div className="card p-3 lg:hidden">
        <div className="flex items-center gap-3">
          <StateIcon state={here.state} />
          <div className="min-w-0 flex-1">
            <p className="font-bold text-ground-900">
              Step {index + 1} of {steps.length}
            </p>
            <p className="text-sm text-ground-700">{here.word}</p>
          </div>
          <button
            type="button"
            className="btn-secondary shrink-0 px-3"
            aria-expanded={open}
            aria-controls="checklist-step-list"
            onClick={() => setOpen((o) => !o)}
          >
            {open ? 'Hide steps' : 'All steps'}
            {open ? <ChevronUpIcon className="h-4 w-4" /> : <ChevronDownIcon className="h-4 w-4" />}
          </button>
        </div>
        <div className="mt-3 flex items-center gap-3">
          <div className="h-2 flex-1 overflow-hidden rounded-full bg-ground-100" aria-hidden="true">
            <div className="h-full rounded-full bg-clear" style={{ width: `${(done / props.progress.length) * 100}%` }} />
          </div>
          <p className="shrink-0 text-sm text-ground-700">
            {done} of {props.progress.length} steps complete
          </p>
        </div>
      </div>
      <div className={`${open ? 'block' : 'hidden'} mt-2 lg:mt-0 lg:block`}>
        <p className="mb-2 hidden text-sm font-semibold uppercase tracking-wide text-clay-700 lg:block">
          Your checklist · {done} of {props.progress.length} complete
        </p>
        <ol id="checklist-step-list" className="card space-y-1 p-2">
          {list.map((row, i) => {
            const current = row.id === props.current;
            return (
              <li key={row.id}>
                <a
                  href={stepHash(row.id)}
                  aria-current={current ? 'step' : undefined}
                  onClick={() => setOpen(false)}
                  className={`flex min-h-[52px] items-center gap-3 rounded-md border-l-4 px-3 py-2 no-underline ${
                    current ? 'border-clay-500 bg-ground-50' : 'border-transparent hover:bg-ground-50'
                  }`}
                  data-testid={`step-link-${row.id}`}
                >
                  <StateIcon state={row.state} />
                  <span className="min-w-0 flex-1">
                    <span className="block font-semibold text-ground-900">
                      {i + 1}. {row.title}
                    </span>
                    <span className="block text-sm text-ground-700">
                      {current && <span className="font-semibold text-clay-700">You’re here · </span>}
                      {row.word}
                    </span>
                  </span>
                </a>
              </li>
            );
          })}
        </ol>
      </div>
    </nav>
  );
}
