// Where the customer stands: the steps, each step's state, the gaps and how answers read back.
import {
  checklistPatchSchema,
  mergeChecklist,
  sectionIds,
  sectionProgress,
  type Checklist,
  type SectionId,
  type SectionProgress,
} from '../../lib/schemas/checklist';
import { checkMpanCore } from '../../lib/validation/mpan';
import { checkUkPhone } from '../../lib/validation/phone';
import { fieldByPath, fieldsOf, optionLabel, type FieldDef } from './field-defs';
import { checkFormValue, editsToPatch, valueAt, type Edits } from './form-values';

export type StepId = SectionId | 'review';

/** The six steps in order. @example steps[5] // { id: 'review', title: 'Check and send' } */
export const steps: { id: StepId; title: string }[] = [
  ...sectionIds.map(([id, title]) => ({ id: id as StepId, title: title as string })),
  { id: 'review', title: 'Check and send' },
];

/** A step id from the URL hash ("#step=supply"), or null. */
export function stepFromHash(hash: string): StepId | null {
  const id = new URLSearchParams(hash.replace(/^#/, '')).get('step');
  return steps.some((s) => s.id === id) ? (id as StepId) : null;
}

export function stepHash(id: StepId): string {
  return `#step=${id}`;
}

/**
 * The saved checklist with the customer's valid unsaved edits laid over it, so progress and the
 * summary reflect what is on screen even before the server has it.
 */
export function localChecklist(saved: Checklist, edits: Edits): Checklist {
  const valid = Object.fromEntries(Object.entries(edits).filter(([path, value]) => checkFormValue(path, value).ok));
  const parsed = checklistPatchSchema.safeParse(editsToPatch(valid));
  return parsed.success ? mergeChecklist(saved, parsed.data) : saved;
}

export type StepState = 'complete' | 'gaps' | 'not-started';

/** Complete, started with gaps, or not started, for one section. */
export function sectionState(progress: SectionProgress, checklist: Checklist): StepState {
  if (progress.complete) return 'complete';
  const section = checklist[progress.id] as Record<string, unknown> | undefined;
  return section && Object.keys(section).length > 0 ? 'gaps' : 'not-started';
}

/** Progress for every section of a checklist. */
export function progressOf(checklist: Checklist): SectionProgress[] {
  return sectionProgress(checklist);
}

/** A missing field's words: its label and what it holds up. */
export function gapWords(section: SectionId, missing: string): { label: string; blocks: string } {
  const def = fieldByPath[`${section}.${missing}`];
  return { label: def?.label ?? missing, blocks: def?.blocks ?? '' };
}

/** Whether a field belongs in the summary at all, given the other answers. */
export function isRelevant(def: FieldDef, checklist: Checklist): boolean {
  const has = (path: string) => {
    const { value } = valueAt(checklist, path);
    return value !== undefined && value !== null && value !== '';
  };
  switch (def.path) {
    case 'about.addressLine2':
      return has(def.path);
    case 'vehicle.vin':
      return has('vehicle.vin');
    case 'vehicle.registration':
      return has('vehicle.registration') || !has('vehicle.vin');
    case 'charger.softGroundMetres':
      return checklist.charger?.softGround === true;
    case 'charger.tetherMetres':
      return checklist.charger?.preference === 'tethered';
    default:
      return true;
  }
}

const dateFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

/**
 * How a saved answer reads in the summary, or null when it is not answered.
 *
 * @example displayValue(fieldByPath['supply.mainFuseAmps'], { supply: { mainFuseAmps: null } }) // 'I can’t read it'
 */
export function displayValue(def: FieldDef, checklist: Checklist): string | null {
  const { present, value } = valueAt(checklist, def.path);
  if (def.kind === 'fuse' && present && value === null) return 'I can’t read it';
  if (value === undefined || value === null || value === '') return null;
  if (def.kind === 'yesno') return value === true ? 'Yes' : 'No';
  if (def.kind === 'fuse') return `${value} A`;
  if (def.kind === 'choice' || def.kind === 'numchoice') return optionLabel(def, String(value));
  if ((def.kind === 'number' || def.kind === 'integer') && def.unit) return `${value} ${def.unit}`;
  if (def.kind === 'phone') {
    const phone = checkUkPhone(String(value));
    return phone.ok ? phone.display : String(value);
  }
  if (def.path === 'vehicle.deliveryDate') return dateFormat.format(new Date(`${value}T00:00:00Z`));
  if (def.path === 'supply.mpanCore') {
    const mpan = checkMpanCore(String(value));
    const core = String(value);
    const spaced = `${core.slice(0, 2)} ${core.slice(2, 6)} ${core.slice(6, 10)} ${core.slice(10)}`;
    return mpan.ok ? `${spaced} (${mpan.region})` : spaced;
  }
  return String(value);
}

/** The summary rows of a section: label and answer (null when not answered). */
export function summaryRows(section: SectionId, checklist: Checklist): { def: FieldDef; value: string | null }[] {
  return fieldsOf(section)
    .filter((def) => isRelevant(def, checklist))
    .map((def) => ({ def, value: displayValue(def, checklist) }));
}
