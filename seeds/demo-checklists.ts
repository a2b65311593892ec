// The demo's data, kept apart from the seeding (no database, no files) so unit tests can check
// the spread of lights it gives and that every value in it is invented. Every name, place and
// number is made up, and chosen so that it cannot be someone's real one:
// - Quillbury is an invented market town in Yorkshire. Its postcodes use the outward area "YY",
//   which passes the BS 7666 format rule (first letter not Q, V or X; second not I, J or Z) but is
//   not one of the GB postcode areas (YO is the only area starting with Y — from memory of Royal
//   Mail's list of areas).
// - Every MPAN core starts with distributor ID 23, the Yorkshire region, to match the town, and
//   carries the check digit of the market operator's published rule (worked out by demoMpan).
// - The VINs are built from the ISO 3779 layout (WMI, VDS, check character in position 9, model
//   year, plant, serial) with the 49 CFR 565.15 check digit. Their world manufacturer identifier
//   "0LK" starts with 0, a first character ISO 3780 gives to no region (from memory: A–H Africa,
//   J–R Asia, S–Z Europe, 1–5 North America, 6–7 Oceania, 8–9 South America), so no maker can
//   hold it. The published worked example 1M8GDM9AXKP042788 stays in the tests.
// - Makes are the vehicle look-up fake's invented ones (Larkspur, Ostrel); the model names
//   (Brindle, Fennick, Quillet) are our own.
// - Plates are current-format marks with age identifier 29 (March 2029), not issued yet, so they
//   cannot be anyone's car today. The app warns about an age identifier not in use yet, except
//   when the vehicle records hold the plate (a plate on record has been issued): the demo plates
//   are in the look-up fake's fleet, and the seed stores each case's look-up as the vehicle step
//   would, so the demo shows no warning on the customer's step or the office page.
import { mpanCheckDigit } from '@/lib/validation/mpan';

/** A valid MPAN core for a distributor ID and ten further digits (check digit worked out). */
export function demoMpan(distributorId: string, ten: string): string {
  const first12 = distributorId + ten;
  return first12 + String(mpanCheckDigit(first12));
}

export const daysFromNow = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

/** The demo town and the distribution region its supply numbers name. */
export const DEMO_TOWN = 'Quillbury';
export const DEMO_DISTRIBUTOR_ID = '23';
export const DEMO_REGION = 'Yorkshire';

/** Every demo home: first address line and postcode (outward area YY: see above). */
export const demoHomes = Object.freeze({
  tanners: { addressLine1: '14 Tanners Row', town: DEMO_TOWN, postcode: 'YY1 3DE' },
  mill: { addressLine1: '3 Mill Lane', town: DEMO_TOWN, postcode: 'YY1 7EF' },
  orchard: { addressLine1: 'Flat 2, 9 Orchard Court', town: DEMO_TOWN, postcode: 'YY2 1GH' },
  wheelwright: { addressLine1: 'Wheelwright Cottage, Long Street', town: DEMO_TOWN, postcode: 'YY1 9JL' },
  chandlers: { addressLine1: '27 Chandlers Way', town: DEMO_TOWN, postcode: 'YY3 2LN' },
  forge: { addressLine1: 'The Old Forge, Church Hill', town: DEMO_TOWN, postcode: 'YY4 6NP' },
  heron: { addressLine1: '8 Heron Close', town: DEMO_TOWN, postcode: 'YY3 8QR' },
});

/**
 * The demo's VINs. Check characters worked by hand (49 CFR 565.15 weights 8 7 6 5 4 3 2 10 0 9 8 7 6 5 4 3 2;
 * letters L=3 K=2 B=2 R=9 E=5 T=3 W=6 F=6 N=5):
 *   0LKBR5E1?TW000417: 0+21+12+10+36+15+10+10+0+27+48+0+0+0+16+3+14 = 222, 222 mod 11 = 2 → 0LKBR5E12TW000417
 *   0LKFN3E1?TW000952: 0+21+12+30+20+9+10+10+0+27+48+0+0+0+36+15+4 = 242, 242 mod 11 = 0 → 0LKFN3E10TW000952
 */
