import { describe, expect, it } from 'vitest';
import { ZodError } from 'zod';
import {
  type Checklist,
  type ChecklistPatch,
  checklistPatchSchema,
  fieldWarnings,
  mergeChecklist,
  sectionIds,
  sectionProgress,
  sectionRequiredFields,
  supplyPatchSchema,
  zodIssuesToFields,
  checklistConflicts,
} from '@/lib/schemas/checklist';
import { VIN_CHECK_DIGIT_WARNING } from '@/lib/validation/vin';

// The data model and its rules come from Groundwork issue 3 ("The customer's checklist"); the
// validated fields rest on the sources named in the validators' own tests. All people,
// addresses and numbers here are invented (phone: Ofcom drama range, from memory).

const TODAY = new Date('2026-12-01T12:00:00Z');

function parse(body: unknown): { data: ChecklistPatch | undefined; fields: Record<string, string> } {
  const result = checklistPatchSchema.safeParse(body);
  return result.success ? { data: result.data, fields: {} } : { data: undefined, fields: zodIssuesToFields(result.error) };
}

const complete: Checklist = {
  about: {
    fullName: 'Sam Sample',
    email: 'sam.sample@example.com',
    phone: '+441134960123',
    addressLine1: '12 Imaginary Row',
    town: 'Exampleton',
    postcode: 'AB12 3DE',
    tenure: 'owner',
    propertyType: 'house',
  },
  vehicle: {
    make: 'Inventa',
    model: 'Volt One',
    condition: 'new',
    vin: '1M8GDM9AXKP042788',
    deliveryDate: '2027-02-15',
    connector: 'type2',
    chargePort: 'front-left',
  },
  supply: {
    mpanCore: '1312345678907',
    mainFuseAmps: 100,
    looped: 'no',
    consumerUnitLocation: 'Under the stairs',
    earthing: 'unknown',
    phases: 'single',
    loads: { showerKw: 0, cooker: true, immersion: false, heatPumpKw: 0, storageHeaters: 0, otherEvCharger: false, solarPv: false, socketCircuits: 'unsure' },
  },
  parking: { kind: 'attached-drive', cars: 1, habit: 'nose-in' },
  charger: {
    location: 'Front wall by the door',
    cableRunMetres: 8,
    route: 'through-wall',
    softGround: false,
    preference: 'socketed',
    ratingKw: 7.4,
  },
};

describe('section list', () => {
  it('has the five data sections in order with their customer-facing titles', () => {
    expect(sectionIds).toEqual([
      ['about', 'About you'],
      ['vehicle', 'Your vehicle'],
      ['supply', 'Your supply'],
      ['parking', 'Parking'],
      ['charger', 'Charge point and cable route'],
    ]);
  });
});

describe('checklistPatchSchema: strictness', () => {
  it('refuses an unknown field with its dotted path', () => {
    expect(parse({ supply: { mpan: '1312345678907' } }).fields).toEqual({ 'supply.mpan': 'This is not a field of the checklist.' });
  });

  it('refuses an unknown section and an unknown load', () => {
    const { fields } = parse({ garden: {}, supply: { loads: { sauna: true } } });
    expect(Object.keys(fields).sort()).toEqual(['garden', 'supply.loads.sauna']);
  });

  it('refuses a body that is not an object, keyed "root"', () => {
    expect(Object.keys(parse([1, 2]).fields)).toEqual(['root']);
    expect(Object.keys(parse(null).fields)).toEqual(['root']);
  });

  it('accepts any subset of sections and fields', () => {
    expect(parse({}).data).toEqual({});
    expect(parse({ parking: { cars: 2 } }).data).toEqual({ parking: { cars: 2 } });
  });
});

