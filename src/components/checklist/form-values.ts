// The form holds every answer as a string (what an input gives); these helpers turn form values
// into the API's values and back, and validate them with the very schemas the server uses.
import { z, type ZodTypeAny } from 'zod';
import {
  checklistPatchSchema,
  loadsPatchSchema,
  sectionPatchSchemas,
  type Checklist,
  type ChecklistPatch,
  type ChecklistPatchInput,
  type SectionId,
} from '@/lib/schemas/checklist';
import { checkUkPhone } from '@/lib/validation/phone';
import { fieldByPath, fieldDefs, type FieldDef } from './field-defs';

/** Form values: sections of strings, with supply.loads nested, mirroring the API's paths. */
// Loosely typed on purpose: react-hook-form then takes any dotted path as a field name.
export type FormValues = Record<string, any>;

/** Unsaved edits by dotted path, as the form holds them. */
export type Edits = Record<string, string>;

/** What an API value at `path` is in the saved checklist, if anything. */
export function valueAt(source: unknown, path: string): { present: boolean; value: unknown } {
  let node: unknown = source;
  for (const part of path.split('.')) {
    if (typeof node !== 'object' || node === null || !(part in node)) return { present: false, value: undefined };
    node = (node as Record<string, unknown>)[part];
  }
  return { present: true, value: node };
}

function setAt(target: Record<string, unknown>, path: string, value: unknown) {
  const parts = path.split('.');
  const key = parts.pop()!;
  let node = target;
  for (const part of parts) {
    if (typeof node[part] !== 'object' || node[part] === null) node[part] = {};
    node = node[part] as Record<string, unknown>;
  }
  node[key] = value;
}

type ApiValue = { send: false } | { send: true; value: unknown };

/**
 * The API value for a form value: blank text or numbers clear the field (null); a choice can't
 * be un-chosen, so a blank one sends nothing. Numbers that don't parse go as typed, so the
 * schema's own message explains the problem.
 *
 * @example toApiValue(fieldByPath['supply.mainFuseAmps'], 'unreadable') // { send: true, value: null }
 */
export function toApiValue(def: FieldDef, raw: string): ApiValue {
  const value = raw.trim();
  switch (def.kind) {
    case 'text':
    case 'phone':
      return { send: true, value: value === '' ? null : raw };
    case 'number':
    case 'integer': {
      if (value === '') return { send: true, value: null };
      const n = Number(value.replace(',', '.'));
      return { send: true, value: Number.isFinite(n) ? n : value };
    }
    case 'yesno':
      return value === '' ? { send: false } : { send: true, value: value === 'yes' };
    case 'fuse':
      if (value === '') return { send: false };
      return { send: true, value: value === 'unreadable' ? null : Number(value) };
    case 'choice':
      return value === '' ? { send: false } : { send: true, value };
    case 'numchoice':
      if (value === '') return { send: false };
      return { send: true, value: value === 'unsure' ? value : Number(value) };
  }
}

/**
 * The form value for what the server saved: phone numbers shown the national way, yes/no as words.
 *
 * @example fromApiValue(fieldByPath['about.phone'], { about: { phone: '+441134960000' } }) // '0113 496 0000'
 */
export function fromApiValue(def: FieldDef, checklist: Checklist): string {
  const { present, value } = valueAt(checklist, def.path);
  if (def.kind === 'fuse' && present && value === null) return 'unreadable';
  if (value === undefined || value === null) return '';
  if (def.kind === 'yesno') return value === true ? 'yes' : 'no';
  if (def.kind === 'phone' && typeof value === 'string') {
    const phone = checkUkPhone(value);
    return phone.ok ? phone.display : value;
  }
  return String(value);
}

/** All form values for a saved checklist. @example checklistToForm({}).about.fullName // '' */
export function checklistToForm(checklist: Checklist): FormValues {
  const values: FormValues = {};
  for (const def of fieldDefs) setAt(values, def.path, fromApiValue(def, checklist));
  return values;
}

/**
 * A PATCH body for the given edits, nested by section (loads inside supply).
 *
 * @example editsToPatch({ 'supply.loads.cooker': 'yes' }) // { supply: { loads: { cooker: true } } }
 */
export function editsToPatch(edits: Edits): ChecklistPatchInput {
  const body: Record<string, unknown> = {};
  for (const [path, raw] of Object.entries(edits)) {
    const def = fieldByPath[path];
    if (!def) continue;
    const api = toApiValue(def, raw);
    if (api.send) setAt(body, path, api.value);
  }
  return body as ChecklistPatchInput;
}

/** The zod schema of one field: the section schema's own, so the rule is the server's. */
export function fieldSchema(path: string): ZodTypeAny | undefined {
  const [section, field, sub] = path.split('.') as [SectionId, string, string | undefined];
  if (section === 'supply' && field === 'loads' && sub) return loadsPatchSchema.shape[sub as keyof typeof loadsPatchSchema.shape];
  const schema = sectionPatchSchemas[section];
  return schema ? (schema.shape as Record<string, ZodTypeAny>)[field] : undefined;
}

/**
 * Whether a form value would be accepted by the server, with the server's message when not.
 *
 * @example checkFormValue('supply.mpanCore', '1312345678906').ok // false (check digit should be 7)
 */
export function checkFormValue(path: string, raw: string): { ok: true } | { ok: false; message: string } {
  const def = fieldByPath[path];
  const schema = fieldSchema(path);
  if (!def || !schema) return { ok: false, message: 'This is not a field of the checklist.' };
  const api = toApiValue(def, raw);
  if (!api.send) return { ok: true };
  const parsed = schema.safeParse(api.value);
  return parsed.success ? { ok: true } : { ok: false, message: parsed.error.issues[0]?.message ?? 'Please check this answer.' };
}

// Only filled-in fields are validated as you type: a blank is a gap, not an error.
function filledToPatch(values: unknown): ChecklistPatchInput {
  const edits: Edits = {};
  for (const def of fieldDefs) {
    const { value } = valueAt(values, def.path);
    if (typeof value === 'string' && value.trim() !== '') edits[def.path] = value;
  }
  return editsToPatch(edits);
}

/**
 * The form's resolver schema: the form's strings turned into API values, then the server's own
 * checklistPatchSchema, so an error in the browser is the error the server would give.
 */
export const formSchema = z.preprocess(filledToPatch, checklistPatchSchema) as unknown as z.ZodType<ChecklistPatch, z.ZodTypeDef, FormValues>;