export const demoVins = Object.freeze({ heron: '0LKBR5E12TW000417', tanners: '0LKFN3E10TW000952' });

/** The demo's registered cars: plates in the look-up fake's fleet, as the records hold them. */
export const demoPlates = Object.freeze({
  forge: { registration: 'GW29 RFG', make: 'OSTREL', colour: 'GREY', fuelType: 'ELECTRICITY', yearOfManufacture: 2024 },
  chandlers: { registration: 'GW29 CHW', make: 'LARKSPUR', colour: 'BLUE', fuelType: 'ELECTRICITY', yearOfManufacture: 2025 },
});

/** 14 Tanners Row: part way through, a new car on order (VIN known, no plate yet). */
export function tannersChecklist() {
  return {
    about: {
      fullName: 'Maren Oakes', email: 'customer@example.com', phone: '+441134960123', ...demoHomes.tanners,
      tenure: 'owner', propertyType: 'house',
    },
    vehicle: { make: 'Larkspur', model: 'Fennick', condition: 'new', vin: demoVins.tanners, deliveryDate: daysFromNow(40), connector: 'type2' },
  };
}

/** Flat 2, 9 Orchard Court: a tenant in a flat with a bay apart from the building. */
export function orchardChecklist() {
  return {
    about: { fullName: 'Delphine Achterberg', email: 'delphine.achterberg@example.org', ...demoHomes.orchard, tenure: 'tenant', propertyType: 'flat' },
    supply: { mpanCore: demoMpan(DEMO_DISTRIBUTOR_ID, '4455667788'), mainFuseAmps: 60, looped: 'unsure', earthing: 'unknown' },
    parking: { kind: 'detached-bay', cars: 1, habit: 'nose-in' },
  };
}

/** Wheelwright Cottage: supply and charger answered, the rest still to come. */
export function wheelwrightChecklist() {
  return {
    supply: { mpanCore: demoMpan(DEMO_DISTRIBUTOR_ID, '1029384756'), mainFuseAmps: 80, looped: 'no', earthing: 'pme', loads: { showerKw: 9.5, cooker: true } },
    charger: { location: 'Side wall by the drive', cableRunMetres: 12, route: 'along-wall', softGround: true, softGroundMetres: 3, preference: 'tethered', tetherMetres: 5 },
  };
}

/** 8 Heron Close: a tenant with a new car on order, a two-car drive, every upload sent. */
export function heronChecklist() {
  return {
    about: {
      fullName: 'Fen Ashdown', email: 'fen.ashdown@example.org', phone: '+441134960789', ...demoHomes.heron,
      tenure: 'tenant', propertyType: 'house',
    },
    vehicle: {
      make: 'Larkspur', model: 'Brindle Long Range', condition: 'new', vin: demoVins.heron,
      deliveryDate: daysFromNow(70), connector: 'type2', chargePort: 'front-left',
    },
    supply: {
      mpanCore: demoMpan(DEMO_DISTRIBUTOR_ID, '5566778899'), mainFuseAmps: 100, looped: 'no', consumerUnitLocation: 'Under the stairs, inside the front door',
      earthing: 'pme', phases: 'single',
      loads: { showerKw: 9.5, cooker: false, immersion: false, heatPumpKw: 0, storageHeaters: 0, otherEvCharger: false, solarPv: false, socketCircuits: 2 },
    },
    parking: { kind: 'attached-drive', cars: 2, habit: 'varies' },
    charger: {
      location: 'Front wall, left of the front door', cableRunMetres: 24, route: 'along-wall', softGround: true, softGroundMetres: 3,
      preference: 'tethered', tetherMetres: 5, ratingKw: 7.4,
      plan: {
        wall: { x0: 0, x1: 9 },
        chargePoint: { x: 6.2, y: 0 },
        bays: [
          { x: 5.6, y: 0.6, width: 2.6, length: 5, angle: 0, forEv: true },
          { x: 2.6, y: 0.6, width: 2.6, length: 5, angle: 0, forEv: false },
        ],
        car: { sizeClass: 'medium' },
        chargePort: 'front-left',
      },
    },
  };
}