describe('checklistPatchSchema: validated fields', () => {
  it('names a wrong MPAN check digit at supply.mpanCore', () => {
    // Worked example 1312345678907 (sum 1349 → 7, Wikipedia "Meter Point Administration Number"); 6 fails.
    const { fields } = parse({ supply: { mpanCore: '1312345678906' } });
    expect(fields['supply.mpanCore']).toMatch(/does not add up/);
  });

  it('stores the MPAN core as digits only', () => {
    expect(parse({ supply: { mpanCore: '13 1234 5678 907' } }).data?.supply?.mpanCore).toBe('1312345678907');
  });

  it('normalises postcode, phone, registration and VIN', () => {
    const { data } = parse({
      about: { postcode: 'ab123de', phone: '0113 496 0123', email: ' sam.sample@example.com ' },
      vehicle: { registration: 'ab12cde', vin: '1m8gdm9axkp042788' },
    });
    expect(data).toEqual({
      about: { postcode: 'AB12 3DE', phone: '+441134960123', email: 'sam.sample@example.com' },
      vehicle: { registration: 'AB12 CDE', vin: '1M8GDM9AXKP042788' },
    });
  });

  it('refuses a date that does not exist and a bad e-mail, each at its own path', () => {
    const { fields } = parse({ vehicle: { deliveryDate: '2026-02-30' }, about: { email: 'sam at example' } });
    expect(Object.keys(fields).sort()).toEqual(['about.email', 'vehicle.deliveryDate']);
  });

  it('saves a VIN that fails the North American check digit (a warning, not an error)', () => {
    const { data } = parse({ vehicle: { vin: '1M8GDM9A1KP042788' } });
    expect(data?.vehicle?.vin).toBe('1M8GDM9A1KP042788');
  });

  it('refuses registration punctuation', () => {
    expect(parse({ vehicle: { registration: 'AB12-CDE' } }).fields).toHaveProperty(['vehicle.registration']);
  });

  it('accepts 60, 80 and 100 A and null ("can\'t read it") for the main fuse, and nothing else', () => {
    // BS 7657 cut-out ratings, as in TRADE-REFERENCE.md "Supply headroom".
    for (const amps of [60, 80, 100, null]) expect(supplyPatchSchema.safeParse({ mainFuseAmps: amps }).success).toBe(true);
    for (const amps of [63, 70, '100', 0]) expect(supplyPatchSchema.safeParse({ mainFuseAmps: amps }).success).toBe(false);
  });

  it('keeps numbers to their ranges', () => {
    const cases: [unknown, string][] = [
      [{ supply: { loads: { showerKw: 15.5 } } }, 'supply.loads.showerKw'],
      [{ supply: { loads: { storageHeaters: 41 } } }, 'supply.loads.storageHeaters'],
      [{ supply: { loads: { heatPumpKw: -1 } } }, 'supply.loads.heatPumpKw'],
      [{ parking: { cars: 1.5 } }, 'parking.cars'],
      [{ parking: { cars: 11 } }, 'parking.cars'],
      [{ charger: { tetherMetres: 0 } }, 'charger.tetherMetres'],
      [{ charger: { cableRunMetres: 201 } }, 'charger.cableRunMetres'],
      [{ charger: { softGroundMetres: '3' } }, 'charger.softGroundMetres'],
    ];
    for (const [body, path] of cases) expect(Object.keys(parse(body).fields), path).toEqual([path]);
    const edges = { supply: { loads: { showerKw: 15, storageHeaters: 40, heatPumpKw: 30 } }, parking: { cars: 10 }, charger: { tetherMetres: 1 } };
    expect(parse(edges).fields).toEqual({});
  });

  it('refuses text over its length limit', () => {
    expect(parse({ about: { fullName: 'x'.repeat(201) } }).fields).toHaveProperty(['about.fullName']);
  });

  it('saves nothing when any field is bad: the whole body fails', () => {
    expect(parse({ about: { town: 'Exampleton' }, supply: { mpanCore: '12' } }).data).toBeUndefined();
  });
});

describe('null and blank clear a field', () => {
  it('parses null and blank text as null', () => {
    expect(parse({ about: { town: null, fullName: '   ', postcode: '' } }).data).toEqual({ about: { town: null, fullName: null, postcode: null } });
  });

  it('removes cleared fields on merge but keeps a null main fuse as "can\'t read it"', () => {
    const saved: Checklist = { about: { town: 'Exampleton', fullName: 'Sam Sample' }, supply: { mainFuseAmps: 80 } };
    const patch = parse({ about: { town: null }, supply: { mainFuseAmps: null } }).data!;
    expect(mergeChecklist(saved, patch)).toEqual({ about: { fullName: 'Sam Sample' }, supply: { mainFuseAmps: null } });
    expect(saved.about?.town).toBe('Exampleton'); // the saved object is left alone
  });

  it('merges loads field by field, and loads: null clears them all', () => {
    const saved: Checklist = { supply: { loads: { cooker: true, showerKw: 9.5 } } };
    const merged = mergeChecklist(saved, parse({ supply: { loads: { showerKw: null, solarPv: true } } }).data!);
    expect(merged.supply?.loads).toEqual({ cooker: true, solarPv: true });
    expect(mergeChecklist(saved, parse({ supply: { loads: null } }).data!).supply).toEqual({});
  });

  it('refuses a plan that is not a driveway plan', () => {
    expect(parse({ charger: { plan: { a: 1 } } }).data).toBeUndefined();
  });

  it('replaces the charger plan whole', () => {
    const plan = (x: number) => ({ wall: { x0: 0, x1: 8 }, chargePoint: { x, y: 0 }, bays: [], car: { sizeClass: 'small' as const } });
    const saved: Checklist = { charger: { plan: { ...plan(1), chargePort: 'front-left' } } };
    expect(mergeChecklist(saved, parse({ charger: { plan: plan(2) } }).data!).charger?.plan).toEqual(plan(2));
  });
});

