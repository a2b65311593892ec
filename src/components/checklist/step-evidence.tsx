// The uploads a step asks for, dropped in at the end of that step, with the photo cautions
// (src/lib/cautions.ts) above the slots wherever a supply photo is asked for.
import { customerPhotoCautions, slotCaution } from '../../lib/cautions';
import type { UploadKind } from '../../lib/schemas/uploads';
import UploadSlot from '../uploads/upload-slot';

export function StepEvidence({ caseId, kinds, heading = 'Photos' }: { caseId: string; kinds: UploadKind[]; heading?: string }) {
  if (kinds.length === 0) return null;
  const risky = kinds.some((kind) => slotCaution(kind) !== null);
  return (
    <section aria-label={heading} className="space-y-4 border-t border-ground-100 pt-6" data-testid="step-evidence">
      <h3 className="text-lg font-bold text-ground-900">{heading}</h3>
      {risky && <PhotoCautions />}
      {kinds.map((kind) => (
        // Each slot's one-line caution is already in the step's Safety box and the list above.
        <UploadSlot key={kind} caseId={caseId} kind={kind} required showCaution={false} />
      ))}
    </section>
  );
}

/**
 * Every photo caution, as a list. The step's own Safety box above already says the ones that
 * matter for its photos, and each slot repeats its own, so the whole list is one tap away rather
 * than another screen of red on a phone.
 */
export function PhotoCautions() {
  return (
    <details className="group rounded-lg border-l-4 border-blocked bg-blocked-soft p-3 text-ink" data-testid="photo-cautions-box">
      <summary className="cursor-pointer font-bold text-blocked">Safety when taking these photos</summary>
      <ul className="mt-2 list-disc space-y-1 pl-5" data-testid="photo-cautions">
        {customerPhotoCautions.map((text) => (
          <li key={text}>{text}</li>
        ))}
      </ul>
    </details>
  );
}
