// Parking: where the car stands while it charges, which way round, and where its socket is
// (saved as vehicle.chargePort, as before).
import { StepEvidence } from './step-evidence';
import { ChoiceField, NumberField, useFieldValue } from './fields';
import { Note } from './notes';
import { ChargePortPicture } from './charge-port-picture';

export function ParkingStep({ caseId }: { caseId: string }) {
  const kind = useFieldValue('parking.kind');
  const chargePort = useFieldValue('vehicle.chargePort');
  return (
    <div className="space-y-6">
      <ChoiceField path="parking.kind" help="A home charge point needs parking off the road, so the cable never crosses a pavement." />
      {kind === 'detached-bay' && (
        <Note>
          <p>
            For a space that isn’t joined to your home, your installer will ask for proof it is yours to use, such as the property’s
            title plan or a lease plan showing the bay.
          </p>
        </Note>
      )}
      {kind === 'none' && (
        <Note tone="attention">
          <p>
            Without off-street parking a home charge point usually can’t be fitted. Carry on anyway: your installer will look at your
            answers and talk you through what is possible.
          </p>
        </Note>
      )}
      <NumberField path="parking.cars" integer placeholder="e.g. 2" help="Include the electric car. This helps us see where it will stand." />
      <ChoiceField path="parking.habit" columns={3} help="Together with where the car’s socket is, this tells us how far the cable must reach." />
      <ChoiceField
        path="vehicle.chargePort"
        help="Left and right as you sit in the driver’s seat. This decides whether a cable reaches the car where you park."
        aside={<ChargePortPicture position={chargePort} />}
      />
      {kind === 'detached-bay' && <StepEvidence caseId={caseId} kinds={['parking_evidence']} heading="Proof of your parking space" />}
    </div>
  );
}
