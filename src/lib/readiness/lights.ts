// The order of the lights, so "worst" means the same thing everywhere.
import type { Light } from './types';

const severity: Record<Light, number> = { green: 0, amber: 1, red: 2 };

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
