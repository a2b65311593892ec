// Evidence uploads: the kinds, what each should show, and the limits the server enforces.
// Pure and client-safe: the upload island mirrors these restrictions, the server applies them.
import { z } from 'zod';
import type { UploadKind, UploadStatus } from '@/lib/readiness/types';
import type { PhotoQuality } from '@/lib/photo-quality';

export type { UploadKind, UploadStatus } from '@/lib/readiness/types';
// One rule for "which uploads do these answers call for", shared with the readiness check.
export { requiredUploadKinds } from '@/lib/readiness/checks/documents';

/** Every upload kind, in the order the customer meets them in the checklist. */
export const uploadKinds = [
  'meter_photo',
  'cutout_photo',
  'consumer_unit_photo',
  'charger_location_photo',
  'parking_evidence',
  'order_agreement',
  'landlord_permission',
  'other',
] as const satisfies readonly UploadKind[];

export const uploadStatuses = ['waiting', 'accepted', 'rejected'] as const satisfies readonly UploadStatus[];

export const uploadKindSchema = z.enum(uploadKinds, {
  errorMap: () => ({ message: 'Choose what this file shows (for example the meter or the cut-out).' }),
});

const MB = 1024 * 1024;

/** The server's limits; the island applies the same ones before sending. */
export const uploadLimits = Object.freeze({
  imageMaxBytes: 15 * MB,
  pdfMaxBytes: 10 * MB,
  /** 40 megapixels: more than any phone camera takes, far less than a decompression bomb. */
  imageMaxPixels: 40_000_000,
  thumbWidth: 480,
  /** Longest original file name kept as metadata, in characters. */
  nameMaxLength: 120,
  /** Per case: a full checklist needs about ten files; this leaves room for retakes, not a dump. */
  caseMaxFiles: 60,
  caseMaxBytes: 300 * MB,
});

