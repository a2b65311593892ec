// Steps 1 and 2, About you (who to contact) and Your home (where the charge point goes).
import { StepEvidence } from './step-evidence';
import { checkPostcode } from '@/lib/validation/postcode';
import { checkUkPhone } from '@/lib/validation/phone';
import { ChoiceField, PREFILLED_MARK, TextField, useFieldValue } from './fields';
import { useChecklist } from './checklist-context';
import { fieldDefs } from './field-defs';
import { CheckIcon } from '@/components/icons';
import { stepOfField, type StepId } from '@/lib/checklist-steps';
import { listWords } from '@/lib/grammar';
import { Note } from './notes';
import { lazy, Suspense, useEffect, useState } from 'react';

// Loaded only when the About step shows, and it renders nothing when texts are off.
const TextOptIn = lazy(() => import('./text-opt-in').then((m) => ({ default: m.TextOptIn })));

/** A valid UK number shown the national way; anything else left as typed for the error to explain. */
export function tidyPhone(value: string): string {
  const result = checkUkPhone(value);
  return result.ok ? result.display : value;
}

/** A valid postcode in capitals with its one space; anything else left as typed. */
export function tidyPostcode(value: string): string {
  const result = checkPostcode(value);
  return result.ok ? result.postcode : value;
}

/** The details the installer filled in from the invitation, and the button that confirms them. */
function FromYourInstaller({ step }: { step: StepId }) {
  const { prefilled, confirmDetails, confirming } = useChecklist();
  const here = fieldDefs.filter((d) => prefilled?.has(d.path) && stepOfField(d.path) === step);
  if (here.length === 0) return null;
  const names = here.map((d) => d.label.replace(/ \(optional\)$/, '').toLowerCase());
  return (
    <section aria-labelledby="prefilled-heading" className="rounded-lg border-l-4 border-clay-500 bg-clay-50 p-4" data-testid="prefilled-note">
      <h3 id="prefilled-heading" className="font-bold text-ground-900">
        {PREFILLED_MARK}
      </h3>
      <p className="mt-1 text-ground-800">
        Your installer has filled in your {listWords(names)} from your invitation. Change anything that isn’t right, then confirm the rest.
      </p>
      <button type="button" className="btn-primary mt-3 w-full sm:w-auto" disabled={confirming} onClick={() => void confirmDetails?.(here.map((d) => d.path))}>
        <CheckIcon className="h-5 w-5" /> {confirming ? 'Confirming…' : 'Yes, these details are right'}
      </button>
    </section>
  );
}

export function AboutStep({ caseId }: { caseId: string }) {
  const [hydrated, setHydrated] = useState(false);
  useEffect(() => setHydrated(true), []);
  return (
    <div className="space-y-6">
      <FromYourInstaller step="about" />
      <TextField path="about.fullName" autoComplete="name" />
      <TextField
        path="about.email"
        type="email"
        inputMode="email"
        autoComplete="email"
        autoCapitalize="none"
        spellCheck={false}
        help="Where your installer sends updates about the job."
      />
      <TextField
        path="about.phone"
        type="tel"
        inputMode="tel"
        autoComplete="tel"
        normalise={tidyPhone}
        help="A mobile is best, so your installer can reach you on the day."
      />
      {/* Only after hydration: a lazy part suspending mid-hydration would leave the fields below it unwired. */}
      {hydrated && (
        <Suspense fallback={null}>
          <TextOptIn caseId={caseId} />
        </Suspense>
      )}
    </div>
  );
}

/** Step 2, Your home: the address where the charge point goes, owning or renting, and the kind of home. */
export function HomeStep({ caseId }: { caseId: string }) {
  const tenure = useFieldValue('about.tenure');
  const propertyType = useFieldValue('about.propertyType');
  return (
    <div className="space-y-6">
      <FromYourInstaller step="home" />
      <fieldset className="space-y-4 rounded-lg border border-ground-100 p-4">
        <legend className="float-left w-full text-lg font-bold text-ground-900">The home where the charge point will go</legend>
        <p className="field-help clear-both !mt-1 pt-1">Give this address even if your post goes somewhere else.</p>
        <TextField path="about.addressLine1" autoComplete="address-line1" />
        <TextField path="about.addressLine2" autoComplete="address-line2" />
        <TextField path="about.town" autoComplete="address-level2" />
        <TextField
          path="about.postcode"
          autoComplete="postal-code"
          autoCapitalize="characters"
          normalise={tidyPostcode}
          size="short"
          spellCheck={false}
        />
      </fieldset>
      <ChoiceField path="about.tenure" />
      {tenure === 'tenant' && (
        <Note>
          <p>
            As you rent, your landlord needs to agree to the charge point in writing before it is fitted. Your installer will ask you
            for that letter or e-mail later; it is worth asking your landlord now.
          </p>
        </Note>
      )}
      <ChoiceField path="about.propertyType" />
      {propertyType === 'flat' && (
        <Note>
          <p>
            In a block of flats the cable often crosses shared walls or ground, so the freeholder or management company usually has to
            agree. Your installer will talk this through with you.
          </p>
        </Note>
      )}
      {tenure === 'tenant' && <StepEvidence caseId={caseId} kinds={['landlord_permission']} heading="Your landlord’s permission" />}
    </div>
  );
}
