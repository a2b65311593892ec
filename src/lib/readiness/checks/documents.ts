// Documents: each upload the answers call for is present and accepted by the office.
import { COMMON_PRACTICE } from '@/lib/readiness/settings';
import type { ChecklistAnswers, CheckInput, CheckResult, Light, UploadKind } from '@/lib/readiness/types';
import { uploadKindLabels, uploadKindStatus, type UploadKindStatus } from '@/lib/readiness/upload-status';
import { endSentence } from '@/lib/punctuation';
import { checkTitles } from '../check-titles';

/** A reason inside brackets, without the full stop the office may have typed: "(Too dark)". */
const bracketed = (reason: string | null) => (reason ? ` (${reason.replace(/[.\s]+$/, '')})` : '');

const SOURCE = `${COMMON_PRACTICE} (what the office needs before a survey)`;
const TITLE = checkTitles['documents'];
const ALWAYS: readonly UploadKind[] = ['meter_photo', 'cutout_photo', 'consumer_unit_photo', 'charger_location_photo'];

/**
 * The uploads the answers call for: four photos always; the order agreement for a new car;
 * parking evidence for a bay not attached to the home; the landlord's permission for a tenant.
 *
 * @example requiredUploadKinds({ about: { tenure: 'tenant' } })
 * // ['meter_photo', 'cutout_photo', 'consumer_unit_photo', 'charger_location_photo', 'landlord_permission']
 */
export function requiredUploadKinds(answers: ChecklistAnswers | null | undefined): UploadKind[] {
  const kinds = [...ALWAYS];
  if (answers?.vehicle?.condition === 'new') kinds.push('order_agreement');
  if (answers?.parking?.kind === 'detached-bay') kinds.push('parking_evidence');
  if (answers?.about?.tenure === 'tenant') kinds.push('landlord_permission');
  return kinds;
}

/**
 * All accepted is green; any waiting or missing is amber; any rejected is red with its reason.
 *
 * @example checkDocuments({ answers: {}, uploads: [], settings: defaultReadinessSettings, today: '2025-01-01' }).light // 'amber'
 */
export function checkDocuments({ answers, uploads }: CheckInput): CheckResult {
  const required = requiredUploadKinds(answers).map((kind) => uploadKindStatus(kind, uploads));
  const byState = (state: UploadKindStatus['state']) => required.filter((item) => item.state === state);
  const rejected = byState('rejected');
  const missing = byState('missing');
  const waiting = byState('waiting');
  const light: Light = rejected.length > 0 ? 'red' : missing.length + waiting.length > 0 ? 'amber' : 'green';
  return {
    id: 'documents',
    light,
    title: TITLE,
    customerText: customerText(rejected, missing, waiting),
    staffText: staffText(rejected, missing, waiting, required.length),
    figures: {
      required,
      rejectedKinds: rejected.map((item) => item.kind),
      missingKinds: missing.map((item) => item.kind),
      waitingKinds: waiting.map((item) => item.kind),
    },
    source: SOURCE,
    actions: [
      ...rejected.map((item) => `Upload a new ${uploadKindLabels[item.kind]}${bracketed(item.reason)}.`),
      ...missing.map((item) => `Upload the ${uploadKindLabels[item.kind]}.`),
      ...waiting.map((item) => `The office to review the ${uploadKindLabels[item.kind]}.`),
    ],
  };
}

function customerText(rejected: UploadKindStatus[], missing: UploadKindStatus[], waiting: UploadKindStatus[]): string {
  if (rejected.length + missing.length + waiting.length === 0) return 'Thank you — we have everything we need.';
  const parts: string[] = [];
  for (const item of rejected) {
    parts.push(`${endSentence(`We couldn't use the ${uploadKindLabels[item.kind]}${item.reason ? `: ${item.reason}` : ''}`)} Please send another.`);
  }
  if (missing.length > 0) parts.push(`Still to send: ${list(missing)}.`);
  if (waiting.length > 0) parts.push(`The office is checking the ${list(waiting)}.`);
  parts.push('Photos only, please: never open the meter, the cut-out or the consumer unit, or take covers off.');
  return parts.join(' ');
}

/** The office's short names for each kind of upload, in trade terms. */
const staffKindNames: Record<UploadKindStatus['kind'], string> = {
  meter_photo: 'meter photo',
  cutout_photo: 'cut-out photo',
  consumer_unit_photo: 'consumer unit photo',
  charger_location_photo: 'charge point location photo',
  parking_evidence: 'parking evidence',
  order_agreement: 'vehicle order agreement',
  landlord_permission: 'landlord permission',
  other: 'other document',
};

function staffText(rejected: UploadKindStatus[], missing: UploadKindStatus[], waiting: UploadKindStatus[], total: number): string {
  const accepted = total - rejected.length - missing.length - waiting.length;
  const name = (item: UploadKindStatus) => staffKindNames[item.kind];
  const rejectedText = rejected.map((item) => `${name(item)}${bracketed(item.reason)}`).join(', ');
  return [
    `${accepted}/${total} required uploads accepted.`,
    rejected.length ? `Rejected: ${rejectedText}.` : '',
    missing.length ? `Missing: ${missing.map(name).join(', ')}.` : '',
    waiting.length ? `Awaiting review: ${waiting.map(name).join(', ')}.` : '',
  ]
    .filter(Boolean)
    .join(' ');
}

function list(items: readonly UploadKindStatus[]): string {
  const labels = items.map((item) => uploadKindLabels[item.kind]);
  if (labels.length <= 1) return labels.join('');
  return `${labels.slice(0, -1).join(', ')} and ${labels[labels.length - 1]}`;
}
