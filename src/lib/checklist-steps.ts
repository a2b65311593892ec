// Client-safe: the customer's checklist as steps. A step shows part of one data section (the
// supply section is split over two steps so neither is longer than about three phone screens);
// saved answers keep their section's JSON paths whatever step shows them.
import { sectionIds, sectionProgress, type Checklist, type SectionId } from './schemas/checklist';

export type StepId = 'about' | 'vehicle' | 'supply' | 'loads' | 'parking' | 'charger' | 'review';
export type DataStepId = Exclude<StepId, 'review'>;

const sectionTitle = (id: SectionId) => sectionIds.find(([s]) => s === id)![1] as string;

// Step titles of their own (the split supply section):
const METER_STEP_TITLE = 'Your meter and fuse';
const LOADS_STEP_TITLE = 'Fuse box and big electric loads';
const REVIEW_STEP_TITLE = 'Check and send';

/** The data steps in order, each with the section whose answers it holds. */
export const dataSteps: { id: DataStepId; section: SectionId; title: string }[] = [
  { id: 'about', section: 'about', title: sectionTitle('about') },
  { id: 'vehicle', section: 'vehicle', title: sectionTitle('vehicle') },
  { id: 'supply', section: 'supply', title: METER_STEP_TITLE },
  { id: 'loads', section: 'supply', title: LOADS_STEP_TITLE },
  { id: 'parking', section: 'parking', title: sectionTitle('parking') },
  { id: 'charger', section: 'charger', title: sectionTitle('charger') },
];

/** Every step, the last one being "Check and send". @example checklistSteps.at(-1) // { id: 'review', title: 'Check and send' } */
export const checklistSteps: { id: StepId; title: string }[] = [
  ...dataSteps.map(({ id, title }) => ({ id, title })),
  { id: 'review', title: REVIEW_STEP_TITLE },
];

// The supply fields shown on the second supply step: the consumer unit and what hangs off it.
const LOADS_STEP_FIELDS = new Set(['supply.consumerUnitLocation']);

/**
 * The step that shows a field, from its dotted path.
 * @example stepOfField('supply.loads.showerKw') // 'loads'
 * @example stepOfField('supply.mpanCore') // 'supply'
 */
export function stepOfField(path: string): DataStepId {
  if (path.startsWith('supply.loads') || LOADS_STEP_FIELDS.has(path)) return 'loads';
  const section = path.split('.')[0] as SectionId;
  return dataSteps.find((s) => s.section === section)?.id ?? 'about';
}

/** The step's title. @example stepTitle('loads') // 'Fuse box and big electric loads' */
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
  const sections = sectionProgress(checklist);
  return dataSteps.map(({ id, section, title }) => {
    const s = sections.find((p) => p.id === section)!;
    const missing = s.missing.map((field) => `${section}.${field}`).filter((path) => stepOfField(path) === id);
    const saved = (checklist[section] ?? {}) as Record<string, unknown>;
    const started = Object.keys(saved).some((key) => stepOfField(`${section}.${key}`) === id);
    return { id, title, complete: missing.length === 0, missing, toConfirm: missing.filter((p) => prefilled.includes(p)), started };
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
