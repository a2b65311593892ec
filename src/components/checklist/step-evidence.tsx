// The uploads a step asks for, dropped in at the end of that step, with the photo cautions
// (src/lib/cautions.ts) above the slots wherever a supply photo is asked for.
import { customerPhotoCautions, slotCaution } from '@/lib/cautions';
import type { UploadKind } from '@/lib/schemas/uploads';
import UploadSlot from '@/components/uploads/upload-slot';
import { Caution } from './notes';

export function StepEvidence({ caseId, kinds, heading = 'Photos' }: { caseId: string; kinds: UploadKind[]; heading?: string }) {
  if (kinds.length === 0) return null;
  const risky = kinds.some((kind) => slotCaution(kind) !== null);
  return (
    <section aria-label={heading} className="space-y-4 border-t border-ground-100 pt-6" data-testid="step-evidence">
      <h3 className="text-lg font-bold text-ground-900">{heading}</h3>
      {risky && <PhotoCautions />}
      {kinds.map((kind) => (
        <UploadSlot key={kind} caseId={caseId} kind={kind} required />
      ))}
    </section>
  );
}

/** Every photo caution, as a list in the Safety box. */
export function PhotoCautions() {
  return (
    <Caution title="Safety first">
      <ul className="list-disc space-y-1 pl-5" data-testid="photo-cautions">
        {customerPhotoCautions.map((text) => (
          <li key={text}>{text}</li>
        ))}
      </ul>
    </Caution>
  );
}