describe('sectionProgress', () => {
  it('counts a fully answered checklist complete, with addressLine2 optional', () => {
    expect(sectionProgress(complete).map(({ id, complete: done, missing }) => [id, done, missing])).toEqual([
      ['about', true, []],
      ['vehicle', true, []],
      ['supply', true, []],
      ['parking', true, []],
      ['charger', true, []],
    ]);
  });

  it('lists every required field of an empty checklist', () => {
    const [about, vehicle, supply] = sectionProgress({});
    expect(about).toEqual({
      id: 'about',
      title: 'About you',
      complete: false,
      missing: ['fullName', 'email', 'phone', 'addressLine1', 'town', 'postcode', 'tenure', 'propertyType'],
    });
    expect(vehicle!.missing).toContain('registration');
    expect(vehicle!.missing).not.toContain('vin');
    expect(supply!.missing).toEqual(expect.arrayContaining(['mpanCore', 'mainFuseAmps', 'loads.showerKw', 'loads.solarPv']));
  });

  it('takes a registration or a VIN: one is enough', () => {
    const { vin: _vin, ...withoutVin } = complete.vehicle!;
    const byRegistration = { ...complete, vehicle: { ...withoutVin, registration: 'AB12 CDE' } };
    const withNeither = { ...complete, vehicle: withoutVin };
    expect(sectionProgress(byRegistration)[1]).toMatchObject({ complete: true });
    expect(sectionProgress(withNeither)[1]).toMatchObject({ complete: false, missing: ['registration'] });
  });

  it('asks for tetherMetres only when the preference is tethered', () => {
    const tethered = { ...complete, charger: { ...complete.charger, preference: 'tethered' as const } };
    expect(sectionProgress(tethered)[4]).toMatchObject({ complete: false, missing: ['tetherMetres'] });
    const withLength = { ...tethered, charger: { ...tethered.charger, tetherMetres: 5 } };
    expect(sectionProgress(withLength)[4]).toMatchObject({ complete: true });
  });

  it('asks for softGroundMetres only when there is soft ground', () => {
    const soft = { ...complete, charger: { ...complete.charger, softGround: true } };
    expect(sectionProgress(soft)[4]).toMatchObject({ complete: false, missing: ['softGroundMetres'] });
    expect(sectionRequiredFields.charger({ softGround: false })).not.toContain('softGroundMetres');
  });

  it('counts 0 kW and "no" as answers, and a cleared main fuse (absent) as a gap', () => {
    expect(sectionProgress(complete)[2]!.complete).toBe(true); // loads are all 0 or false
    const { mainFuseAmps: _fuse, ...withoutFuse } = complete.supply!;
    expect(sectionProgress({ ...complete, supply: withoutFuse })[2]!.missing).toEqual(['mainFuseAmps']);
    const cantRead = { ...complete, supply: { ...complete.supply, mainFuseAmps: null } };
    expect(sectionProgress(cantRead)[2]!.complete).toBe(true);
  });

  it('counts a null in any other field as a gap', () => {
    const cleared = { ...complete, parking: { ...complete.parking, habit: null } };
    expect(sectionProgress(cleared)[3]).toMatchObject({ complete: false, missing: ['habit'] });
  });
});

