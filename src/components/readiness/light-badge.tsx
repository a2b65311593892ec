// A readiness light as a word, an icon and a colour together: colour is never the only signal.
// One component for the customer's, the office's and the surveyor's screens.
import type { Light } from '@/lib/readiness/types';
import { customerLightWords, staffLightWords } from '@/lib/readiness/lights';
import { CheckIcon, StopIcon, WarningIcon } from '@/components/icons';

const look: Record<Light, string> = {
  green: 'border-clear/30 bg-clear-soft text-clear',
  amber: 'border-attention/30 bg-attention-soft text-attention',
  red: 'border-blocked/30 bg-blocked-soft text-blocked',
};

/** The icon alone (decorative: always placed beside the word). */
export function LightIcon({ light, className = 'h-4 w-4' }: { light: Light; className?: string }) {
  if (light === 'green') return <CheckIcon className={className} />;
  if (light === 'amber') return <WarningIcon className={className} />;
  return <StopIcon className={className} />;
}

/**
 * A pill with the light's icon and word.
 * @example <LightBadge light="amber" /> // "Needs attention" with a warning triangle
 */
export function LightBadge({ light, size = 'sm', audience = 'staff' }: { light: Light; size?: 'sm' | 'md'; audience?: 'customer' | 'staff' }) {
  const pad = size === 'md' ? 'px-3 py-1 text-base' : 'px-2 py-0.5 text-sm';
  const words = audience === 'customer' ? customerLightWords : staffLightWords;
  return (
    <span className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border font-semibold print:bg-white ${pad} ${look[light]}`} data-light={light}>
      <LightIcon light={light} className={size === 'md' ? 'h-5 w-5' : 'h-4 w-4'} />
      {words[light]}
    </span>
  );
}
