// Every checklist field as the form holds it: its path, its step, how it is typed and, for
// choices, which options span a whole row. The words — label, choices, hints and what a gap
// holds up — come from the vocabulary (src/lib/vocabulary/fields.ts), the one place they are
// written. Paths are the API's dotted paths ("supply.loads.showerKw").
import type { SectionId } from '@/lib/schemas/checklist';
import { fieldWords, type FieldPath } from '@/lib/vocabulary/fields';

/** How a field is typed in the form; decides the conversion to and from the API value. */
/** 'numchoice' is a choice saved as a number, except a 'unsure' option, saved as the word. */
export type FieldKind = 'text' | 'phone' | 'choice' | 'numchoice' | 'number' | 'integer' | 'yesno' | 'fuse';

export type Option = { value: string; label: string; hint?: string; /** Spans the whole row of a grid. */ wide?: boolean };

export type FieldDef = {
  path: string;
  section: SectionId;
  kind: FieldKind;
  label: string;
  /** What a gap here holds up, in the customer's words ("…needed for …"). */
  blocks: string;
  options?: Option[];
  unit?: string;
};

type FieldShape = { path: FieldPath; section: SectionId; kind: FieldKind; unit?: string; /** Options that span a whole row. */ wide?: string[] };

// A field's form shape with its customer words from the vocabulary.
function field({ path, section, kind, unit, wide = [] }: FieldShape): FieldDef {
  const words = fieldWords[path];
  const options = 'options' in words ? words.options : undefined;
  return {
    path,
    section,
    kind,
    label: words.question,
    blocks: words.blocks,
    ...(unit ? { unit } : {}),
    ...(options
      ? { options: options.map((o) => ({ value: o.value, label: o.customer, ...('hint' in o && o.hint ? { hint: o.hint } : {}), ...(wide.includes(o.value) ? { wide: true } : {}) })) }
      : {}),
  };
}

/** The fields in the order the steps show them. */
export const fieldDefs: FieldDef[] = [
  // About you
  field({ path: 'about.fullName', section: 'about', kind: 'text' }),
  field({ path: 'about.email', section: 'about', kind: 'text' }),
  field({ path: 'about.phone', section: 'about', kind: 'phone' }),
  field({ path: 'about.addressLine1', section: 'about', kind: 'text' }),
  field({ path: 'about.addressLine2', section: 'about', kind: 'text' }),
  field({ path: 'about.town', section: 'about', kind: 'text' }),
  field({ path: 'about.postcode', section: 'about', kind: 'text' }),
  field({ path: 'about.tenure', section: 'about', kind: 'choice' }),
  field({ path: 'about.propertyType', section: 'about', kind: 'choice' }),
  // Your vehicle
  field({ path: 'vehicle.make', section: 'vehicle', kind: 'text' }),
  field({ path: 'vehicle.model', section: 'vehicle', kind: 'text' }),
  field({ path: 'vehicle.condition', section: 'vehicle', kind: 'choice' }),
  field({ path: 'vehicle.registration', section: 'vehicle', kind: 'text' }),
  field({ path: 'vehicle.vin', section: 'vehicle', kind: 'text' }),
  field({ path: 'vehicle.deliveryDate', section: 'vehicle', kind: 'text' }),
  field({ path: 'vehicle.connector', section: 'vehicle', kind: 'choice' }),
  field({ path: 'vehicle.chargePort', section: 'vehicle', kind: 'choice' }),
  // Your supply
  field({ path: 'supply.mpanCore', section: 'supply', kind: 'text' }),
  field({ path: 'supply.mainFuseAmps', section: 'supply', kind: 'fuse', wide: ['unreadable'] }),
  field({ path: 'supply.looped', section: 'supply', kind: 'choice' }),
  field({ path: 'supply.consumerUnitLocation', section: 'supply', kind: 'text' }),
  field({ path: 'supply.earthing', section: 'supply', kind: 'choice' }),
  field({ path: 'supply.phases', section: 'supply', kind: 'choice' }),
  field({ path: 'supply.loads.socketCircuits', section: 'supply', kind: 'numchoice', wide: ['unsure'] }),
  field({ path: 'supply.loads.showerKw', section: 'supply', kind: 'number', unit: 'kW' }),
  field({ path: 'supply.loads.cooker', section: 'supply', kind: 'yesno' }),
  field({ path: 'supply.loads.immersion', section: 'supply', kind: 'yesno' }),
  field({ path: 'supply.loads.heatPumpKw', section: 'supply', kind: 'number', unit: 'kW' }),
  field({ path: 'supply.loads.storageHeaters', section: 'supply', kind: 'number', unit: 'kW' }),
  field({ path: 'supply.loads.otherEvCharger', section: 'supply', kind: 'yesno' }),
  field({ path: 'supply.loads.solarPv', section: 'supply', kind: 'yesno' }),
  // Parking
  field({ path: 'parking.kind', section: 'parking', kind: 'choice' }),
  field({ path: 'parking.cars', section: 'parking', kind: 'integer' }),
  field({ path: 'parking.habit', section: 'parking', kind: 'choice' }),
  // Charge point and cable route
  field({ path: 'charger.location', section: 'charger', kind: 'text' }),
  field({ path: 'charger.cableRunMetres', section: 'charger', kind: 'number', unit: 'm' }),
  field({ path: 'charger.route', section: 'charger', kind: 'choice' }),
  field({ path: 'charger.softGround', section: 'charger', kind: 'yesno' }),
  field({ path: 'charger.softGroundMetres', section: 'charger', kind: 'number', unit: 'm' }),
  field({ path: 'charger.preference', section: 'charger', kind: 'choice' }),
  field({ path: 'charger.tetherMetres', section: 'charger', kind: 'number', unit: 'm' }),
  field({ path: 'charger.ratingKw', section: 'charger', kind: 'numchoice' }),
];

/** Field definitions by dotted path. @example fieldByPath['supply.mpanCore'].label // 'MPAN, your 13-digit supply number' */
export const fieldByPath: Readonly<Record<string, FieldDef>> = Object.fromEntries(fieldDefs.map((f) => [f.path, f]));

/** The fields of one section, in the order the step shows them. */
export function fieldsOf(section: SectionId): FieldDef[] {
  return fieldDefs.filter((f) => f.section === section);
}

/** The words for a choice's saved value, or the value itself when it is not a known choice. */
export function optionLabel(def: FieldDef, value: string): string {
  return def.options?.find((o) => o.value === value)?.label ?? value;
}
