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
      <ChoiceField path="parking.kind" />
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
      <NumberField path="parking.cars" integer placeholder="e.g. 2" />
      <ChoiceField path="parking.habit" columns={3} />
      <ChoiceField
        path="vehicle.chargePort"
        aside={<ChargePortPicture position={chargePort} />}
      />
      {kind === 'detached-bay' && <StepEvidence caseId={caseId} kinds={['parking_evidence']} heading="Proof of your parking space" />}
    </div>
  );
}