describe('fieldWarnings', () => {
  it('warns on a VIN check-digit mismatch and an unusual registration, by dotted path', () => {
    // 1M8GDM9A1KP042788: position 9 is 1 but 49 CFR 565.15 gives X (sum 351 → 10).
    // AB27 CDE: 27 is March 2027, not issued on 1 December 2026 (DVLA INF104 age identifiers).
    expect(fieldWarnings({ vehicle: { vin: '1M8GDM9A1KP042788', registration: 'AB27 CDE' } }, TODAY)).toEqual({
      'vehicle.vin': VIN_CHECK_DIGIT_WARNING,
      'vehicle.registration': expect.stringMatching(/not in use yet/),
    });
  });

  it('is empty for the §565.15 worked VIN and an issued mark', () => {
    expect(fieldWarnings({ vehicle: { vin: '1M8GDM9AXKP042788', registration: 'AB12 CDE' } }, TODAY)).toEqual({});
    expect(fieldWarnings({}, TODAY)).toEqual({});
  });
});

describe('zodIssuesToFields', () => {
  it('keeps the first message for each path', () => {
    const error = new ZodError([
      { code: 'custom', path: ['supply', 'mpanCore'], message: 'first' },
      { code: 'custom', path: ['supply', 'mpanCore'], message: 'second' },
      { code: 'custom', path: ['about', 'town'], message: 'town' },
    ]);
    expect(zodIssuesToFields(error)).toEqual({ 'supply.mpanCore': 'first', 'about.town': 'town' });
  });
});

describe('phases, socket circuits and charge-point ratings', () => {
  it('accepts single, three and not sure for the supply phases', () => {
    for (const phases of ['single', 'three', 'unsure']) expect(parse({ supply: { phases } }).data).toEqual({ supply: { phases } });
    expect(parse({ supply: { phases: 'two' } }).fields['supply.phases']).toMatch(/single phase, three phase or not sure/);
  });

  it('accepts a count of socket circuits or "unsure", nothing else', () => {
    expect(parse({ supply: { loads: { socketCircuits: 3 } } }).data).toEqual({ supply: { loads: { socketCircuits: 3 } } });
    expect(parse({ supply: { loads: { socketCircuits: 'unsure' } } }).data).toEqual({ supply: { loads: { socketCircuits: 'unsure' } } });
    expect(parse({ supply: { loads: { socketCircuits: 0 } } }).fields['supply.loads.socketCircuits']).toMatch(/from 1 to 20/);
    expect(parse({ supply: { loads: { socketCircuits: 2.5 } } }).fields['supply.loads.socketCircuits']).toBeDefined();
  });

  it('offers only real charge-point ratings: 3.6, 7.4, 11 and 22 kW', () => {
    for (const ratingKw of [3.6, 7.4, 11, 22]) expect(parse({ charger: { ratingKw } }).data).toEqual({ charger: { ratingKw } });
    for (const ratingKw of [7, 7.2, 32, 0]) expect(parse({ charger: { ratingKw } }).fields['charger.ratingKw']).toMatch(/3\.6, 7\.4, 11 or 22 kW/);
  });

  it('refuses 11 or 22 kW on a supply said to be single phase (they need three phases)', () => {
    expect(checklistConflicts({ supply: { phases: 'single' }, charger: { ratingKw: 22 } })).toHaveProperty('charger.ratingKw');
    expect(checklistConflicts({ supply: { phases: 'single' }, charger: { ratingKw: 11 } })).toHaveProperty('charger.ratingKw');
    expect(checklistConflicts({ supply: { phases: 'three' }, charger: { ratingKw: 22 } })).toEqual({});
    expect(checklistConflicts({ supply: { phases: 'unsure' }, charger: { ratingKw: 22 } })).toEqual({});
    expect(checklistConflicts({ supply: { phases: 'single' }, charger: { ratingKw: 7.4 } })).toEqual({});
  });

  it('counts the phases, socket circuits and rating as required answers', () => {
    const { phases: _p, ...supply } = complete.supply!;
    expect(sectionProgress({ ...complete, supply })[2]!.missing).toEqual(['phases']);
    const { socketCircuits: _s, ...loads } = complete.supply!.loads!;
    expect(sectionProgress({ ...complete, supply: { ...complete.supply, loads } })[2]!.missing).toEqual(['loads.socketCircuits']);
    const { ratingKw: _r, ...charger } = complete.charger!;
    expect(sectionProgress({ ...complete, charger })[4]!.missing).toEqual(['ratingKw']);
  });

  it('old saved answers without the new fields still parse', () => {
    expect(parse({ supply: { mainFuseAmps: 100, loads: { showerKw: 9.5, cooker: true } }, charger: { preference: 'tethered' } }).fields).toEqual({});
  });
});
