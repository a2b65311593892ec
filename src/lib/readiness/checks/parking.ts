// Parking: private off-street parking is needed; a bay not attached to the home needs evidence.
import { optionWords } from '@/lib/vocabulary/fields';
import { COMMON_PRACTICE } from '@/lib/readiness/settings';
import type { CheckInput, CheckResult, ParkingKind } from '@/lib/readiness/types';
import { uploadKindStatus, type UploadKindStatus } from '@/lib/readiness/upload-status';
import { checkTitles } from '../check-titles';

const SOURCE = `${COMMON_PRACTICE} (home charge points and funding schemes expect private off-street parking; check the current scheme rules)`;
const TITLE = checkTitles['parking'];

/**
 * No parking is red; a detached bay is green only with accepted evidence, red when the evidence
 * was rejected; a driveway or garage attached to the home is green.
 *
 * @example checkParking({ answers: { parking: { kind: 'garage' } }, uploads: [], settings: defaultReadinessSettings, today: '2025-01-01' }).light
 * // 'green'
 */
export function checkParking({ answers, uploads }: CheckInput): CheckResult {
  const kind: ParkingKind | null = answers.parking?.kind ?? null;
  if (kind === null) {
    return result('amber', 'Please tell us where you park: a driveway or garage at your home, or an allocated bay elsewhere.', 'Parking kind not given.', kind, null, [
      'Answer the parking question.',
    ]);
  }
  if (kind === 'none') {
    return result(
      'red',
      "A home charge point needs private off-street parking, such as a driveway or garage. Without it we can't fit one at your home — please call us if your parking has changed.",
      'No off-street parking: not eligible for a home charge point.',
      kind,
      null,
      ['Off-street parking is needed before a home charge point can be fitted.'],
    );
  }
  if (kind !== 'detached-bay') {
    return result('green', 'Thank you — your parking at home suits a charge point.', `Off-street parking: ${(optionWords('parking.kind', kind, 'staff') ?? kind).toLowerCase()}.`, kind, null, []);
  }
  return detachedBayResult(uploadKindStatus('parking_evidence', uploads));
}

function detachedBayResult(evidence: UploadKindStatus): CheckResult {
  switch (evidence.state) {
    case 'accepted':
      return result('green', 'Thank you — we have checked the proof of your parking space.', 'Detached bay; parking evidence accepted.', 'detached-bay', evidence, []);
    case 'waiting':
      return result('amber', 'Thank you for the proof of your parking space: your installer will check it soon.', 'Detached bay; parking evidence awaiting review.', 'detached-bay', evidence, [
        'The office to review the parking evidence.',
      ]);
    case 'rejected':
      return result(
        'red',
        `We couldn't accept the proof of your parking space${evidence.reason ? `: ${evidence.reason}` : ''}. Please send another, such as a title plan or lease plan showing the bay.`,
        `Detached bay; parking evidence rejected${evidence.reason ? ` (${evidence.reason})` : ''}.`,
        'detached-bay',
        evidence,
        ['Upload new parking evidence (property records or a lease plan showing the bay).'],
      );
    case 'missing':
      return result(
        'amber',
        'As your parking bay is not attached to your home, please upload proof that it is yours to use, such as a title plan or lease plan.',
        'Detached bay; no parking evidence uploaded.',
        'detached-bay',
        evidence,
        ['Upload parking evidence (property records or a lease plan showing the bay).'],
      );
  }
}

function result(
  light: CheckResult['light'],
  customerText: string,
  staffText: string,
  kind: ParkingKind | null,
  evidence: UploadKindStatus | null,
  actions: string[],
): CheckResult {
  const figures = { kind, evidence: evidence?.state ?? null, evidenceReason: evidence?.reason ?? null };
  return { id: 'parking', light, title: TITLE, customerText, staffText, figures, source: SOURCE, actions };
}
