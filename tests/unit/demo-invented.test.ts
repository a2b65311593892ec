import { describe, expect, it } from 'vitest';
import {
  chandlersChecklist,
  DEMO_DISTRIBUTOR_ID,
  DEMO_REGION,
  DEMO_TOWN,
  demoHomes,
  demoPlates,
  demoVins,
  forgeChecklist,
  heronChecklist,
  orchardChecklist,
  tannersChecklist,
  wheelwrightChecklist,
} from '../../seeds/demo-checklists';
import { FLEET } from '../../fake-services/vehicle-enquiry-server.mjs';
import { checkMpanCore, mpanRegions } from '@/lib/validation/mpan';
import { checkPostcode } from '@/lib/validation/postcode';
import { ageIdentifierStart, checkRegistration } from '@/lib/validation/registration';
import { checkVin } from '@/lib/validation/vin';
import { fieldWarnings } from '@/lib/schemas/checklist';
import { officeWarnings } from '@/components/office/case-answers';

// The demo must be all invented: no real postcode district, no supply number from the wrong
// region, no maker's published VIN, no plate that could be on a real car today.
const TODAY = new Date('2026-12-03T12:00:00Z');

// The GB postcode areas, from memory of Royal Mail's list (124 areas; not seen in a source).
const REAL_AREAS = new Set(
  ('AB AL B BA BB BD BH BL BN BR BS BT CA CB CF CH CM CO CR CT CV CW DA DD DE DG DH DL DN DT DY E EC EH EN EX FK FY G GL GU GY HA HD HG HP HR HS HU HX IG IM IP IV JE KA KT KW KY ' +
    'L LA LD LE LL LN LS LU M ME MK ML N NE NG NN NP NR NW OL OX PA PE PH PL PO PR RG RH RM S SA SE SG SK SL SM SN SO SP SR SS ST SW SY TA TD TF TN TQ TR TS TW UB W WA WC WD WF WN WR WS WV YO ZE').split(' '),
);

const checklists = [tannersChecklist(), orchardChecklist(), wheelwrightChecklist(), chandlersChecklist(), forgeChecklist(), heronChecklist()];

/** Every value under a key with this name, anywhere in the demo's data. */
function valuesOf(key: string, value: unknown, out: string[] = []): string[] {
  if (Array.isArray(value)) value.forEach((v) => valuesOf(key, v, out));
  else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      if (k === key && typeof v === 'string') out.push(v);
      else valuesOf(key, v, out);
    }
  }
  return out;
}
const demo = [demoHomes, demoPlates, demoVins, checklists];

describe('the demo is all invented', () => {
  it(`sets every home in ${DEMO_TOWN}, with postcodes in an area that does not exist but passes the format rule`, () => {
    const postcodes = valuesOf('postcode', demo);
    expect(postcodes.length).toBeGreaterThanOrEqual(7);
    for (const postcode of postcodes) {
      expect(checkPostcode(postcode)).toEqual({ ok: true, postcode });
      const area = /^[A-Z]+/.exec(postcode)![0];
      expect(REAL_AREAS.has(area), `${postcode}: ${area} is a real postcode area`).toBe(false);
    }
    for (const town of valuesOf('town', demo)) expect(town).toBe(DEMO_TOWN);
  });

  it(`gives every supply number the ${DEMO_REGION} distributor ID, with a valid check digit`, () => {
    const cores = valuesOf('mpanCore', demo);
    expect(cores.length).toBeGreaterThanOrEqual(5);
    expect(mpanRegions[DEMO_DISTRIBUTOR_ID]).toBe(DEMO_REGION);
    for (const core of cores) expect(checkMpanCore(core)).toMatchObject({ ok: true, distributorId: DEMO_DISTRIBUTOR_ID, region: DEMO_REGION });
  });

  it('builds its VINs from the check-digit rule with a manufacturer code no region holds', () => {
    const vins = valuesOf('vin', demo);
    expect(vins.length).toBeGreaterThanOrEqual(2);
    for (const vin of vins) {
      // No check-character warning: 49 CFR 565.15 passes (worked by hand in demo-checklists.ts).
      expect(checkVin(vin)).toEqual({ ok: true, vin });
      // ISO 3780 gives no region the first character 0 (from memory), so no maker holds "0LK".
      expect(vin.slice(0, 3)).toBe('0LK');
      // The published worked example (49 CFR 565.15) belongs in the tests, never in the demo.
      expect(vin).not.toBe('1M8GDM9AXKP042788');
    }
  });

  it('uses plates whose age identifier is not issued yet, all on the look-up fake’s records', () => {
    const plates = valuesOf('registration', demo);
    expect(plates.length).toBeGreaterThanOrEqual(2);
    for (const plate of plates) {
      const checked = checkRegistration(plate, TODAY);
      expect(checked).toMatchObject({ ok: true, format: 'current', registration: plate });
      // INF104: March codes are the year's last two digits; 29 first appears 1 March 2029.
      expect(ageIdentifierStart(plate.slice(2, 4))).toBeGreaterThan(TODAY.getTime());
      const record = (FLEET as Record<string, unknown>)[plate.replace(/\s/g, '')];
      const stored = Object.values(demoPlates).find((p) => p.registration === plate)!;
      expect(record).toEqual({ make: stored.make, colour: stored.colour, fuelType: stored.fuelType, yearOfManufacture: stored.yearOfManufacture });
    }
  });

  it('shows the office no plate warning for a demo car on record (and still warns for one that is not)', () => {
    for (const checklist of [forgeChecklist(), chandlersChecklist()]) {
      const warnings = fieldWarnings(checklist as never, TODAY);
      // The age identifier is not in use yet, so the rule alone warns…
      expect(warnings['vehicle.registration']).toMatch(/not in use yet/);
      // …but the seeded look-up holds the plate, so the office page does not.
      expect(officeWarnings(warnings, checklist as never, { registration: checklist.vehicle.registration })).toEqual({});
      expect(officeWarnings(warnings, checklist as never, { registration: 'GW29 ZZZ' })).toEqual(warnings);
    }
  });

  it('names makes from the look-up fake’s invented fleet and models of its own', () => {
    const fleetMakes = new Set(Object.values(FLEET).map((v) => (v as { make: string }).make.toLowerCase()));
    for (const make of valuesOf('make', checklists)) expect(fleetMakes.has(make.toLowerCase())).toBe(true);
    expect(new Set(valuesOf('model', checklists))).toEqual(new Set(['Fennick', 'Quillet', 'Brindle Long Range']));
  });
});