/** Types we keep, decided from the file's content on the server; value is the stored extension. */
export const imageTypes = Object.freeze({ 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp' } as const);
export const documentTypes = Object.freeze({ 'application/pdf': 'pdf' } as const);
export type ImageType = keyof typeof imageTypes;
export type DocumentType = keyof typeof documentTypes;
export type StoredType = ImageType | DocumentType;

/** Photos only, or a photo or a PDF (for letters and agreements people often have as PDFs). */
export type UploadAccepts = 'photo' | 'photo-or-pdf';

export interface UploadKindInfo {
  /** The slot's heading, for the customer. */
  title: string;
  /** One line: what a good photo or document shows. */
  hint: string;
  accepts: UploadAccepts;
}

const NO_COVERS = 'photo only, never remove covers';

/** Customer-facing title and one-line hint for each kind of upload. */
export const uploadKindInfo: Readonly<Record<UploadKind, UploadKindInfo>> = Object.freeze({
  meter_photo: {
    title: 'Electricity meter',
    hint: 'The whole meter with its display and serial number readable — photo only, never open the meter.',
    accepts: 'photo',
  },
  cutout_photo: {
    title: 'Main fuse (cut-out)',
    hint: `The fuse carrier with its rating (60, 80 or 100 A) readable — ${NO_COVERS}.`,
    accepts: 'photo',
  },
  consumer_unit_photo: {
    title: 'Consumer unit',
    hint: `The whole unit, cover closed, with the switch labels readable — ${NO_COVERS}.`,
    accepts: 'photo',
  },
  charger_location_photo: {
    title: 'Where you would like the charge point',
    hint: 'The wall where it would go, standing back far enough to show where the car parks.',
    accepts: 'photo',
  },
  parking_evidence: {
    title: 'Proof of your parking space',
    hint: 'A title plan, lease plan or letter that shows the bay is yours to use — a photo or a PDF.',
    accepts: 'photo-or-pdf',
  },
  order_agreement: {
    title: 'Car order agreement',
    hint: 'The page with the car, your name and the expected delivery date — a photo or a PDF.',
    accepts: 'photo-or-pdf',
  },
  landlord_permission: {
    title: 'Landlord’s permission',
    hint: 'A letter or e-mail from your landlord agreeing to a charge point — a photo or a PDF.',
    accepts: 'photo-or-pdf',
  },
  other: {
    title: 'Anything else',
    hint: 'Anything else you would like your installer to see — a photo or a PDF.',
    accepts: 'photo-or-pdf',
  },
});

/**
 * The content types a kind of upload takes.
 * @example typesFor('cutout_photo') // ['image/jpeg', 'image/png', 'image/webp']
 */
export function typesFor(kind: UploadKind): StoredType[] {
  const images = Object.keys(imageTypes) as ImageType[];
  return uploadKindInfo[kind].accepts === 'photo' ? images : [...images, 'application/pdf'];
}

/**
 * The byte limit for a content type (images 15 MB, PDFs 10 MB).
 * @example maxBytesFor('application/pdf') // 10485760
 */
export function maxBytesFor(type: StoredType): number {
  return type === 'application/pdf' ? uploadLimits.pdfMaxBytes : uploadLimits.imageMaxBytes;
}

/** The most any upload may be: a multipart body larger than this plus its envelope is refused unread. */
export const largestUploadBytes = Math.max(uploadLimits.imageMaxBytes, uploadLimits.pdfMaxBytes);

/**
 * "15 MB", "840 KB": sizes as a customer reads them (binary units, as phones and PCs count).
 * @example formatBytes(15 * 1024 * 1024) // '15 MB'
 */
export function formatBytes(bytes: number): string {
  if (bytes >= MB) return `${Number((bytes / MB).toFixed(1))} MB`;
  if (bytes >= 1024) return `${Math.round(bytes / 1024)} KB`;
  return `${bytes} bytes`;
}

// C0 and C1 controls, and the Unicode format characters (bidi overrides can disguise ".exe").
const UNSAFE_CHARS = /[\p{Cc}\p{Cf}]/gu;

/**
 * A sender's file name made safe to keep as metadata: path parts, control and bidi characters
 * removed, whitespace collapsed, length limited (the extension kept). Null when nothing is left.
 *
 * @example sanitiseFileName('../../etc/passwd.jpg') // 'passwd.jpg'
 * @example sanitiseFileName('C:\\Users\\me\\IMG_0001.JPG') // 'IMG_0001.JPG'
 */
export function sanitiseFileName(name: string | null | undefined, maxLength: number = uploadLimits.nameMaxLength): string | null {
  if (!name) return null;
  const base = name.normalize('NFC').split(/[/\\]/).pop() ?? '';
  const cleaned = base.replace(UNSAFE_CHARS, '').replace(/\s+/g, ' ').trim().replace(/^\.+/, '');
  if (cleaned === '') return null;
  const chars = [...cleaned];
  if (chars.length <= maxLength) return cleaned;
  const dot = cleaned.lastIndexOf('.');
  const ext = dot > 0 && cleaned.length - dot <= 10 ? [...cleaned.slice(dot)] : [];
  return [...chars.slice(0, maxLength - ext.length), ...ext].join('').trim();
}

/** One upload as the API hands it out (POST answer and list items). */
export interface UploadItem {
  id: string;
  kind: UploadKind;
  status: UploadStatus;
  /** The office's reason when it did not accept the file. */
  reason: string | null;
  mimeType: string;
  sizeBytes: number;
  width: number | null;
  height: number | null;
  originalName: string | null;
  createdAt: string;
  reviewedAt: string | null;
  url: string;
  /** A small WebP preview for images; null for documents. */
  thumbUrl: string | null;
  /** The photo check at upload (advice: the office decides); null for documents. */
  quality: PhotoQuality | null;
}

/** The customer-facing word for a review status (always shown beside its icon). */
export const uploadStatusWords: Readonly<Record<UploadStatus, string>> = Object.freeze({
  waiting: 'Waiting for review',
  accepted: 'Accepted',
  rejected: 'Not accepted',
});
