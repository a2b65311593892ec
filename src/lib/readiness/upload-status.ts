// One answer per upload kind, however many files the customer sent of that kind.
import type { UploadKind, UploadSummary } from './types';

export type UploadState = 'accepted' | 'waiting' | 'rejected' | 'missing';

export interface UploadKindStatus {
  kind: UploadKind;
  state: UploadState;
  /** The office's reason, when the state is rejected. */
  reason: string | null;
}

/**
 * The standing of one kind of upload: any accepted file settles it; a newer file waiting for
 * review outranks an old rejection; otherwise a rejection stands with its reason.
 *
 * @example uploadKindStatus('meter_photo', [{ kind: 'meter_photo', status: 'rejected', reason: 'Blurred' }])
 * // { kind: 'meter_photo', state: 'rejected', reason: 'Blurred' }
 */
export function uploadKindStatus(kind: UploadKind, uploads: readonly UploadSummary[]): UploadKindStatus {
  const ofKind = uploads.filter((upload) => upload.kind === kind);
  if (ofKind.some((upload) => upload.status === 'accepted')) return { kind, state: 'accepted', reason: null };
  if (ofKind.some((upload) => upload.status === 'waiting')) return { kind, state: 'waiting', reason: null };
  const rejected = ofKind.find((upload) => upload.status === 'rejected');
  if (rejected) return { kind, state: 'rejected', reason: rejected.reason?.trim() || null };
  return { kind, state: 'missing', reason: null };
}

/** Customer-facing names of the upload kinds, each a countable noun phrase ("upload a …", "send a new …"). */
export const uploadKindLabels: Readonly<Record<UploadKind, string>> = Object.freeze({
  meter_photo: 'photo of your electricity meter',
  cutout_photo: 'photo of the main fuse (cut-out)',
  consumer_unit_photo: 'photo of your consumer unit',
  charger_location_photo: 'photo of where you would like the charge point',
  parking_evidence: 'document showing the parking space is yours to use',
  order_agreement: 'order agreement for the car',
  landlord_permission: 'letter or e-mail giving your landlord’s permission',
  other: 'further document',
});
