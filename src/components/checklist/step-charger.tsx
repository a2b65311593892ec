// Steps 7 and 8, Charge point and cable route (where it goes, how the cable gets there) and
// Which charge point (tethered or socketed, power, reach).
import { StepEvidence } from './step-evidence';
import { ChoiceField, NumberField, TextField, useFieldValue } from './fields';
import { MoreHelp, Note } from './notes';

export function ChargerStep({ caseId }: { caseId: string }) {
  const softGround = useFieldValue('charger.softGround');
  return (
    <div className="space-y-6">
      <TextField
        path="charger.location"
        multiline
      />
      <NumberField
        path="charger.cableRunMetres"
        placeholder="e.g. 8"
      />
      <ChoiceField path="charger.route" />
      <ChoiceField
        path="charger.softGround"
        columns={2}
      >
        <MoreHelp summary="Why do you ask about soft ground?">
          <p>
            Some homes need an earth rod for the charge point: a metal rod driven into the ground nearby, with a cable to it. That is far
            easier in open soil than through a hard surface. Your electrician decides whether one is needed.
          </p>
        </MoreHelp>
      </ChoiceField>
      {softGround === 'yes' && <NumberField path="charger.softGroundMetres" placeholder="e.g. 3" />}
      <StepEvidence caseId={caseId} kinds={['charger_location_photo']} heading="Photo of the spot" />
    </div>
  );
}

/** Which charge point: tethered or socketed, its cable, its power, and whether the cable reaches. */
export function ChargePointStep({ caseId }: { caseId: string }) {
  const preference = useFieldValue('charger.preference');
  return (
    <div className="space-y-6">
      <ChoiceField path="charger.preference">
        <MoreHelp summary="Which should I choose?">
          <p>
            Tethered is quicker day to day: nothing to get out of the boot. Socketed looks tidier when not in use and works with any cable
            length, but you keep and plug in your own cable. Either is fine for the survey; you can change your mind later.
          </p>
        </MoreHelp>
      </ChoiceField>
      {preference === 'tethered' && (
        <NumberField path="charger.tetherMetres" placeholder="e.g. 5" />
      )}
      <ChoiceField
        path="charger.ratingKw"
        columns={2}
      />
      <div className="rounded-lg border border-ground-200 bg-ground-50 p-4" data-testid="plan-link">
        <p className="font-bold text-ground-900">Will the cable reach the car?</p>
        <p className="mt-1 text-ground-800">
          Sketch your drive to scale — the wall, where the car parks and where the charge point goes — and we’ll show whether the cable
          reaches the car’s charging socket whichever way you park. No drawing skills needed.
        </p>
        <a href={`/my/cases/${caseId}/plan`} className="btn-secondary mt-3">
          Draw my driveway
        </a>
      </div>
      <Note>
        <p className="font-semibold text-ground-900">Your electrician has the final say</p>
        <p>
          These answers help your installer prepare. The charge point itself is designed, fitted and certified by a qualified electrician,
          under BS 7671 (the UK wiring regulations), the IET Code of Practice for EV charging, and local building and planning rules.
        </p>
      </Note>
    </div>
  );
}
