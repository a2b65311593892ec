// The registration look-up in the vehicle step: once a plate is typed, ask the vehicle records,
// fill in the make if the customer has not typed one, and say plainly when the car on record is
// not one that charges from a charge point. Never in the way: slow, failing or unknown answers
// just leave the make for the customer to type.
import { useEffect, useRef, useState } from 'react';
import { checkRegistration } from '@/lib/validation/registration';
import { fuelWords } from '@/lib/vehicle-fuel';
import { InfoIcon, SpinnerIcon, WarningIcon } from '@/components/icons';
import { useChecklist } from './checklist-context';
import { lookupVehicle, type LookupOutcome } from './services-client';

type State = { plate: string; outcome: LookupOutcome | { kind: 'pending' } } | null;

// Long enough that a plate is finished being typed, short enough to feel immediate.
const TYPING_PAUSE_MS = 500;

/**
 * Looks the registration up after a pause in typing; pre-fills the make when the field is empty
 * or still holds a make this look-up filled in.
 */
export function useVehicleLookup(caseId: string, registration: string, off: boolean): State {
  const { form, edit } = useChecklist();
  const [state, setState] = useState<State>(null);
  const filled = useRef<string | null>(null);

  useEffect(() => {
    const checked = checkRegistration(registration);
    if (off || !checked.ok || checked.format === 'unknown') {
      setState(null);
      return;
    }
    const plate = checked.registration;
    if (state?.plate === plate && state.outcome.kind !== 'pending') return;
    let live = true;
    const timer = setTimeout(async () => {
      setState({ plate, outcome: { kind: 'pending' } });
      const outcome = await lookupVehicle(caseId, plate);
      if (!live) return;
      setState({ plate, outcome });
      const make = outcome.kind === 'found' ? outcome.vehicle.makeWords : null;
      const current = String(form.getValues('vehicle.make') ?? '').trim();
      if (make && (current === '' || current === filled.current)) {
        form.setValue('vehicle.make', make);
        edit('vehicle.make', make, 'now');
        filled.current = make;
      }
    }, TYPING_PAUSE_MS);
    return () => {
      live = false;
      clearTimeout(timer);
    };
  }, [caseId, registration, off]); // eslint-disable-line react-hooks/exhaustive-deps

  return state;
}

function describe(v: { colour: string | null; makeWords: string | null; yearOfManufacture: number | null; fuelType: string | null }): string {
  const parts = [v.colour?.toLowerCase(), v.makeWords].filter(Boolean).join(' ');
  const year = v.yearOfManufacture ? `, made in ${v.yearOfManufacture}` : '';
  const fuel = v.fuelType ? `, ${fuelWords(v.fuelType)}` : '';
  return `${parts || 'a vehicle'}${year}${fuel}`;
}

/** What the look-up found, in words, under the registration field. */
export function VehicleLookupNote({ state }: { state: State }) {
  if (!state || state.outcome.kind === 'off') return null;
  const { plate, outcome } = state;
  const box = 'flex items-start gap-2 rounded-md p-2.5 text-sm';
  if (outcome.kind === 'pending') {
    return <p className={`${box} text-ground-700`} role="status"><SpinnerIcon className="mt-0.5 h-4 w-4" />Looking up {plate}…</p>;
  }
  if (outcome.kind === 'found') {
    return (
      <div className="space-y-2" role="status" data-testid="vehicle-lookup">
        <p className={`${box} border border-ground-100 bg-ground-50 text-ink`}>
          <InfoIcon className="mt-0.5 h-4 w-4 text-ground-700" />
          <span>The vehicle records for {plate} show a {describe(outcome.vehicle)}. We’ve used that for the make; change it if it’s wrong.</span>
        </p>
        {outcome.advice && (
          <p className={`${box} border border-attention/40 bg-attention-soft text-ink`} data-testid="vehicle-fuel-advice">
            <WarningIcon className="mt-0.5 h-4 w-4 text-attention" />
            <span>{outcome.advice}</span>
          </p>
        )}
      </div>
    );
  }
  const words =
    outcome.kind === 'not_found'
      ? `We couldn’t find ${plate} in the vehicle records. That’s fine: please type the make yourself.`
      : 'We couldn’t look the car up just now. Please type the make yourself.';
  return <p className={`${box} text-ground-800`} role="status" data-testid="vehicle-lookup">{words}</p>;
}
