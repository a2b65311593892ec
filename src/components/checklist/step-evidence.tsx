// The uploads a step asks for, dropped in at the end of that step.
import type { UploadKind } from '../../lib/schemas/uploads';
import UploadSlot from '../uploads/upload-slot';

export function StepEvidence({ caseId, kinds, heading = 'Photos' }: { caseId: string; kinds: UploadKind[]; heading?: string }) {
  if (kinds.length === 0) return null;
  return (
    <section aria-label={heading} className="space-y-4 border-t border-ground-100 pt-6" data-testid="step-evidence">
      <h3 className="text-lg font-bold text-ground-900">{heading}</h3>
      {kinds.map((kind) => (
        <UploadSlot key={kind} caseId={caseId} kind={kind} required />
      ))}
    </section>
  );
}
