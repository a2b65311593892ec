// Small numeric helpers shared by the checks; kept apart so each check reads as its rule.

/**
 * Current drawn by a load at the nominal voltage: I = P / V.
 *
 * @example kwToAmps(10.5, 230) // 45.652…
 */
export function kwToAmps(kw: number, voltage: number): number {
  return (kw * 1000) / voltage;
}

/**
 * Rounds for display; decisions use the unrounded value.
 *
 * @example roundTo(5.0560001, 3) // 5.056
 */
export function roundTo(value: number, places: number): number {
  const factor = 10 ** places;
  return Math.round((value + Number.EPSILON) * factor) / factor;
}

/**
 * A positive finite number, or null for anything a customer might leave blank or mistype.
 *
 * @example positiveOrNull(0) // null
 */
export function positiveOrNull(value: number | null | undefined): number | null {
  return typeof value === 'number' && Number.isFinite(value) && value > 0 ? value : null;
}

/**
 * Formats a number for prose: at most one decimal place, no trailing ".0".
 *
 * @example formatNumber(87.652) // '87.7'
 */
export function formatNumber(value: number, places = 1): string {
  return String(roundTo(value, places));
}