/** The Old Forge: an owner with a 60 A supply, a garage and a long buried run; some evidence still open. */
export function forgeChecklist() {
  return {
    about: {
      fullName: 'Gareth Quennell', email: 'gareth.quennell@example.org', phone: '+441134960321', ...demoHomes.forge,
      tenure: 'owner', propertyType: 'house',
    },
    vehicle: {
      make: 'Ostrel', model: 'Quillet', condition: 'used', registration: demoPlates.forge.registration,
      deliveryDate: daysFromNow(20), connector: 'type2', chargePort: 'rear-right',
    },
    supply: {
      mpanCore: demoMpan(DEMO_DISTRIBUTOR_ID, '3141592653'), mainFuseAmps: 60, looped: 'unsure', consumerUnitLocation: 'In the garage, on the back wall',
      earthing: 'unknown', phases: 'unsure',
      loads: { showerKw: 10.5, cooker: true, immersion: true, heatPumpKw: 0, storageHeaters: 0, otherEvCharger: false, solarPv: true, socketCircuits: 'unsure' },
    },
    parking: { kind: 'garage', cars: 1, habit: 'reverse-in' },
    charger: {
      location: 'Inside the garage, on the back wall', cableRunMetres: 32, route: 'buried', softGround: false, preference: 'socketed', ratingKw: 7.4,
      plan: {
        wall: { x0: 0, x1: 7 },
        chargePoint: { x: 2.2, y: 0 },
        bays: [{ x: 1.8, y: 0, width: 3.2, length: 5.8, angle: 0, forEv: true, kind: 'garage' }],
        car: { sizeClass: 'large' },
        chargePort: 'rear-right',
      },
    },
  };
}

/** 27 Chandlers Way: an owner with a used car, gas heating and cooking, TN-S earthing, a short run through the wall. */
export function chandlersChecklist() {
  return {
    about: {
      fullName: 'Sunita Varley', email: 'sunita.varley@example.org', phone: '+441134960456', ...demoHomes.chandlers,
      tenure: 'owner', propertyType: 'house',
    },
    vehicle: {
      make: 'Larkspur', model: 'Fennick', condition: 'used', registration: demoPlates.chandlers.registration,
      deliveryDate: daysFromNow(55), connector: 'type2', chargePort: 'front-left',
    },
    supply: {
      mpanCore: demoMpan(DEMO_DISTRIBUTOR_ID, '2468013579'), mainFuseAmps: 100, looped: 'no', consumerUnitLocation: 'Hall cupboard, on the outside wall',
      earthing: 'tns', phases: 'single',
      loads: { showerKw: 0, cooker: false, immersion: false, heatPumpKw: 0, storageHeaters: 0, otherEvCharger: false, solarPv: false, socketCircuits: 2 },
    },
    parking: { kind: 'attached-drive', cars: 1, habit: 'nose-in' },
    charger: {
      location: 'Front wall, right of the hall window', cableRunMetres: 6, route: 'through-wall', softGround: false,
      preference: 'tethered', tetherMetres: 5, ratingKw: 7.4,
      plan: {
        wall: { x0: 0, x1: 10 },
        chargePoint: { x: 2.6, y: 0 },
        bays: [{ x: 0, y: 0.5, width: 2.4, length: 4.8, angle: 0, forEv: true }],
        car: { sizeClass: 'medium' },
        chargePort: 'front-left',
      },
    },
  };
}

