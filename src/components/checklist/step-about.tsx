// Step 1, About you: who to contact and the home where the charge point goes.
import { StepEvidence } from './step-evidence';
import { checkPostcode } from '../../lib/validation/postcode';
import { checkUkPhone } from '../../lib/validation/phone';
import { ChoiceField, TextField, useFieldValue } from './fields';
import { Note } from './notes';
import { lazy, Suspense } from 'react';

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

export function AboutStep({ caseId }: { caseId: string }) {
  const tenure = useFieldValue('about.tenure');
  const propertyType = useFieldValue('about.propertyType');
  return (
    <div className="space-y-6">
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
      <Suspense fallback={null}>
        <TextOptIn caseId={caseId} />
      </Suspense>
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
