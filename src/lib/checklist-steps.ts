// Client-safe: the customer's checklist as steps. A step shows part of one data section (the
// supply section is split over two steps so neither is longer than about three phone screens);
// saved answers keep their section's JSON paths whatever step shows them.
import { sectionIds, sectionProgress, type Checklist, type SectionId } from './schemas/checklist';

export type StepId = 'about' | 'home' | 'vehicle' | 'supply' | 'fusebox' | 'supplyphotos' | 'loads' | 'parking' | 'charger' | 'chargepoint' | 'review';
/** The steps that hold answers (the supply photos step and Check and send hold none). */
export type DataStepId = Exclude<StepId, 'review' | 'supplyphotos'>;

const sectionTitle = (id: SectionId) => sectionIds.find(([s]) => s === id)![1] as string;

// Step titles of their own (the supply and charger sections are split over several steps):
const HOME_STEP_TITLE = 'Your home';
const METER_STEP_TITLE = 'Your meter and fuse';
const FUSEBOX_STEP_TITLE = 'Your consumer unit and earthing';
const SUPPLY_PHOTOS_STEP_TITLE = 'Photos of your supply';
const LOADS_STEP_TITLE = 'Big electric loads';
const CHARGEPOINT_STEP_TITLE = 'Which charge point';
const REVIEW_STEP_TITLE = 'Check and send';

/** The data steps in order, each with the section whose answers it holds. */
export const dataSteps: { id: DataStepId; section: SectionId; title: string }[] = [
  { id: 'about', section: 'about', title: sectionTitle('about') },
  { id: 'home', section: 'about', title: HOME_STEP_TITLE },
  { id: 'vehicle', section: 'vehicle', title: sectionTitle('vehicle') },
  { id: 'supply', section: 'supply', title: METER_STEP_TITLE },
  { id: 'fusebox', section: 'supply', title: FUSEBOX_STEP_TITLE },
  { id: 'loads', section: 'supply', title: LOADS_STEP_TITLE },
  { id: 'parking', section: 'parking', title: sectionTitle('parking') },
  { id: 'charger', section: 'charger', title: sectionTitle('charger') },
  { id: 'chargepoint', section: 'charger', title: CHARGEPOINT_STEP_TITLE },
];

/**
 * Every step in order: the data steps, with the supply photos (meter, cut-out, consumer unit)
 * after the consumer unit's step, and "Check and send" last.
 * @example checklistSteps.at(-1) // { id: 'review', title: 'Check and send' }
 */
export const checklistSteps: { id: StepId; title: string }[] = [
  ...dataSteps.flatMap(({ id, title }) => [{ id, title }, ...(id === 'fusebox' ? [{ id: 'supplyphotos' as const, title: SUPPLY_PHOTOS_STEP_TITLE }] : [])]),
  { id: 'review', title: REVIEW_STEP_TITLE },
];

// Fields shown on a later step than their section's first one; every supply.loads.* is on 'loads'.
const LATER_STEP: Readonly<Record<string, DataStepId>> = {
  'about.addressLine1': 'home',
  'about.addressLine2': 'home',
  'about.town': 'home',
  'about.postcode': 'home',
  'about.tenure': 'home',
  'about.propertyType': 'home',
  // Beside how the car is parked: the two together decide how far the cable must reach.
  'vehicle.chargePort': 'parking',
  'supply.consumerUnitLocation': 'fusebox',
  'supply.earthing': 'fusebox',
  'supply.phases': 'fusebox',
  'charger.preference': 'chargepoint',
  'charger.tetherMetres': 'chargepoint',
  'charger.ratingKw': 'chargepoint',
  'charger.plan': 'chargepoint',
};

/**
 * The step that shows a field, from its dotted path.
 * @example stepOfField('supply.loads.showerKw') // 'loads'
 * @example stepOfField('supply.mpanCore') // 'supply'
 */
export function stepOfField(path: string): DataStepId {
  if (path === 'supply.loads' || path.startsWith('supply.loads.')) return 'loads';
  if (LATER_STEP[path]) return LATER_STEP[path]!;
  const section = path.split('.')[0] as SectionId;
  return dataSteps.find((s) => s.section === section)?.id ?? 'about';
}

/** The step's title. @example stepTitle('loads') // 'Big electric loads' */
export function stepTitle(id: StepId): string {
  return checklistSteps.find((s) => s.id === id)?.title ?? id;
}

export type StepProgress = {
  id: DataStepId;
  title: string;
  complete: boolean;
  /** Dotted paths still unanswered (including details from the installer not yet confirmed). */
  missing: string[];
  /** Of those, the ones the installer's invitation filled in, waiting for the customer to confirm. */
  toConfirm: string[];
  /** Whether anything on this step has been answered. */
  started: boolean;
};

/**
 * Where each data step stands. `prefilled` are the dotted paths the form shows from the
 * invitation but the customer has not confirmed: they are still gaps, named "to check".
 *
 * @example stepProgress({}, ['about.fullName'])[0].toConfirm // ['about.fullName']
 */
export function stepProgress(checklist: Checklist, prefilled: readonly string[] = []): StepProgress[] {
  // A step may show a field of another section (the car's socket beside parking), so gaps are
  // gathered from every section, then handed to the step that shows each one.
  const gaps = sectionProgress(checklist).flatMap((s) => s.missing.map((field) => `${s.id}.${field}`));
  const answered = sectionIds.flatMap(([id]) => Object.keys((checklist[id] ?? {}) as Record<string, unknown>).map((key) => `${id}.${key}`));
  return dataSteps.map(({ id, title }) => {
    const toConfirm = prefilled.filter((path) => stepOfField(path) === id);
    const unanswered = gaps.filter((path) => stepOfField(path) === id);
    // An unconfirmed detail from the invitation is still a gap, however filled in it looks.
    const missing = [...unanswered, ...toConfirm.filter((path) => !unanswered.includes(path))];
    const started = answered.some((path) => stepOfField(path) === id && !toConfirm.includes(path));
    return { id, title, complete: missing.length === 0, missing, toConfirm, started };
  });
}

/** A step id from the URL hash ("#step=supply"), or null. */
export function stepFromHash(hash: string): StepId | null {
  const id = new URLSearchParams(hash.replace(/^#/, '')).get('step');
  return checklistSteps.some((s) => s.id === id) ? (id as StepId) : null;
}

export function stepHash(id: StepId): string {
  return `#step=${id}`;
}

/** The first step with something missing, so a returning customer lands where they left off. */
export function resumeStep(progress: StepProgress[]): StepId {
  return progress.find((p) => !p.complete)?.id ?? 'review';
}
