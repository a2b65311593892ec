// The customer's checklist: one zod schema per section, shared by the form and the server so
// both apply the same rule. Pure and client-safe. JSON field names are part of the public API.
import { z, type ZodError, type ZodIssue } from 'zod';
import { checkIsoDate } from '@/lib/validation/date';
import { checkMpanCore } from '@/lib/validation/mpan';
import { checkUkPhone } from '@/lib/validation/phone';
import { checkPostcode } from '@/lib/validation/postcode';
import { checkRegistration } from '@/lib/validation/registration';
import { checkVin } from '@/lib/validation/vin';
import { drivewayPlanSchema } from '@/lib/readiness/plan';

/** The data sections, in the order the customer meets them, with their customer-facing titles. */
export const sectionIds = [
  ['about', 'About you'],
  ['vehicle', 'Your vehicle'],
  ['supply', 'Your supply'],
  ['parking', 'Parking'],
  ['charger', 'Charge point and cable route'],
] as const;

export type SectionId = (typeof sectionIds)[number][0];

/** Fields where a saved `null` is an answer, not a gap: null main fuse means "can't read it". */
export const nullIsAnAnswer: ReadonlySet<string> = new Set(['supply.mainFuseAmps']);

type Checked = { ok: true; value: string } | { ok: false; message: string };

// ---- field builders -------------------------------------------------------------------------

// Blank text clears a field, as emptying a box in the form should.
function text(max: number) {
  return z
    .string({ invalid_type_error: 'Please type this as text.' })
    .trim()
    .max(max, `Please keep this to ${max} characters or fewer.`)
    .transform((value) => (value === '' ? null : value))
    .nullish();
}

// Text run through one of the validators, stored in its normalised form.
function checkedText(max: number, check: (value: string) => Checked) {
  return z
    .string({ invalid_type_error: 'Please type this as text.' })
    .trim()
    .max(max, `Please keep this to ${max} characters or fewer.`)
    .transform((value, ctx) => {
      if (value === '') return null;
      const result = check(value);
      if (result.ok) return result.value;
      ctx.addIssue({ code: z.ZodIssueCode.custom, message: result.message });
      return z.NEVER;
    })
    .nullish();
}

function choice<T extends [string, ...string[]]>(values: T, message: string) {
  return z.enum(values, { errorMap: () => ({ message }) }).nullish();
}

function yesNo() {
  return z.boolean({ invalid_type_error: 'Please answer yes or no.', required_error: 'Please answer yes or no.' }).nullish();
}

function amount(min: number, max: number, message: string) {
  return z.number({ invalid_type_error: message }).min(min, message).max(max, message).nullish();
}

function count(min: number, max: number, message: string) {
  return z.number({ invalid_type_error: message }).int(message).min(min, message).max(max, message).nullish();
}

// ---- validators adapted to the field builders -----------------------------------------------

function emailField(value: string): Checked {
  return z.string().email().safeParse(value).success
    ? { ok: true, value }
    : { ok: false, message: 'Please check the e-mail address: it should look like name@example.com.' };
}

function phoneField(value: string): Checked {
  const result = checkUkPhone(value);
  return result.ok ? { ok: true, value: result.e164 } : result;
}

function postcodeField(value: string): Checked {
  const result = checkPostcode(value);
  return result.ok ? { ok: true, value: result.postcode } : result;
}

function registrationField(value: string): Checked {
  const result = checkRegistration(value);
  return result.ok ? { ok: true, value: result.registration } : result;
}

// A failed check digit is only a warning (see fieldWarnings), so it never blocks a save.
function vinField(value: string): Checked {
  const result = checkVin(value);
  return result.ok ? { ok: true, value: result.vin } : result;
}

function dateField(value: string): Checked {
  const result = checkIsoDate(value);
  return result.ok ? { ok: true, value: result.date } : result;
}

function mpanField(value: string): Checked {
  const result = checkMpanCore(value);
  return result.ok ? { ok: true, value: result.core } : { ok: false, message: result.message };
}

// ---- section schemas: every field optional, null clears it (used for PATCH merges) ----------

/**
 * About you. Phone is stored in E.164, postcode as "AB12 3DE".
 *
 * @example aboutPatchSchema.parse({ postcode: 'ab12 3de' }) // { postcode: 'AB12 3DE' }
 */
export const aboutPatchSchema = z
  .object({
    fullName: text(200),
    email: checkedText(254, emailField),
    phone: checkedText(40, phoneField),
    addressLine1: text(200),
    addressLine2: text(200),
    town: text(100),
    postcode: checkedText(20, postcodeField),
    tenure: choice(['owner', 'tenant'], 'Please choose whether you own or rent the home.'),
    propertyType: choice(['house', 'flat', 'other'], 'Please choose house, flat or other.'),
  })
  .strict();

