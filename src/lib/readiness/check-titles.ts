// Each readiness check's title, as the customer and the office read it. Kept apart from the
// checks themselves so that a page naming checks (the office queue) need not load the engine.
import type { CheckId } from './types';

export const checkTitles = {
  'supply-identity': 'Your electricity supply number (MPAN)',
  'supply-headroom': 'Room on your supply for the charge point',
  'network-operator': 'Telling the network operator',
  earthing: 'Earthing for an outdoor charge point',
  'cable-run': 'Cable from your consumer unit to the charge point',
  'cable-reach': 'Charging cable reaches your car',
  parking: 'Off-street parking',
  timing: 'Ready before your car arrives',
  documents: 'Photos and documents',
} as const satisfies Record<CheckId, string>;
