// The vocabulary covers the checklist: every choice any checklist schema accepts — found by
// walking the zod schemas themselves, not by a list written here — has words for the customer
// and for staff, and every field has its question, gap words and staff label.
import { describe, expect, it } from 'vitest';
import { z, type ZodTypeAny } from 'zod';
import { sectionPatchSchemas } from '@/lib/schemas/checklist';
import { fieldWords, optionWords, staffLabel, wordsFor, customerGapLabel } from '@/lib/vocabulary/fields';
import { staffAnswer } from '@/lib/vocabulary/answers';
import { portLabels, portStaffLabels, wayLabels } from '@/lib/vocabulary/plan';

type Found = { path: string; choices: string[] };

// Peels the wrappers zod puts round a field (optional, nullable, effects, default).
function unwrap(schema: ZodTypeAny): ZodTypeAny {
  let s = schema;
  for (;;) {
    if (s instanceof z.ZodOptional || s instanceof z.ZodNullable) s = s.unwrap();
    else if (s instanceof z.ZodEffects) s = s.innerType();
    else if (s instanceof z.ZodDefault) s = s._def.innerType;
    else return s;
  }
}

/** Every field path under a schema, with the fixed choices it accepts (enum options, literals). */
function walk(schema: ZodTypeAny, path: string, out: Found[], leaves: string[]) {
  const s = unwrap(schema);
  if (s instanceof z.ZodObject) {
    for (const [key, child] of Object.entries(s.shape as Record<string, ZodTypeAny>)) walk(child, `${path}.${key}`, out, leaves);
    return;
  }
  if (s instanceof z.ZodArray) return walk(s.element, path, out, leaves);
  leaves.push(path);
  if (s instanceof z.ZodEnum) out.push({ path, choices: [...(s.options as string[])] });
  else if (s instanceof z.ZodLiteral) out.push({ path, choices: [String(s.value)] });
  else if (s instanceof z.ZodUnion) {
    const literals = (s.options as ZodTypeAny[]).map(unwrap).filter((o): o is z.ZodLiteral<unknown> => o instanceof z.ZodLiteral);
    if (literals.length) out.push({ path, choices: literals.map((l) => String(l.value)) });
  }
}

const found: Found[] = [];
const leaves: string[] = [];
for (const [section, schema] of Object.entries(sectionPatchSchemas)) walk(schema as ZodTypeAny, section, found, leaves);

// Fields whose inner numbers are measures drawn on the plan, not words a person reads.
const planMeasure = /^charger\.plan\.(wall|chargePoint|bays\.(x|y|width|length|forEv)|car\.(lengthM|widthM))/;

describe('the vocabulary covers every choice in the checklist schemas', () => {
  it('finds the schema’s choices by walking it (the walk itself is checked)', () => {
    // Sanity of the walk: it sees enums, literal unions and the nested plan.
    const paths = found.map((f) => f.path);
    expect(paths).toContain('vehicle.chargePort');
    expect(paths).toContain('supply.mainFuseAmps');
    expect(paths).toContain('supply.loads.socketCircuits');
    expect(paths).toContain('charger.plan.bays.kind');
    expect(found.length).toBeGreaterThan(15);
  });

  it.each(found.flatMap((f) => f.choices.map((choice) => [f.path, choice])))('%s has words for “%s”', (path, choice) => {
    const customer = optionWords(path, choice, 'customer');
    const staff = optionWords(path, choice, 'staff');
    expect(customer, `${path} = ${choice}: no customer words`).toBeTruthy();
    expect(staff, `${path} = ${choice}: no staff words`).toBeTruthy();
    // A word is never the saved id itself, unless the id is already a plain word or number.
    if (/[-_]/.test(choice) || /[a-z][A-Z]/.test(choice)) {
      expect(customer).not.toBe(choice);
      expect(staff).not.toBe(choice);
    }
  });

  it('gives every field of the schemas a question, gap words and a staff label', () => {
    const fields = leaves.filter((p) => !planMeasure.test(p));
    for (const path of fields) {
      const words = wordsFor(path);
      expect(words, `${path} has no words in src/lib/vocabulary/fields.ts`).toBeDefined();
      expect(words!.question.length, path).toBeGreaterThan(0);
      expect(words!.gap.length, path).toBeGreaterThan(0);
      expect(words!.staff.length, path).toBeGreaterThan(0);
    }
  });

  it('lists no field the schemas do not have (no stale words)', () => {
    const real = new Set([...leaves, 'charger.plan']);
    for (const path of Object.keys(fieldWords)) expect(real.has(path), path).toBe(true);
  });
});

describe('one name per thing', () => {
  it('never shows a raw option id in staff answers', () => {
    expect(staffAnswer('vehicle.chargePort', 'side-left', true)).toBe('Left side, rear');
    expect(staffAnswer('parking.habit', 'reverse-in', true)).toBe('Reversing in');
    expect(staffAnswer('parking.kind', 'attached-drive', true)).toBe('Driveway at the home');
    // An unknown code in a choice field is spelled out, not shown raw.
    expect(staffAnswer('parking.kind', 'shared-forecourt', true)).toBe('Shared forecourt');
    expect(staffAnswer('supply.mainFuseAmps', null, true)).toBe('Could not read it');
    expect(staffAnswer('supply.loads.socketCircuits', 'unsure', true)).toBe('Not sure');
  });

  it('names the car’s parking “nose in” and “reversing in”, and the port as the checklist does', () => {
    expect(Object.values(wayLabels)).toEqual(['Nose in', 'Reversing in']);
    expect(portLabels['side-left']).toBe(optionWords('vehicle.chargePort', 'side-left', 'customer'));
    expect(portStaffLabels['rear-right']).toBe('Rear right');
  });

  it('says “consumer unit” to customers, with the fuse-box gloss only in help, and MPAN with “supply number”', () => {
    const customerWords = Object.values(fieldWords).flatMap((w) => [w.question, w.gap, w.blocks, ...(('options' in w ? w.options : []) as { customer: string; hint?: string }[]).flatMap((o) => [o.customer, o.hint ?? ''])]);
    expect(customerWords.filter((t) => /fuse box/i.test(t))).toEqual([]);
    expect(customerWords.filter((t) => /\bcharger\b/i.test(t))).toEqual([]);
    expect(wordsFor('supply.mpanCore')!.question).toMatch(/MPAN.*supply number/);
    expect(customerGapLabel('supply.mpanCore')).toMatch(/MPAN.*supply number/);
    expect(staffLabel('supply.mpanCore')).toBe('MPAN core');
  });
});
