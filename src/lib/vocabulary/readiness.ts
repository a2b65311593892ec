// Client-safe: what a customer can do about a readiness check that is not yet green, in the
// customer's words — which part of the checklist to go back to. The checks' own `actions` are
// written for the firm ("The installer to plan…") and never reach a customer.
import type { CheckId, Light } from '@/lib/readiness/types';

/** Where a customer can act: a checklist step (its `#step=` id), or the photos and documents page. */
export type CustomerActionPlace = 'about' | 'vehicle' | 'supply' | 'fusebox' | 'loads' | 'parking' | 'charger' | 'photos';

export type CustomerAction = { place: CustomerActionPlace; text: string };

// The step titles are the checklist's own (src/lib/checklist-steps.ts).
const meter = { place: 'supply', text: 'Look again at your answers in “Your meter and fuse”.' } as const;
const loads = { place: 'loads', text: 'Look again at your answers in “Big electric loads”.' } as const;
const consumerUnit = { place: 'fusebox', text: 'Look again at your answers in “Your consumer unit and earthing”.' } as const;
const charger = { place: 'charger', text: 'Look again at your answers in “Charge point and cable route”.' } as const;
const photos = { place: 'photos', text: 'Add or replace the photos and documents asked for.' } as const;

const byCheck: Record<CheckId, CustomerAction[]> = {
  'supply-identity': [{ place: 'supply', text: 'Check the MPAN (your 13-digit supply number) in “Your meter and fuse” against an electricity bill.' }],
  'supply-headroom': [meter, loads, { place: 'photos', text: 'Send a clear photo of the cut-out, if you haven’t yet.' }],
  'network-operator': [meter],
  earthing: [consumerUnit, charger],
  'cable-run': [charger],
  'cable-reach': [{ place: 'charger', text: 'Check the driveway plan and the charging socket in “Charge point and cable route”.' }],
  parking: [{ place: 'parking', text: 'Look again at your answers in “Parking”.' }],
  timing: [{ place: 'vehicle', text: 'Check the expected delivery date in “Your vehicle”.' }],
  documents: [photos],
};

/**
 * What the customer can do about one check: nothing when it is green.
 *
 * @example customerActionsFor({ id: 'parking', light: 'amber' })[0]?.place // 'parking'
 */
export function customerActionsFor(check: { id: CheckId; light: Light }): CustomerAction[] {
  return check.light === 'green' ? [] : byCheck[check.id] ?? [];
}
