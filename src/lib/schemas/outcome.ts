// The surveyor's record of the visit: one zod schema shared by the outcome form and the API,
// and the pure rules by which confirmed values take the place of the customer's answers.
// Pure and client-safe: no Astro, no database.
import { z } from 'zod';
import type { CheckId, CheckResult, ChecklistAnswers, Earthing, EarthingMeasure, FuseRating, SiteMeasures } from '@/lib/readiness/types';

export const surveyOutcomeValues = ['go_ahead', 'go_ahead_with_changes', 'cannot_install'] as const;
export type SurveyOutcome = (typeof surveyOutcomeValues)[number];

/** Staff words for each outcome. */
export const outcomeLabels: Readonly<Record<SurveyOutcome, string>> = Object.freeze({
  go_ahead: 'Go ahead',
  go_ahead_with_changes: 'Go ahead with changes',
  cannot_install: 'Cannot install',
});

export const confirmedEarthingValues = ['pme', 'tns', 'tt'] as const satisfies readonly Earthing[];
export type ConfirmedEarthing = (typeof confirmedEarthingValues)[number];

export const earthingLabels: Readonly<Record<ConfirmedEarthing, string>> = Object.freeze({
  pme: 'PME (TN-C-S)',
  tns: 'TN-S',
  tt: 'TT',
});

export const confirmedFuseValues = [60, 80, 100] as const satisfies readonly FuseRating[];

/**
 * What the surveyor may measure or note on site, with the range a reading must fall in.
 * Ranges are sanity bounds (common practice, no published source), wide enough for a
 * reading that is out of specification to be recorded rather than refused.
 */
export const measurementFields = {
  zeOhms: { label: 'External earth fault loop impedance, Ze', unit: 'Ω', min: 0, max: 200, step: 0.01 },
  pfcKa: { label: 'Prospective fault current, PFC', unit: 'kA', min: 0, max: 25, step: 0.01 },
  electrodeOhms: { label: 'Earth electrode resistance, RA', unit: 'Ω', min: 0, max: 2000, step: 1 },
  supplyVolts: { label: 'Supply voltage at the origin', unit: 'V', min: 180, max: 280, step: 0.1 },
  cableRunMetres: { label: 'Cable run, measured', unit: 'm', min: 0, max: 200, step: 0.1 },
  rcdIdnMilliamps: { label: 'RCD rated residual current, IΔn (for the RA check)', unit: 'mA', min: 1, max: 1000, step: 1 },
  measuredMaxDemandAmps: { label: 'Existing maximum demand, measured (smart meter or logger)', unit: 'A', min: 0, max: 300, step: 0.1 },
} as const;

/** The 722.411.4.1 measures staff may record for PME, with the words staff read. */
export const earthingMeasureValues = ['open-pen-device', 'tt-electrode', 'installation-electrode', 'balanced-three-phase', 'other-listed'] as const satisfies readonly EarthingMeasure[];
export const earthingMeasureOptionLabels: Readonly<Record<EarthingMeasure, string>> = Object.freeze({
  'open-pen-device': 'Charge point or device with open-PEN detection',
  'tt-electrode': 'Charging point made TT, with its own earth electrode',
  'installation-electrode': 'Installation earth electrode (≤ 70 V on a broken PEN)',
  'balanced-three-phase': 'Balanced three-phase installation',
  'other-listed': 'Another listed measure (e.g. voltage monitoring)',
});
const earthingMeasureField = z
  .enum(earthingMeasureValues, { errorMap: () => ({ message: 'Choose one of the 722.411.4.1 measures, or “not chosen yet”.' }) })
  .nullable();
export type MeasurementId = keyof typeof measurementFields;
export const measurementIds = Object.keys(measurementFields) as MeasurementId[];

// A blank box in the form arrives as '', NaN or null: all mean "not measured".
const blankToUndefined = (value: unknown) =>
  value === '' || value === null || (typeof value === 'number' && Number.isNaN(value)) ? undefined : value;

function reading(id: MeasurementId) {
  const { label, unit, min, max } = measurementFields[id];
  const message = `${label}: give a number from ${min} to ${max} ${unit}.`;
  return z.preprocess(blankToUndefined, z.number({ invalid_type_error: message }).finite(message).min(min, message).max(max, message).optional());
}

const measurementsSchema = z
  .object(Object.fromEntries(measurementIds.map((id) => [id, reading(id)])) as { [K in MeasurementId]: ReturnType<typeof reading> })
  .strict();

