// The small line that says whether the answers are safe on the server: icon and words together.
import { CheckIcon, InfoIcon, SpinnerIcon, StopIcon, WarningIcon } from '@/components/icons';
import type { SaveStatus } from './autosave-queue';

/** Words and icon for each save status. */
export function SaveStatusLine({ status, live = true }: { status: SaveStatus; live?: boolean }) {
  const { icon, text, tone } = describe(status);
  return (
    <p
      role={live ? 'status' : undefined}
      aria-hidden={live ? undefined : true}
      className={`flex min-h-[24px] items-center gap-1.5 text-sm font-semibold ${tone}`}
      data-testid={live ? 'save-status' : undefined}
    >
      {icon}
      <span>{text}</span>
      {status.kind === 'signed-out' && (
        <a href={`/signin?callbackUrl=${encodeURIComponent(typeof window === 'undefined' ? '/my' : window.location.pathname + window.location.hash)}`} className="ml-1 font-semibold">
          Sign in
        </a>
      )}
    </p>
  );
}

function describe(status: SaveStatus) {
  switch (status.kind) {
    case 'idle':
      return { icon: <InfoIcon className="h-4 w-4" />, text: 'Answers save as you go', tone: 'text-ground-700' };
    case 'pending':
    case 'saving':
      return { icon: <SpinnerIcon className="h-4 w-4" />, text: 'Saving…', tone: 'text-ground-700' };
    case 'saved':
      return { icon: <CheckIcon className="h-4 w-4" />, text: 'Saved', tone: 'text-clear' };
    case 'retrying':
      return {
        icon: <WarningIcon className="h-4 w-4" />,
        text: status.offline ? 'Not saved — retrying (you seem to be offline)' : 'Not saved — retrying',
        tone: 'text-attention',
      };
    case 'invalid':
      return { icon: <WarningIcon className="h-4 w-4" />, text: 'Not saved — please check the answer marked in red', tone: 'text-attention' };
    case 'signed-out':
      return { icon: <StopIcon className="h-4 w-4" />, text: 'Not saved — you have been signed out.', tone: 'text-blocked' };
    case 'locked':
      return { icon: <StopIcon className="h-4 w-4" />, text: 'Not saved — this checklist can no longer be changed', tone: 'text-blocked' };
  }
}
