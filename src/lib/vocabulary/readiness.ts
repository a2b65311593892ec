// Client-safe: what a customer can do about a readiness check that is not yet green, in the
// customer's words — which part of the checklist to go back to. The checks' own `actions` are
// written for the firm ("The installer to plan…") and never reach a customer.
import type { CheckId, Light } from '@/lib/readiness/types';
import { stepTitle, type StepId } from '@/lib/checklist-steps';

/** Where a customer can act: a checklist step, or the photos and documents page. */
export type CustomerActionPlace = Exclude<StepId, 'review'> | 'photos';

export type CustomerAction = { place: CustomerActionPlace; text: string };

// Each names the checklist step it sends the customer to, by that step's own title.
const lookAgain = (place: Exclude<StepId, 'review'>): CustomerAction => ({ place, text: `Look again at your answers in “${stepTitle(place)}”.` });
const photos = { place: 'photos', text: 'Add or replace the photos and documents asked for.' } as const;

const byCheck: Record<CheckId, CustomerAction[]> = {
  'supply-identity': [{ place: 'supply', text: `Check the MPAN (your 13-digit supply number) in “${stepTitle('supply')}” against an electricity bill.` }],
  'supply-headroom': [lookAgain('supply'), lookAgain('loads'), { place: 'photos', text: 'Send a clear photo of the cut-out, if you haven’t yet.' }],
  'network-operator': [lookAgain('supply'), lookAgain('loads')],
  earthing: [lookAgain('fusebox'), lookAgain('charger')],
  'cable-run': [lookAgain('charger')],
  'cable-reach': [{ place: 'chargepoint', text: `Check the driveway plan in “${stepTitle('chargepoint')}” and the charging socket in “${stepTitle('parking')}”.` }],
  parking: [lookAgain('parking')],
  timing: [{ place: 'vehicle', text: `Check the expected delivery date in “${stepTitle('vehicle')}”.` }],
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