/**
 * Your vehicle. Registration and VIN are stored normalised; a VIN check-digit mismatch is a warning.
 *
 * @example vehiclePatchSchema.parse({ registration: 'ab12cde' }) // { registration: 'AB12 CDE' }
 */
export const vehiclePatchSchema = z
  .object({
    make: text(100),
    model: text(100),
    condition: choice(['new', 'used'], 'Please choose new or used.'),
    registration: checkedText(20, registrationField),
    vin: checkedText(40, vinField),
    deliveryDate: checkedText(20, dateField),
    connector: choice(['type2', 'type1', 'unsure'], 'Please choose Type 2, Type 1 or not sure.'),
    chargePort: choice(
      ['front-left', 'front-right', 'front-centre', 'rear-left', 'rear-right', 'side-left', 'side-right'],
      'Please choose where the charging socket is on the car.',
    ),
  })
  .strict();

const SOCKETS_MESSAGE = 'Please give the number of socket circuits, from 1 to 20, or choose “not sure”.';

/** The big loads already in the home, which decide the supply headroom. */
export const loadsPatchSchema = z
  .object({
    showerKw: amount(0, 15, 'Please give the electric shower rating in kW, from 0 to 15 (0 if you have none).'),
    cooker: yesNo(),
    immersion: yesNo(),
    heatPumpKw: amount(0, 30, 'Please give the heat pump rating in kW, from 0 to 30 (0 if you have none).'),
    // A kW total across all storage heaters (not a count), as the demand check adds up kW.
    storageHeaters: amount(0, 40, 'Please give the storage heaters’ total rating in kW, from 0 to 40 (0 if you have none).'),
    otherEvCharger: yesNo(),
    solarPv: yesNo(),
    // Counted from the labels in the consumer unit (or its photo); "not sure" is an answer.
    socketCircuits: z
      .union([z.number().int(SOCKETS_MESSAGE).min(1, SOCKETS_MESSAGE).max(20, SOCKETS_MESSAGE), z.literal('unsure')], {
        errorMap: () => ({ message: SOCKETS_MESSAGE }),
      })
      .nullish(),
  })
  .strict();

/** The load fields, for completeness and for forms that list them. */
export const loadFields = Object.keys(loadsPatchSchema.shape) as (keyof typeof loadsPatchSchema.shape)[];

/**
 * Your supply. The MPAN core is stored as 13 digits; mainFuseAmps null means "can't read it".
 *
 * @example supplyPatchSchema.parse({ mpanCore: '13 1234 5678 907' }) // { mpanCore: '1312345678907' }
 */
export const supplyPatchSchema = z
  .object({
    mpanCore: checkedText(40, mpanField),
    mainFuseAmps: z
      .union([z.literal(60), z.literal(80), z.literal(100)], {
        errorMap: () => ({ message: 'Please choose 60, 80 or 100 A, or “I can’t read it”.' }),
      })
      .nullish(),
    looped: choice(['yes', 'no', 'unsure'], 'Please choose yes, no or not sure.'),
    consumerUnitLocation: text(500),
    earthing: choice(['pme', 'tns', 'tt', 'unknown'], 'Please choose an earthing type, or “I don’t know”.'),
    phases: choice(['single', 'three', 'unsure'], 'Please choose single phase, three phase or not sure.'),
    loads: loadsPatchSchema.nullish(),
  })
  .strict();

/** Parking. @example parkingPatchSchema.parse({ cars: 2 }) // { cars: 2 } */
export const parkingPatchSchema = z
  .object({
    kind: choice(['attached-drive', 'garage', 'detached-bay', 'none'], 'Please choose the kind of parking you have.'),
    cars: count(0, 10, 'Please give the number of cars as a whole number, from 0 to 10.'),
    habit: choice(['nose-in', 'reverse-in', 'varies'], 'Please choose how you usually park.'),
  })
  .strict();

/** Charge point and cable route. `plan` is the to-scale driveway sketch (src/lib/readiness/plan.ts). */
export const chargerPatchSchema = z
  .object({
    location: text(500),
    cableRunMetres: amount(0, 200, 'Please give the cable length in metres, from 0 to 200. A rough guess is fine.'),
    route: choice(['through-wall', 'along-wall', 'through-house', 'buried'], 'Please choose how the cable could get there.'),
    softGround: yesNo(),
    softGroundMetres: amount(0, 100, 'Please give the distance to soft ground in metres, from 0 to 100.'),
    preference: choice(['tethered', 'socketed'], 'Please choose tethered or socketed.'),
    ratingKw: z
      .union([z.literal(3.6), z.literal(7.4), z.literal(11), z.literal(22)], {
        errorMap: () => ({ message: 'Please choose 3.6, 7.4, 11 or 22 kW.' }),
      })
      .nullish(),
    tetherMetres: amount(1, 25, 'Please give the cable length in metres, from 1 to 25.'),
    plan: drivewayPlanSchema.nullish(),
  })
  .strict();

