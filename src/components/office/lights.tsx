// A readiness light as staff see it: always a word and an icon as well as the colour.
import type { Light } from '../../lib/readiness/types';
import { CheckIcon, StopIcon, WarningIcon } from '../icons';

/** The word for each light, in the office's terms. */
export const lightWords: Record<Light, string> = { green: 'Clear', amber: 'Needs attention', red: 'Blocked' };

const look: Record<Light, string> = {
  green: 'border-clear/30 bg-clear-soft text-clear',
  amber: 'border-attention/30 bg-attention-soft text-attention',
  red: 'border-blocked/30 bg-blocked-soft text-blocked',
};

export function LightIcon({ light, className = 'h-4 w-4' }: { light: Light; className?: string }) {
  if (light === 'green') return <CheckIcon className={className} />;
  if (light === 'amber') return <WarningIcon className={className} />;
  return <StopIcon className={className} />;
}

/** A pill with the light's icon and word. @example <LightBadge light="amber" /> */
export function LightBadge({ light, size = 'sm' }: { light: Light; size?: 'sm' | 'md' }) {
  const pad = size === 'md' ? 'px-3 py-1 text-base' : 'px-2 py-0.5 text-sm';
  return (
    <span className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border font-semibold ${pad} ${look[light]}`} data-light={light}>
      <LightIcon light={light} className={size === 'md' ? 'h-5 w-5' : 'h-4 w-4'} />
      {lightWords[light]}
    </span>
  );
}
