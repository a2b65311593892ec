// The demo's fullest checklists, kept apart from the seeding (no database, no files) so a unit
// test can check the spread of lights they give. Every name, place and number is invented.
import { mpanCheckDigit } from '../src/lib/validation/mpan';

/** A valid MPAN core for a distributor ID and ten further digits (check digit worked out). */
export function demoMpan(distributorId: string, ten: string): string {
  const first12 = distributorId + ten;
  return first12 + String(mpanCheckDigit(first12));
}

export const daysFromNow = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

/** 8 Heron Close: a tenant with a new car on order, a two-car drive, every upload sent. */
export function heronChecklist() {
  return {
    about: {
      fullName: 'Fen Ashdown', email: 'fen.ashdown@example.org', phone: '+441134960789', addressLine1: '8 Heron Close',
      town: 'Quillbury', postcode: 'AB14 8QR', tenure: 'tenant', propertyType: 'house',
    },
    vehicle: {
      make: 'Example Motors', model: 'Volta 5 Long Range', condition: 'new', vin: '1M8GDM9AXKP042788',
      deliveryDate: daysFromNow(70), connector: 'type2', chargePort: 'front-left',
    },
    supply: {
      mpanCore: demoMpan('23', '5566778899'), mainFuseAmps: 100, looped: 'no', consumerUnitLocation: 'Under the stairs, inside the front door',
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
      fullName: 'Gareth Quennell', email: 'gareth.quennell@example.org', phone: '+441134960321', addressLine1: 'The Old Forge, Church Hill',
      town: 'Quillbury', postcode: 'AB15 6NP', tenure: 'owner', propertyType: 'house',
    },
    vehicle: {
      make: 'Example Motors', model: 'Terrain E', condition: 'used', registration: 'LM19 RTW',
      deliveryDate: daysFromNow(20), connector: 'type2', chargePort: 'rear-right',
    },
    supply: {
      mpanCore: demoMpan('22', '3141592653'), mainFuseAmps: 60, looped: 'unsure', consumerUnitLocation: 'In the garage, on the back wall',
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
      fullName: 'Sunita Varley', email: 'sunita.varley@example.org', phone: '+441134960456', addressLine1: '27 Chandlers Way',
      town: 'Quillbury', postcode: 'AB14 2LN', tenure: 'owner', propertyType: 'house',
    },
    vehicle: {
      make: 'Example Motors', model: 'Volta 3', condition: 'used', registration: 'KX21 VNB',
      deliveryDate: daysFromNow(55), connector: 'type2', chargePort: 'front-left',
    },
    supply: {
      mpanCore: demoMpan('14', '2468013579'), mainFuseAmps: 100, looped: 'no', consumerUnitLocation: 'Hall cupboard, on the outside wall',
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