/** Each section's PATCH schema by id. */
export const sectionPatchSchemas = {
  about: aboutPatchSchema,
  vehicle: vehiclePatchSchema,
  supply: supplyPatchSchema,
  parking: parkingPatchSchema,
  charger: chargerPatchSchema,
} as const;

/**
 * A PATCH body: any subset of sections, each any subset of its fields. Unknown sections or
 * fields are refused, so a typo never saves silently.
 *
 * @example checklistPatchSchema.safeParse({ supply: { mpan: '1' } }).success // false
 */
export const checklistPatchSchema = z
  .object(
    {
      about: aboutPatchSchema.optional(),
      vehicle: vehiclePatchSchema.optional(),
      supply: supplyPatchSchema.optional(),
      parking: parkingPatchSchema.optional(),
      charger: chargerPatchSchema.optional(),
    },
    { invalid_type_error: 'The checklist must be sent as a JSON object of sections.' },
  )
  .strict();

export type AboutSection = z.output<typeof aboutPatchSchema>;
export type VehicleSection = z.output<typeof vehiclePatchSchema>;
export type SupplySection = z.output<typeof supplyPatchSchema>;
export type Loads = z.output<typeof loadsPatchSchema>;
export type ParkingSection = z.output<typeof parkingPatchSchema>;
export type ChargerSection = z.output<typeof chargerPatchSchema>;
/** A parsed PATCH body (normalised values; null means clear). */
export type ChecklistPatch = z.output<typeof checklistPatchSchema>;
/** What a form sends before parsing. */
export type ChecklistPatchInput = z.input<typeof checklistPatchSchema>;
/** The saved checklist: each section partial, as the customer fills it in over several sittings. */
export type Checklist = { [K in SectionId]?: z.output<(typeof sectionPatchSchemas)[K]> };

// ---- completeness ---------------------------------------------------------------------------

type SectionData<K extends SectionId> = NonNullable<Checklist[K]>;

/**
 * The fields each section needs to count as complete, given what is saved so far (some are
 * conditional). A VIN is enough in place of a registration; with neither, "registration" is
 * the gap named. Load fields are named "loads.showerKw" and so on.
 *
 * @example sectionRequiredFields.charger({ preference: 'tethered' }).includes('tetherMetres') // true
 */
export const sectionRequiredFields: { [K in SectionId]: (section: SectionData<K>) => string[] } = {
  about: () => ['fullName', 'email', 'phone', 'addressLine1', 'town', 'postcode', 'tenure', 'propertyType'],
  vehicle: (vehicle) => [
    'make',
    'model',
    'condition',
    hasValue(vehicle.vin) && !hasValue(vehicle.registration) ? 'vin' : 'registration',
    'deliveryDate',
    'connector',
    'chargePort',
  ],
  supply: () => [
    'mpanCore',
    'mainFuseAmps',
    'looped',
    'consumerUnitLocation',
    'earthing',
    'phases',
    ...loadFields.map((field) => `loads.${field}`),
  ],
  parking: () => ['kind', 'cars', 'habit'],
  charger: (charger) => [
    'location',
    'cableRunMetres',
    'route',
    'softGround',
    ...(charger.softGround === true ? ['softGroundMetres'] : []),
    'preference',
    ...(charger.preference === 'tethered' ? ['tetherMetres'] : []),
    'ratingKw',
  ],
};

export type SectionProgress = { id: SectionId; title: string; complete: boolean; missing: string[] };

/**
 * Which sections are complete and which fields each one still lacks.
 *
 * @example sectionProgress({})[0] // { id: 'about', title: 'About you', complete: false, missing: ['fullName', …] }
 */
export function sectionProgress(checklist: Checklist): SectionProgress[] {
  return sectionIds.map(([id, title]) => {
    const section = (checklist[id] ?? {}) as Record<string, unknown>;
    const required = (sectionRequiredFields[id] as (s: Record<string, unknown>) => string[])(section);
    const missing = required.filter((field) => !isAnswered(section, `${id}.${field}`, field));
    return { id, title, complete: missing.length === 0, missing };
  });
}

// A field is answered when it holds a value; null counts only where null is itself an answer.
function isAnswered(section: Record<string, unknown>, fullPath: string, field: string): boolean {
  const parts = field.split('.');
  const key = parts.pop()!;
  const owner = parts.reduce<unknown>((node, part) => (isRecord(node) ? node[part] : undefined), section);
  if (!isRecord(owner) || !(key in owner)) return false;
  return owner[key] === null ? nullIsAnAnswer.has(fullPath) : hasValue(owner[key]);
}