const notesNeeded: Partial<Record<SurveyOutcome, string>> = {
  go_ahead_with_changes: 'Say what has to change (at least 10 characters).',
  cannot_install: 'Say why it cannot be installed (at least 10 characters).',
};

/**
 * The body of POST /api/cases/:id/outcome. Notes are required unless the outcome is a plain
 * go-ahead; confirmed values are null when they could not be confirmed.
 *
 * @example outcomeSchema.safeParse({ outcome: 'cannot_install', confirmedEarthing: null, confirmedFuseAmps: null }).success // false: notes needed
 */
export const outcomeSchema = z
  .object({
    outcome: z.enum(surveyOutcomeValues, { errorMap: () => ({ message: 'Choose the outcome of the survey.' }) }),
    confirmedEarthing: z.enum(confirmedEarthingValues, { errorMap: () => ({ message: 'Choose PME, TN-S or TT, or “not confirmed”.' }) }).nullable().default(null),
    confirmedFuseAmps: z
      .union([z.literal(60), z.literal(80), z.literal(100)], { errorMap: () => ({ message: 'Choose 60, 80 or 100 A, or “not confirmed”.' }) })
      .nullable()
      .default(null),
    earthingMeasure: earthingMeasureField.default(null),
    measurements: measurementsSchema.default({}),
    notes: z
      .preprocess(blankToUndefined, z.string({ invalid_type_error: 'Write the notes as text.' }).trim().max(5000, 'Keep the notes under 5,000 characters.').optional()),
  })
  .strict()
  .superRefine((value, ctx) => {
    const needed = notesNeeded[value.outcome];
    if (needed && (value.notes ?? '').length < 10) ctx.addIssue({ code: 'custom', path: ['notes'], message: needed });
  });

export type OutcomeInput = z.input<typeof outcomeSchema>;
export type OutcomeBody = z.output<typeof outcomeSchema>;
export type Measurements = OutcomeBody['measurements'];

/**
 * The body of PUT /api/cases/:id/site-measures: what the office (or surveyor) records before the
 * visit, such as a maximum demand from smart-meter data. A field left out stays as it is; null
 * clears it.
 *
 * @example siteMeasuresSchema.parse({ measuredMaxDemandAmps: 41.5 }) // { measuredMaxDemandAmps: 41.5 }
 */
export const siteMeasuresSchema = z
  .object({
    measuredMaxDemandAmps: nullableReading('measuredMaxDemandAmps'),
    earthingMeasure: earthingMeasureField.optional(),
    electrodeOhms: nullableReading('electrodeOhms'),
    rcdIdnMilliamps: nullableReading('rcdIdnMilliamps'),
  })
  .strict()
  .refine((value) => Object.keys(value).length > 0, { message: 'Send at least one value to record.' });
export type SiteMeasuresBody = z.output<typeof siteMeasuresSchema>;

function nullableReading(id: MeasurementId) {
  const { label, unit, min, max } = measurementFields[id];
  const message = `${label}: give a number from ${min} to ${max} ${unit}, or null to clear it.`;
  return z.number({ invalid_type_error: message }).finite(message).min(min, message).max(max, message).nullable().optional();
}

/**
 * Applies recorded values over the saved ones: undefined keeps, null clears.
 *
 * @example mergeSiteMeasures({ electrodeOhms: 90 }, { electrodeOhms: null, rcdIdnMilliamps: 30 }) // { rcdIdnMilliamps: 30 }
 */
export function mergeSiteMeasures(saved: SiteMeasures, changes: Partial<Record<keyof SiteMeasures, unknown>>): SiteMeasures {
  const merged: Record<string, unknown> = { ...saved };
  for (const [key, value] of Object.entries(changes)) {
    if (value === undefined) continue;
    if (value === null) delete merged[key];
    else merged[key] = value;
  }
  return merged as SiteMeasures;
}

/**
 * What a recorded outcome adds to the case's site measures: the measure chosen, RA, IΔn and a
 * measured maximum demand, where the surveyor gave them.
 *
 * @example outcomeSiteMeasures({ earthingMeasure: 'tt-electrode', measurements: { electrodeOhms: 100, rcdIdnMilliamps: 30 } } as OutcomeBody)
 * // { earthingMeasure: 'tt-electrode', electrodeOhms: 100, rcdIdnMilliamps: 30 }
 */
