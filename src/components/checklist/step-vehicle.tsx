// Step 2, Your vehicle: which car, when it comes, its plug and where its socket is.
import { StepEvidence } from './step-evidence';
import { useState } from 'react';
import { fieldWarnings } from '@/lib/schemas/checklist';
import { checkRegistration } from '@/lib/validation/registration';
import { checkIsoDate } from '@/lib/validation/date';
import { normaliseVin } from '@/lib/validation/vin';
import { useChecklist } from './checklist-context';
import { ChoiceField, TextField, useFieldValue } from './fields';
import { MoreHelp } from './notes';
import { useVehicleLookup, VehicleLookupNote } from './vehicle-lookup';

/** A valid mark written the usual way ("AB12 CDE"); anything else left as typed. */
export function tidyRegistration(value: string): string {
  const result = checkRegistration(value);
  return result.ok ? result.registration : value;
}

const longDate = new Intl.DateTimeFormat('en-GB', { weekday: 'long', day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

/** A date in words, so a browser that shows the picker US-style can't leave doubt. @example dateInWords('2027-03-15') // 'Monday 15 March 2027' */
export function dateInWords(iso: string): string | null {
  const result = checkIsoDate(iso);
  return result.ok ? longDate.format(new Date(`${result.date}T00:00:00Z`)).replace(',', '') : null;
}

// The same warnings the server attaches to a saved case, worked out as the customer types.
function vehicleWarning(field: 'registration' | 'vin', value: string): string | null {
  if (value.trim() === '') return null;
  return fieldWarnings({ vehicle: { [field]: field === 'vin' ? normaliseVin(value) : value } })[`vehicle.${field}`] ?? null;
}

/** True while the vehicle records are about to be, or being, asked about this plate. */
function awaitingRecords(lookup: ReturnType<typeof useVehicleLookup>, registration: string): boolean {
  if (lookup) return lookup.outcome.kind === 'pending';
  const checked = checkRegistration(registration);
  return checked.ok && checked.format !== 'unknown';
}

export function VehicleStep({ caseId }: { caseId: string }) {
  const condition = useFieldValue('vehicle.condition');
  const { form, hydrated } = useChecklist();
  const registration = useFieldValue('vehicle.registration');
  const vin = useFieldValue('vehicle.vin');
  const delivery = dateInWords(useFieldValue('vehicle.deliveryDate'));
  // Shown as "not registered" when only a VIN is saved; the choice itself is not stored.
  const [notRegistered, setNotRegistered] = useState(() => {
    const values = form.getValues();
    return Boolean(values.vehicle?.vin) && !values.vehicle?.registration;
  });
  const lookup = useVehicleLookup(caseId, registration, notRegistered);

  return (
    <div className="space-y-6">
      <div className="space-y-4 rounded-lg border border-ground-100 p-4">
        <p className="text-lg font-bold text-ground-900">Which car it is</p>
        <label className="flex min-h-[48px] cursor-pointer items-center gap-3 rounded-lg border-2 border-ground-100 bg-white p-3 has-[:checked]:border-ground-600 has-[:checked]:bg-ground-50 has-[:focus-visible]:ring-4 has-[:focus-visible]:ring-clay-300">
          <input
            type="checkbox"
            className="h-5 w-5 shrink-0 accent-ground-700"
            checked={notRegistered}
            // Its state lives in the island: a tick before hydration would be undone by it.
            disabled={!hydrated}
            onChange={(e) => setNotRegistered(e.target.checked)}
          />
          <span>
            <span className="block font-semibold text-ground-900">Not registered yet</span>
            <span className="block text-sm text-ground-700">Tick this if the car has no number plate yet; give its VIN instead.</span>
          </span>
        </label>
        {notRegistered ? (
          <TextField
            path="vehicle.vin"
            autoCapitalize="characters"
            spellCheck={false}
            normalise={normaliseVin}
            warning={vehicleWarning('vin', vin)}
          />
        ) : (
          <TextField
            path="vehicle.registration"
            autoCapitalize="characters"
            spellCheck={false}
            size="short"
            normalise={tidyRegistration}
            // A plate the vehicle records hold has been issued, whatever its age identifier suggests,
            // so the warning waits for the look-up (it starts half a second after typing stops).
            warning={awaitingRecords(lookup, registration) || lookup?.outcome.kind === 'found' ? null : vehicleWarning('registration', registration)}
            confirmation={lookup && lookup.outcome.kind !== 'off' ? <VehicleLookupNote state={lookup} /> : null}
          />
        )}
      </div>
      <div className="grid gap-6 sm:grid-cols-2">
        <TextField path="vehicle.make" />
        <TextField path="vehicle.model" />
      </div>
      <ChoiceField path="vehicle.condition" columns={2} />

      <TextField
        path="vehicle.deliveryDate"
        type="date"
        size="short"
        confirmation={delivery ? <p className="text-ground-800">That’s {delivery}.</p> : null}
      />
      <ChoiceField path="vehicle.connector">
        <MoreHelp summary="How do I tell?">
          <p>
            Look at the charging socket on the car, or the plug on the cable that came with it. The car’s handbook or order form may also
            name it. Type 2 is by far the most common in the UK.
          </p>
        </MoreHelp>
      </ChoiceField>
      {condition === 'new' && <StepEvidence caseId={caseId} kinds={['order_agreement']} heading="Order agreement" />}
    </div>
  );
}