function hasValue(value: unknown): boolean {
  return value !== undefined && value !== null && value !== '';
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

// ---- warnings -------------------------------------------------------------------------------

/**
 * Advice that never blocks a save: a VIN failing the North American check digit, an unusual
 * registration. Keys are dotted paths.
 *
 * @example fieldWarnings({ vehicle: { vin: '1M8GDM9A1KP042788' } }) // { 'vehicle.vin': 'The check character …' }
 */
export function fieldWarnings(checklist: Checklist, today: Date = new Date()): Record<string, string> {
  const warnings = new Map<string, string>();
  const { vin, registration } = checklist.vehicle ?? {};
  if (vin) {
    const result = checkVin(vin);
    if (result.ok && result.warning) warnings.set('vehicle.vin', result.warning);
  }
  if (registration) {
    const result = checkRegistration(registration, today);
    if (result.ok && result.warning) warnings.set('vehicle.registration', result.warning);
  }
  return Object.fromEntries(warnings);
}

// ---- consistency across sections ------------------------------------------------------------

/**
 * Answers that cannot stand together once merged: an 11 or 22 kW charge point needs a
 * three-phase supply, so it is refused on a supply the customer says is single phase. Keyed by
 * the field the customer should change.
 *
 * @example checklistConflicts({ supply: { phases: 'single' }, charger: { ratingKw: 22 } }) // { 'charger.ratingKw': 'An 11 or 22 kW charger …' }
 */
export function checklistConflicts(checklist: Checklist): Record<string, string> {
  const phases = checklist.supply?.phases;
  const rating = checklist.charger?.ratingKw;
  if (phases === 'single' && (rating === 11 || rating === 22)) {
    return {
      'charger.ratingKw':
        'An 11 or 22 kW charger needs a three-phase supply, and your supply is single phase. Please choose 3.6 or 7.4 kW, or change the supply answer if it is three phase.',
    };
  }
  return {};
}

// ---- merging and errors ---------------------------------------------------------------------

/**
 * Merges a parsed PATCH into the saved checklist: given fields replace saved ones, null
 * removes a field (except where null is an answer), loads merge field by field, and `plan`
 * is replaced whole. Returns a new object; neither input is changed.
 *
 * @example mergeChecklist({ about: { town: 'Oldtown' } }, { about: { town: null } }) // { about: {} }
 */
export function mergeChecklist(saved: Checklist, patch: ChecklistPatch): Checklist {
  const merged: Record<string, unknown> = { ...saved };
  for (const [id] of sectionIds) {
    const changes = patch[id];
    if (changes) merged[id] = mergeFields(asRecord(saved[id]), changes, id);
  }
  return merged as Checklist;
}

function mergeFields(saved: Record<string, unknown>, changes: Record<string, unknown>, prefix: string) {
  const merged: Record<string, unknown> = { ...saved };
  for (const [key, value] of Object.entries(changes)) {
    const path = `${prefix}.${key}`;
    if (value === undefined) continue;
    if (value === null && !nullIsAnAnswer.has(path)) delete merged[key];
    else if (path === 'supply.loads' && isRecord(value)) merged[key] = mergeFields(asRecord(saved[key]), value, path);
    else merged[key] = value;
  }
  return merged;
}

function asRecord(value: unknown): Record<string, unknown> {
  return isRecord(value) ? value : {};
}

const UNKNOWN_FIELD_MESSAGE = 'This is not a field of the checklist.';

/**
 * Maps zod issues to dotted field paths with the first message for each; an unknown key is
 * named by its own path, and an issue with the whole body is keyed "root".
 *
 * @example zodIssuesToFields(checklistPatchSchema.safeParse({ supply: { mpanCore: '12' } }).error!)
 * // { 'supply.mpanCore': 'An MPAN core has 13 digits; this has 2. …' }
 */
export function zodIssuesToFields(error: ZodError): Record<string, string> {
  const fields = new Map<string, string>();
  for (const issue of error.issues) {
    for (const [path, message] of issueFields(issue)) {
      if (!fields.has(path)) fields.set(path, message);
    }
  }
  return Object.fromEntries(fields);
}

function issueFields(issue: ZodIssue): [string, string][] {
  if (issue.code === z.ZodIssueCode.unrecognized_keys) {
    return issue.keys.map((key) => [dottedPath([...issue.path, key]), UNKNOWN_FIELD_MESSAGE]);
  }
  return [[dottedPath(issue.path), issue.message]];
}

function dottedPath(path: (string | number)[]): string {
  return path.length === 0 ? 'root' : path.join('.');
}
