// Client-safe: what a customer can do about a readiness check that is not yet green, in the
// customer's words — which part of the checklist to go back to. The checks' own `actions` are
// written for the firm ("The installer to plan…") and never reach a customer.
import type { CheckId, Light } from '@/lib/readiness/types';

/** Where a customer can act: a checklist step, or the photos and documents page. */
export type CustomerActionPlace = 'about' | 'vehicle' | 'supply' | 'parking' | 'charger' | 'photos';

export type CustomerAction = { place: CustomerActionPlace; text: string };

const supply = { place: 'supply', text: 'Look again at your answers in “Your supply”.' } as const;
const charger = { place: 'charger', text: 'Look again at your answers in “Charge point and cable route”.' } as const;
const photos = { place: 'photos', text: 'Add or replace the photos and documents asked for.' } as const;

const byCheck: Record<CheckId, CustomerAction[]> = {
  'supply-identity': [{ place: 'supply', text: 'Check the MPAN (your 13-digit supply number) in “Your supply” against an electricity bill.' }],
  'supply-headroom': [supply, { place: 'photos', text: 'Send a clear photo of the cut-out, if you haven’t yet.' }],
  'network-operator': [supply],
  earthing: [supply, charger],
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
