// Where the customer stands: the steps, each step's state, the gaps and how answers read back.
import { checklistPatchSchema, mergeChecklist, type Checklist, type SectionId } from '@/lib/schemas/checklist';
import { checklistSteps, stepOfField, stepProgress, type DataStepId, type StepProgress } from '@/lib/checklist-steps';
import { checkMpanCore } from '@/lib/validation/mpan';
import { checkUkPhone } from '@/lib/validation/phone';
import { fieldByPath, fieldDefs, fieldsOf, optionLabel, type FieldDef } from './field-defs';
import { checkFormValue, editsToPatch, valueAt, type Edits } from './form-values';

export type { StepId, StepProgress } from '@/lib/checklist-steps';
export { stepFromHash, stepHash, resumeStep, stepOfField } from '@/lib/checklist-steps';

/** Every step in order, "Check and send" last. @example steps.at(-1) // { id: 'review', title: 'Check and send' } */
export const steps = checklistSteps;

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

/** Complete, started with gaps, or not started, for one step. Details to confirm count as started. */
export function stepState(progress: StepProgress): StepState {
  if (progress.complete) return 'complete';
  return progress.started || progress.toConfirm.length > 0 ? 'gaps' : 'not-started';
}

/** Progress for every data step of a checklist; `prefilled` are the unconfirmed details from the invitation. */
export function progressOf(checklist: Checklist, prefilled: readonly string[] = []): StepProgress[] {
  return stepProgress(checklist, prefilled);
}

/** A missing field's words, from its dotted path: its label and what it holds up. */
export function gapWords(path: string): { label: string; blocks: string } {
  const def = fieldByPath[path];
  return { label: def?.label ?? path, blocks: def?.blocks ?? '' };
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

/** The summary rows of one checklist step (a step may show fields of another section). */
export function stepSummaryRows(step: DataStepId, checklist: Checklist): { def: FieldDef; value: string | null }[] {
  return fieldDefs
    .filter((def) => stepOfField(def.path) === step && isRelevant(def, checklist))
    .map((def) => ({ def, value: displayValue(def, checklist) }));
}
