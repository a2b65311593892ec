// A readiness light as a word, an icon and a colour together: colour is never the only signal.
import type { Light } from '../../lib/readiness/types';
import { CheckIcon, StopIcon, WarningIcon } from '../icons';

export const lightWords: Record<Light, { customer: string; staff: string }> = {
  green: { customer: 'All clear', staff: 'Clear' },
  amber: { customer: 'Needs attention', staff: 'Attention' },
  red: { customer: 'Holding things up', staff: 'Blocked' },
};

const tone: Record<Light, string> = {
  green: 'bg-clear-soft text-clear border-clear/30',
  amber: 'bg-attention-soft text-attention border-attention/30',
  red: 'bg-blocked-soft text-blocked border-blocked/30',
};

export function LightIcon({ light, className = 'h-4 w-4' }: { light: Light; className?: string }) {
  if (light === 'green') return <CheckIcon className={className} />;
  if (light === 'amber') return <WarningIcon className={className} />;
  return <StopIcon className={className} />;
}

export function LightBadge({ light, audience = 'customer' }: { light: Light; audience?: 'customer' | 'staff' }) {
  return (
    <span className={`inline-flex items-center gap-1 whitespace-nowrap rounded-full border px-2.5 py-0.5 text-sm font-semibold ${tone[light]}`} data-light={light}>
      <LightIcon light={light} />
      {lightWords[light][audience]}
    </span>
  );
}
