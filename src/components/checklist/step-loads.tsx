// The consumer unit, earthing and phases; the photos of the supply; then the big loads already in the home.
// Both save under supply (supply.consumerUnitLocation, supply.loads.*) as before.
import { StepEvidence } from './step-evidence';
import { ChoiceField, NumberField, TextField } from './fields';
import { caution } from '@/lib/cautions';
import { Caution, MoreHelp } from './notes';

/** Your consumer unit and earthing: where the consumer unit is, earthing and phases. */
export function FuseBoxStep() {
  return (
    <div className="space-y-6">
      <Caution>
        <p>Look and take photos only: never open the consumer unit or remove its cover, and don’t touch any wires. {caution.consumerUnitClosed}</p>
        <p>{caution.danger}</p>
      </Caution>

      <TextField
        path="supply.consumerUnitLocation"
        multiline
        help="The consumer unit, often called the fuse box, holds your home’s switches and circuit breakers. For example: “under the stairs” or “garage, back wall”."
      />

      <ChoiceField
        path="supply.earthing"
        help="How your wiring connects to earth, which is part of what keeps you safe. Your electrician will check it; tell us if you already know."
      >
        <MoreHelp summary="Where could I see which type I have?">
          <p>
            Look near the meter for a label, such as one saying “Protective Multiple Earthing”, and at where the green-and-yellow earth
            wire goes. An old electrical certificate for the home may also name it (TN-C-S, TN-S or TT). Look only; don’t touch any wires.
          </p>
        </MoreHelp>
      </ChoiceField>

      <ChoiceField
        path="supply.phases"
        help="Most homes have a single-phase supply. Chargers above 7.4 kW need three phases, so it helps to know."
      >
        <MoreHelp summary="How can I tell from the meter and the cut-out?">
          <p>
            Look, without touching, at the cut-out: one fuse holder means single phase; three fuse holders side by side (or a wide unit marked
            “3-phase”) mean three phase. The meter may say “3 ph”, “3 × 230/400 V” or show three readings.
          </p>
          <p>Your photos of the meter and cut-out usually let your installer tell, so “I’m not sure” is fine.</p>
        </MoreHelp>
      </ChoiceField>

    </div>
  );
}

/** Photos of your supply: the meter, the cut-out and the consumer unit, with the photo cautions above them. */
export function SupplyPhotosStep({ caseId }: { caseId: string }) {
  return <StepEvidence caseId={caseId} kinds={['meter_photo', 'cutout_photo', 'consumer_unit_photo']} heading="Photos only — never open anything" />;
}

/** Big electric loads: what already draws a lot of power, and the socket circuits. */
export function LoadsStep() {
  return (
    <div className="space-y-6">
      <fieldset className="space-y-5 rounded-lg border border-ground-100 p-4">
        <legend className="float-left w-full text-lg font-bold text-ground-900">Big electrical loads already in your home</legend>
        <p className="field-help clear-both !mt-1 pt-1">
          These add up with a charge point at busy times. Give 0 for anything you don’t have. A rating is usually on a label on the front or
          underside of the appliance, or in its manual. {caution.applianceRating}
        </p>
        <NumberField path="supply.loads.showerKw" placeholder="e.g. 9.5" help="An electric shower heats its own water, usually 7 to 10.5 kW." />
        <ChoiceField path="supply.loads.cooker" columns={2} help="An oven, hob or range that runs on electricity." />
        <ChoiceField path="supply.loads.immersion" columns={2} help="An electric element that heats a hot-water cylinder." />
        <NumberField path="supply.loads.heatPumpKw" placeholder="e.g. 5" help="An air- or ground-source heat pump for heating." />
        <NumberField path="supply.loads.storageHeaters" placeholder="e.g. 6" help="All storage heaters added together, for example three of 2 kW make 6." />
        <ChoiceField path="supply.loads.otherEvCharger" columns={2} />
        <ChoiceField path="supply.loads.solarPv" columns={2} />
        <ChoiceField
          path="supply.loads.socketCircuits"
          columns={3}
          help="Look at the labels beside the switches in your consumer unit, or in your photo of it: count the ones marked sockets, ring or power. Don’t open anything."
        />
      </fieldset>
    </div>
  );
}
