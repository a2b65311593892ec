// Client-safe: what the photo check at upload can find, in the customer's words and the office's,
// and what each slot needs. The measuring is in src/lib/server/photo-quality.server.ts; the
// thresholds are readiness settings (src/lib/readiness/settings.ts), changed on the settings page.
import type { UploadKind } from './readiness/types';
import { uploadKindLabels } from './readiness/upload-status';

export const photoProblemCodes = ['blurry', 'too_dark', 'too_bright', 'too_small', 'duplicate'] as const;
export type PhotoProblemCode = (typeof photoProblemCodes)[number];

/** One thing the check found: what, in the customer's words, the figure and the line it crossed. */
export interface PhotoProblem {
  code: PhotoProblemCode;
  /** Plain words for the customer, shown at once in the slot and reusable in a rejection e-mail. */
  message: string;
  /** The figure measured on this photo (see `measure` for its unit). */
  measured: number;
  /** The setting it was compared with. */
  threshold: number;
  /** What `measured` is, for the office, e.g. "variance of the Laplacian". */
  measure: string;
}

/** Everything measured on one photo, kept on its upload row so the office can filter and look back. */
export interface PhotoMeasures {
  /** Variance of the 4-neighbour Laplacian on the contrast-stretched 1024 px greyscale copy. */
  sharpness: number;
  /** Mean luminance of the greyscale copy, 0–255. */
  meanLuminance: number;
  /** Share of pixels at or below 5 (of 255), in per cent. */
  shadowClipPercent: number;
  /** Share of pixels at or above 250 (of 255), in per cent. */
  highlightClipPercent: number;
  longEdge: number;
  shortEdge: number;
}

/** The answer of the check, as the upload response and the list carry it. */
export interface PhotoQuality {
  ok: boolean;
  problems: PhotoProblem[];
  measures: PhotoMeasures;
}

/** What a slot's photo must show, which decides the size it needs and whether white is allowed. */
export type SlotNeed = 'digits' | 'scene' | 'paper';

/**
 * Meter registers, fuse ratings and switch labels must be read ("digits"); a wall and a drive
 * only seen ("scene"); a letter or plan is white paper, so bright white is expected ("paper").
 */
export const slotNeeds: Readonly<Record<UploadKind, SlotNeed>> = Object.freeze({
  meter_photo: 'digits',
  cutout_photo: 'digits',
  consumer_unit_photo: 'digits',
  charger_location_photo: 'scene',
  parking_evidence: 'paper',
  order_agreement: 'paper',
  landlord_permission: 'paper',
  other: 'scene',
});

/** Short staff words for each problem (the case page's photo review and the queue). */
export const photoProblemStaffWords: Readonly<Record<PhotoProblemCode, string>> = Object.freeze({
  blurry: 'Blurred',
  too_dark: 'Too dark',
  too_bright: 'Over-exposed',
  too_small: 'Too few pixels',
  duplicate: 'Same as another slot',
});

/** The customer's words for each problem. `other` names the slot a duplicate repeats. */
export function photoProblemMessage(code: PhotoProblemCode, detail: { other?: UploadKind; longEdge?: number; shortEdge?: number } = {}): string {
  switch (code) {
    case 'blurry':
      return 'This photo looks blurred, so the small print on it may not be readable.';
    case 'too_dark':
      return 'This photo is too dark to read.';
    case 'too_bright':
      return 'This photo is too bright: parts of it have turned white.';
    case 'too_small':
      return `This photo is small (${detail.longEdge ?? '?'} × ${detail.shortEdge ?? '?'} pixels), so the numbers on it may be too small to read.`;
    case 'duplicate':
      return `This looks like the same photo as your ${detail.other ? uploadKindLabels[detail.other] : 'other photo'}.`;
  }
}

/** What a good photo for each slot looks like, in one or two plain sentences. */
export const goodPhotoAdvice: Readonly<Record<UploadKind, string>> = Object.freeze({
  meter_photo: 'Get the whole meter in, with the display and the serial number sharp. Stand about 50 cm away, hold the phone steady and use the torch if the cupboard is dark.',
  cutout_photo:
    'The fuse rating (60, 80 or 100 A) is usually printed on the fuse carrier, the sealed part next to the meter. Hold the phone steady, about 30 cm away, and use the torch. Never open it.',
  consumer_unit_photo: 'Get the whole unit in with its cover closed, so the labels by the switches can be read. Step back until it all fits, hold steady, and add light if it is dark.',
  charger_location_photo: 'Stand back far enough to show the wall where it would go and where the car parks. Daylight is best.',
  parking_evidence: 'Lay the page flat in good light, fill the screen with it and hold the phone straight above it.',
  order_agreement: 'Lay the page flat in good light, fill the screen with it and hold the phone straight above it.',
  landlord_permission: 'Lay the page flat in good light, fill the screen with it and hold the phone straight above it.',
  other: 'Hold the phone steady, in good light, and fill the screen with what you want us to see.',
});

/**
 * The words a rejection can reuse: what the check found, then what a good one shows.
 * @example rejectionWords('cutout_photo', [{ code: 'blurry', message: 'This photo looks blurred…', … }])
 */
export function rejectionWords(kind: UploadKind, problems: readonly Pick<PhotoProblem, 'message'>[]): string {
  return [...problems.map((p) => p.message), goodPhotoAdvice[kind]].join(' ');
}
