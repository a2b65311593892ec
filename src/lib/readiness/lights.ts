// The order of the lights, so "worst" means the same thing everywhere.
import type { Light } from './types';

const severity: Record<Light, number> = { green: 0, amber: 1, red: 2 };

/** Red sorts first, then amber, then green: the office queue's "worst first" order. */
export const lightRank = Object.freeze({ red: 0, amber: 1, green: 2 } as const);

/**
 * The worst of some lights; green when there are none.
 *
 * @example worstLight(['green', 'amber', 'green']) // 'amber'
 */
export function worstLight(lights: readonly Light[]): Light {
  return lights.reduce<Light>((worst, light) => (severity[light] > severity[worst] ? light : worst), 'green');
}

/**
 * Raises a light to at least the given floor.
 *
 * @example atLeast('green', 'amber') // 'amber'
 */
export function atLeast(light: Light, floor: Light): Light {
  return worstLight([light, floor]);
}

/** The word for each light in the office's and the surveyor's terms (always shown beside its icon). */
export const staffLightWords: Readonly<Record<Light, string>> = Object.freeze({ green: 'Clear', amber: 'Needs attention', red: 'Blocked' });

/** The word for each light as the customer reads it. */
export const customerLightWords: Readonly<Record<Light, string>> = Object.freeze({
  green: 'All clear',
  amber: 'Needs attention',
  red: 'Holding things up',
});
