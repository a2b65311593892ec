import { describe, expect, it } from 'vitest';
import { checkDocuments, requiredUploadKinds } from '@/lib/readiness/checks/documents';
import { defaultReadinessSettings } from '@/lib/readiness/settings';
import type { ChecklistAnswers, UploadKind, UploadSummary } from '@/lib/readiness';

// What the office needs before a survey (common practice, no published source): four photos
// always; the order agreement for a new car; parking evidence for a detached bay; the
// landlord's permission for a tenant.
const BASE: UploadKind[] = ['meter_photo', 'cutout_photo', 'consumer_unit_photo', 'charger_location_photo'];

function accepted(kinds: UploadKind[]): UploadSummary[] {
  return kinds.map((kind) => ({ kind, status: 'accepted' }));
}

function documents(answers: ChecklistAnswers, uploads: UploadSummary[]) {
  return checkDocuments({ answers, uploads, site: {}, settings: defaultReadinessSettings, today: '2025-03-03' });
}

describe('required uploads follow the answers', () => {
  it.each([
    { name: 'owner, used car, driveway', answers: { about: { tenure: 'owner' }, vehicle: { condition: 'used' }, parking: { kind: 'attached-drive' } }, extra: [] },
    { name: 'new car', answers: { vehicle: { condition: 'new' } }, extra: ['order_agreement'] },
    { name: 'detached bay', answers: { parking: { kind: 'detached-bay' } }, extra: ['parking_evidence'] },
    { name: 'tenant', answers: { about: { tenure: 'tenant' } }, extra: ['landlord_permission'] },
    {
      name: 'all three',
      answers: { about: { tenure: 'tenant' }, vehicle: { condition: 'new' }, parking: { kind: 'detached-bay' } },
      extra: ['order_agreement', 'parking_evidence', 'landlord_permission'],
    },
    { name: 'nothing answered', answers: {}, extra: [] },
  ] as const)('$name', ({ answers, extra }) => {
    expect(requiredUploadKinds(answers as ChecklistAnswers)).toEqual([...BASE, ...extra]);
  });
});

describe('documents light', () => {
  it('is green when every required upload is accepted', () => {
    const result = documents({}, accepted(BASE));
    expect(result.light).toBe('green');
    expect(result.actions).toEqual([]);
  });

  it('is amber when one is missing, naming it', () => {
    const result = documents({}, accepted(BASE.slice(0, 3)));
    expect(result.light).toBe('amber');
    expect(result.figures.missingKinds).toEqual(['charger_location_photo']);
    expect(result.customerText).toContain('photo of where you would like the charge point');
  });

  it('is amber while one waits for review', () => {
    const uploads: UploadSummary[] = [...accepted(BASE.slice(1)), { kind: 'meter_photo', status: 'waiting' }];
    const result = documents({}, uploads);
    expect(result.light).toBe('amber');
    expect(result.figures.waitingKinds).toEqual(['meter_photo']);
  });

  it('ends a reason the office typed with a full stop only once, in every text', () => {
    const uploads: UploadSummary[] = [...accepted(BASE.slice(0, 1).concat(BASE.slice(2))), { kind: 'cutout_photo', status: 'rejected', reason: 'Too dark: the rating cannot be read.' }];
    const result = documents({ supply: {} }, uploads);
    for (const text of [result.customerText, result.staffText, ...result.actions]) expect(text).not.toMatch(/\.[)”]?\./);
    expect(result.customerText).toContain('cut-out): Too dark: the rating cannot be read. Please send another.');
    expect(result.staffText).toContain('cut-out photo (Too dark: the rating cannot be read).');
  });

  it('is red when one is rejected, with the reason', () => {
    const uploads: UploadSummary[] = [...accepted(BASE.slice(0, 1).concat(BASE.slice(2))), { kind: 'cutout_photo', status: 'rejected', reason: 'Too dark to read the fuse rating' }];
    const result = documents({}, uploads);
    expect(result.light).toBe('red');
    expect(result.customerText).toContain('Too dark to read the fuse rating');
    expect(result.staffText).toContain('cut-out photo (Too dark to read the fuse rating)');
    expect(result.actions[0]).toMatch(/Upload a new photo of the main fuse/);
  });

  it('lets a newer upload replace a rejected one', () => {
    const rejected: UploadSummary = { kind: 'cutout_photo', status: 'rejected', reason: 'Blurred' };
    const others = accepted(BASE.filter((kind) => kind !== 'cutout_photo'));
    expect(documents({}, [...others, rejected, { kind: 'cutout_photo', status: 'waiting' }]).light).toBe('amber');
    expect(documents({}, [...others, rejected, { kind: 'cutout_photo', status: 'accepted' }]).light).toBe('green');
  });

  it('needs the extra uploads the answers call for, and ignores "other"', () => {
    const tenant: ChecklistAnswers = { about: { tenure: 'tenant' } };
    expect(documents(tenant, [...accepted(BASE), { kind: 'other', status: 'accepted' }]).light).toBe('amber');
    expect(documents(tenant, accepted([...BASE, 'landlord_permission'])).light).toBe('green');
  });

  it('reminds the customer: photos only', () => {
    expect(documents({}, []).customerText).toMatch(/never open the meter, the cut-out or the consumer unit/);
  });
});
