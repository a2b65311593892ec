import { describe, expect, it } from 'vitest';
import { checkParking } from '@/lib/readiness/checks/parking';
import { defaultReadinessSettings } from '@/lib/readiness/settings';
import type { ParkingKind, UploadSummary } from '@/lib/readiness';

// Private off-street parking is needed for a home charge point; a bay not attached to the home
// needs evidence (common practice, no published source; funding schemes set their own rules).

function parking(kind: ParkingKind | null, uploads: UploadSummary[] = []) {
  return checkParking({ answers: { parking: { kind } }, uploads, site: {}, settings: defaultReadinessSettings, today: '2025-03-03' });
}

describe('parking eligibility and evidence', () => {
  it.each([
    { kind: 'none', uploads: [], light: 'red' },
    { kind: 'attached-drive', uploads: [], light: 'green' },
    { kind: 'garage', uploads: [], light: 'green' },
    { kind: null, uploads: [], light: 'amber' },
    // Detached bay: amber until evidence is accepted, red if it was rejected.
    { kind: 'detached-bay', uploads: [], light: 'amber' },
    { kind: 'detached-bay', uploads: [{ kind: 'parking_evidence', status: 'waiting' }], light: 'amber' },
    { kind: 'detached-bay', uploads: [{ kind: 'parking_evidence', status: 'accepted' }], light: 'green' },
    { kind: 'detached-bay', uploads: [{ kind: 'parking_evidence', status: 'rejected', reason: 'Plan does not show the bay' }], light: 'red' },
    // Evidence of another kind does not count.
    { kind: 'detached-bay', uploads: [{ kind: 'other', status: 'accepted' }], light: 'amber' },
  ] as const)('$kind with $uploads → $light', ({ kind, uploads, light }) => {
    const result = parking(kind, [...uploads]);
    expect(result.light).toBe(light);
    expect(light === 'green' ? result.actions.length === 0 : result.actions.length > 0).toBe(true);
  });

  it('gives the rejection reason back to the customer', () => {
    const result = parking('detached-bay', [{ kind: 'parking_evidence', status: 'rejected', reason: 'Plan does not show the bay' }]);
    expect(result.customerText).toContain('Plan does not show the bay');
    expect(result.figures).toMatchObject({ evidence: 'rejected', evidenceReason: 'Plan does not show the bay' });
  });
});
