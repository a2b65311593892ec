// Step 4, Fuse box and big electric loads: where the consumer unit is, its photo and socket
// circuits, and the big loads already in the home. Saved under supply (supply.loads.*) as before.
import { StepEvidence } from './step-evidence';
import { ChoiceField, NumberField, TextField } from './fields';
import { Caution } from './notes';

export function LoadsStep({ caseId }: { caseId: string }) {
  return (
    <div className="space-y-6">
      <Caution>
        <p>Look and take photos only: never open the consumer unit or remove its cover.</p>
      </Caution>

      <TextField
        path="supply.consumerUnitLocation"
        multiline
        help="The consumer unit, often called the fuse box, holds your home’s switches and circuit breakers. For example: “under the stairs” or “garage, back wall”."
      />

      <fieldset className="space-y-5 rounded-lg border border-ground-100 p-4">
        <legend className="float-left w-full text-lg font-bold text-ground-900">Big electrical loads already in your home</legend>
        <p className="field-help clear-both !mt-1 pt-1">
          These add up with a charger at busy times. Give 0 for anything you don’t have. A rating is usually on a label on the front or
          underside of the appliance, or in its manual.
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
          help="Look at the labels beside the switches in your fuse box (consumer unit), or in your photo of it: count the ones marked sockets, ring or power. Don’t open anything."
        />
      </fieldset>
      <StepEvidence caseId={caseId} kinds={['consumer_unit_photo']} heading="A photo of your consumer unit (photos only — never open anything)" />
    </div>
  );
}
