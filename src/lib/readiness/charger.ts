// The new charge point's rating as the checks read it: the customer's choice of 3.6, 7.4, 11
// or 22 kW, or, until they choose, the single-phase current assumed in the settings.
import type { ReadinessSettings } from './settings';
import type { ChecklistAnswers, SupplyPhases } from './types';

/** The charge-point ratings offered to the customer, kW. */
export const chargerRatingValues = [3.6, 7.4, 11, 22] as const;
export type ChargerRatingKw = (typeof chargerRatingValues)[number];

/**
 * Phases and current per phase of each rating. 3.6 kW ≈ 16 A and 7.4 kW ≈ 32 A at 230 V single
 * phase (ESQCR 230 V); 11 kW ≈ 16 A and 22 kW ≈ 32 A per phase on three phases (common practice).
 */
export const chargerRatings: Readonly<Record<ChargerRatingKw, { phases: 1 | 3; ampsPerPhase: number }>> = Object.freeze({
  3.6: { phases: 1, ampsPerPhase: 16 },
  7.4: { phases: 1, ampsPerPhase: 32 },
  11: { phases: 3, ampsPerPhase: 16 },
  22: { phases: 3, ampsPerPhase: 32 },
});

export interface ChargerRating {
  ratingKw: number;
  phases: 1 | 3;
  /** Ib: the design current per phase, at full rated current (722.311). */
  ampsPerPhase: number;
  /** False while the customer has not chosen, so the setting's single-phase current is assumed. */
  chosen: boolean;
}

/**
 * The charge point the checks assess.
 *
 * @example chargerRating({ charger: { ratingKw: 22 } }, defaultReadinessSettings) // { ratingKw: 22, phases: 3, ampsPerPhase: 32, chosen: true }
 */
export function chargerRating(answers: ChecklistAnswers, settings: ReadinessSettings): ChargerRating {
  const chosen = answers.charger?.ratingKw;
  if (typeof chosen === 'number' && chosen in chargerRatings) {
    const { phases, ampsPerPhase } = chargerRatings[chosen as ChargerRatingKw];
    return { ratingKw: chosen, phases, ampsPerPhase, chosen: true };
  }
  const amps = settings.chargerAmps;
  return { ratingKw: Math.round((amps * settings.nominalVoltage) / 100) / 10, phases: 1, ampsPerPhase: amps, chosen: false };
}

/**
 * The supply's phases as far as they are known: the customer's answer, or null when unsure or blank.
 *
 * @example knownPhases({ supply: { phases: 'three' } }) // 3
 */
export function knownPhases(answers: ChecklistAnswers): 1 | 3 | null {
  const phases: SupplyPhases | null | undefined = answers.supply?.phases;
  if (phases === 'single') return 1;
  if (phases === 'three') return 3;
  return null;
}