export function outcomeSiteMeasures(body: Pick<OutcomeBody, 'earthingMeasure' | 'measurements'>): SiteMeasures {
  const found: SiteMeasures = {};
  if (body.earthingMeasure) found.earthingMeasure = body.earthingMeasure;
  const { electrodeOhms, rcdIdnMilliamps, measuredMaxDemandAmps } = body.measurements;
  if (typeof electrodeOhms === 'number') found.electrodeOhms = electrodeOhms;
  if (typeof rcdIdnMilliamps === 'number') found.rcdIdnMilliamps = rcdIdnMilliamps;
  if (typeof measuredMaxDemandAmps === 'number') found.measuredMaxDemandAmps = measuredMaxDemandAmps;
  return found;
}

/**
 * Reads the stored jsonb back into SiteMeasures, dropping anything that no longer fits.
 *
 * @example readSiteMeasures({ measuredMaxDemandAmps: 'x', electrodeOhms: 80 }) // { electrodeOhms: 80 }
 */
export function readSiteMeasures(value: unknown): SiteMeasures {
  if (!value || typeof value !== 'object' || Array.isArray(value)) return {};
  const raw = value as Record<string, unknown>;
  const found: SiteMeasures = {};
  const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);
  if (num(raw.measuredMaxDemandAmps) !== undefined) found.measuredMaxDemandAmps = num(raw.measuredMaxDemandAmps);
  if (num(raw.electrodeOhms) !== undefined) found.electrodeOhms = num(raw.electrodeOhms);
  if (num(raw.rcdIdnMilliamps) !== undefined) found.rcdIdnMilliamps = num(raw.rcdIdnMilliamps);
  if (typeof raw.earthingMeasure === 'string' && (earthingMeasureValues as readonly string[]).includes(raw.earthingMeasure)) {
    found.earthingMeasure = raw.earthingMeasure as EarthingMeasure;
  }
  return found;
}

/** What the survey confirmed, as the checks read it. */
export interface SiteFindings {
  confirmedEarthing: ConfirmedEarthing | null;
  confirmedFuseAmps: FuseRating | null;
}

/** A check result that may carry values the surveyor confirmed on site. */
export type SiteCheckResult = CheckResult & { confirmedOnSite?: boolean };

/** The checks each confirmed value feeds. */
const checksFedBy: Record<keyof SiteFindings, CheckId[]> = {
  confirmedEarthing: ['earthing'],
  confirmedFuseAmps: ['supply-headroom', 'network-operator'],
};

/**
 * The customer's answers with the confirmed earthing and main fuse put in their place; an
 * unconfirmed (null) value leaves the customer's answer standing.
 *
 * @example withSiteFindings({ supply: { earthing: 'unknown' } }, { confirmedEarthing: 'tns', confirmedFuseAmps: null }).supply?.earthing // 'tns'
 */
export function withSiteFindings(answers: ChecklistAnswers, findings: SiteFindings | null | undefined): ChecklistAnswers {
  if (!findings) return answers;
  const supply = { ...(answers.supply ?? {}) };
  if (findings.confirmedEarthing) supply.earthing = findings.confirmedEarthing;
  if (findings.confirmedFuseAmps) supply.mainFuseAmps = findings.confirmedFuseAmps;
  return { ...answers, supply };
}

/**
 * Marks the check results that rest on a confirmed value with `confirmedOnSite: true` and
 * says so in the staff text.
 *
 * @example markConfirmedOnSite(checks, { confirmedEarthing: 'tt', confirmedFuseAmps: null }).find((c) => c.id === 'earthing')?.confirmedOnSite // true
 */
export function markConfirmedOnSite(checks: readonly CheckResult[], findings: SiteFindings | null | undefined): SiteCheckResult[] {
  if (!findings) return [...checks];
  const notes = new Map<CheckId, string[]>();
  if (findings.confirmedEarthing) {
    for (const id of checksFedBy.confirmedEarthing) notes.set(id, [...(notes.get(id) ?? []), `earthing ${earthingLabels[findings.confirmedEarthing]}`]);
  }
  if (findings.confirmedFuseAmps) {
    for (const id of checksFedBy.confirmedFuseAmps) notes.set(id, [...(notes.get(id) ?? []), `${findings.confirmedFuseAmps} A cut-out fuse`]);
  }
  return checks.map((check) => {
    const confirmed = notes.get(check.id);
    if (!confirmed) return check;
    return { ...check, confirmedOnSite: true, staffText: `${check.staffText} ${capitalise(confirmed.join(' and '))} (confirmed on site).` };
  });
}

const capitalise = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);
