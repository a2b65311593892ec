// Server-only (sharp): the photo check every upload goes through, in the same request. One
// decode to a small greyscale copy (JPEG shrink-on-load makes it cheap), then pure arithmetic
// over its raw bytes; the verdict compares the figures with the readiness settings.
//
// Every method here is common practice — no published source for its thresholds:
// - sharpness: variance of the 4-neighbour Laplacian (the focus measure of Pech-Pacheco et al.,
//   ICPR 2000, from memory), after stretching the 1st–99th brightness percentile to 0–255 so a
//   dark photo is flagged as dark, not also as blurred;
// - exposure: mean luminance and the shares of pixels clipped to black (≤ 5) and white (≥ 250);
// - size: long and short edge of the photo as kept, against what the slot needs to read digits;
// - duplicates: a 64-bit difference hash (dHash, as N. Krawetz described it, 2013, from memory)
//   compared by Hamming distance with the case's photos in other slots.
import sharp from 'sharp';
import type { ReadinessSettings } from '@/lib/readiness/settings';
import type { UploadKind } from '@/lib/readiness/types';
import { photoProblemMessage, slotNeeds, type PhotoMeasures, type PhotoProblem, type PhotoQuality } from '@/lib/photo-quality';
import { uploadLimits } from '@/lib/schemas/uploads';

/** The long edge of the working copy the figures are measured on. */
export const WORKING_EDGE = 1024;
/** Pixel values counted as clipped: at or below / at or above (of 255). */
export const SHADOW_CLIP = 5;
export const HIGHLIGHT_CLIP = 250;

/** A greyscale image as raw bytes, one per pixel, row by row. */
export type Grey = { data: Uint8Array; width: number; height: number };

/**
 * Histogram of a greyscale image: count of pixels at each value 0–255.
 * @example histogram({ data: new Uint8Array([0, 0, 255]), width: 3, height: 1 })[0] // 2
 */
export function histogram(img: Grey): Uint32Array {
  const h = new Uint32Array(256);
  for (let i = 0; i < img.data.length; i++) h[img.data[i]!]!++;
  return h;
}

/** The value below which `fraction` of the pixels lie. */
function percentile(h: Uint32Array, total: number, fraction: number): number {
  const target = total * fraction;
  let seen = 0;
  for (let v = 0; v < 256; v++) {
    seen += h[v]!;
    if (seen > target) return v;
  }
  return 255;
}

/**
 * Variance of the Laplacian L(x,y) = I(x−1,y) + I(x+1,y) + I(x,y−1) + I(x,y+1) − 4·I(x,y) over
 * the interior pixels, after a linear stretch of the 1st–99th percentile to 0–255 (a range under
 * 16 levels is taken as 16, so a blank photo reads as having no detail, not as noise).
 *
 * @example laplacianVariance(grey) // ≈ 2500 for sharp printed text, < 30 when it is blurred
 */
export function laplacianVariance(img: Grey, h: Uint32Array = histogram(img)): number {
  const { data, width: w, height: hgt } = img;
  if (w < 3 || hgt < 3) return 0;
  const total = w * hgt;
  const lo = percentile(h, total, 0.01);
  const hi = percentile(h, total, 0.99);
  const gain = 255 / Math.max(16, hi - lo);
  let sum = 0;
  let sumSq = 0;
  for (let y = 1; y < hgt - 1; y++) {
    const row = y * w;
    for (let x = 1; x < w - 1; x++) {
      const i = row + x;
      const l = data[i - 1]! + data[i + 1]! + data[i - w]! + data[i + w]! - 4 * data[i]!;
      sum += l;
      sumSq += l * l;
    }
  }
  const n = (w - 2) * (hgt - 2);
  const mean = sum / n;
  return (sumSq / n - mean * mean) * gain * gain;
}

/**
 * Mean luminance and clipped shares (per cent) of a greyscale image.
 * @example exposure(grey) // { meanLuminance: 131.2, shadowClipPercent: 0.4, highlightClipPercent: 0 }
 */
export function exposure(img: Grey, h: Uint32Array = histogram(img)): Pick<PhotoMeasures, 'meanLuminance' | 'shadowClipPercent' | 'highlightClipPercent'> {
  const total = img.width * img.height;
  let sum = 0;
  let dark = 0;
  let bright = 0;
  for (let v = 0; v < 256; v++) {
    sum += v * h[v]!;
    if (v <= SHADOW_CLIP) dark += h[v]!;
    if (v >= HIGHLIGHT_CLIP) bright += h[v]!;
  }
  return { meanLuminance: sum / total, shadowClipPercent: (100 * dark) / total, highlightClipPercent: (100 * bright) / total };
}

/**
 * dHash of a 9 × 8 greyscale thumbnail: bit (r·8 + c) is 1 when I(r,c) < I(r,c+1), for rows
 * r = 0…7 and columns c = 0…7, read as 16 hex digits.
 * @example differenceHash({ data: thumb9x8, width: 9, height: 8 }) // 'f0e4c8d09a3c6e1f'
 */
export function differenceHash(thumb: Grey): string {
  if (thumb.width !== 9 || thumb.height !== 8) throw new Error('dHash needs a 9 × 8 thumbnail');
  let hex = '';
  for (let r = 0; r < 8; r++) {
    let byte = 0;
    for (let c = 0; c < 8; c++) byte = (byte << 1) | (thumb.data[r * 9 + c]! < thumb.data[r * 9 + c + 1]! ? 1 : 0);
    hex += byte.toString(16).padStart(2, '0');
  }
  return hex;
}

/**
 * Number of differing bits between two 64-bit hashes written as 16 hex digits.
 * @example hammingDistance('ff00000000000000', '0f00000000000000') // 4
 */
export function hammingDistance(a: string, b: string): number {
  let x = BigInt(`0x${a}`) ^ BigInt(`0x${b}`);
  let bits = 0;
  while (x) {
    bits += Number(x & 1n);
    x >>= 1n;
  }
  return bits;
}

export type Measured = { measures: PhotoMeasures; hash: string };

/**
 * Decodes a photo once into a greyscale copy at most 1024 px long and measures it; `width` and
 * `height` are the photo as kept (after rotation). Shrink-on-load keeps this to a fraction of a
 * full decode for a JPEG.
 *
 * @example const { measures, hash } = await measurePhoto('/tmp/in.jpg', 2560, 1920)
 */
export async function measurePhoto(input: string | Buffer, width: number, height: number): Promise<Measured> {
  const { data, info } = await sharp(input, { limitInputPixels: uploadLimits.imageMaxPixels })
    .rotate()
    .flatten({ background: '#ffffff' })
    .greyscale()
    .resize({ width: WORKING_EDGE, height: WORKING_EDGE, fit: 'inside', withoutEnlargement: true })
    .extractChannel(0)
    .raw()
    .toBuffer({ resolveWithObject: true });
  const grey: Grey = { data, width: info.width, height: info.height };
  const thumb = await sharp(data, { raw: { width: info.width, height: info.height, channels: 1 } })
    .resize(9, 8, { fit: 'fill' })
    .extractChannel(0)
    .raw()
    .toBuffer();
  const h = histogram(grey);
  return {
    measures: {
      sharpness: laplacianVariance(grey, h),
      ...exposure(grey, h),
      longEdge: Math.max(width, height),
      shortEdge: Math.min(width, height),
    },
    hash: differenceHash({ data: thumb, width: 9, height: 8 }),
  };
}

/** A photo already in the case, for the duplicate check. */
export type OtherPhoto = { kind: UploadKind; hash: string };

const round = (n: number, places = 1) => Math.round(n * 10 ** places) / 10 ** places;

/**
 * The verdict on one photo for one slot: every problem its figures show against the settings.
 * Pure, so the tests can try each threshold.
 *
 * @example assessPhoto(measured, 'cutout_photo', settings, []) // { ok: true, problems: [], measures }
 */
export function assessPhoto(measured: Measured, kind: UploadKind, s: ReadinessSettings, others: readonly OtherPhoto[]): PhotoQuality {
  const m = measured.measures;
  const need = slotNeeds[kind];
  const problems: PhotoProblem[] = [];
  const add = (code: PhotoProblem['code'], value: number, threshold: number, measure: string, message = photoProblemMessage(code)) =>
    problems.push({ code, message, measured: round(value), threshold, measure });

  if (m.sharpness < s.photoSharpnessMin) add('blurry', m.sharpness, s.photoSharpnessMin, 'variance of the Laplacian (contrast-stretched, 1024 px copy)');

  if (m.meanLuminance < s.photoDarkMeanMax) add('too_dark', m.meanLuminance, s.photoDarkMeanMax, 'mean luminance, of 255');
  else if (m.shadowClipPercent > s.photoShadowClipPercentMax) add('too_dark', m.shadowClipPercent, s.photoShadowClipPercentMax, '% of pixels at 5 or less');

  // White paper is meant to be white: letters and plans are not flagged for brightness.
  if (need !== 'paper') {
    if (m.meanLuminance > s.photoBrightMeanMin) add('too_bright', m.meanLuminance, s.photoBrightMeanMin, 'mean luminance, of 255');
    else if (m.highlightClipPercent > s.photoHighlightClipPercentMax) add('too_bright', m.highlightClipPercent, s.photoHighlightClipPercentMax, '% of pixels at 250 or more');
  }

  const [minLong, minShort] =
    need === 'scene' ? [s.photoSceneMinLongEdgePx, s.photoSceneMinShortEdgePx] : [s.photoDigitsMinLongEdgePx, s.photoDigitsMinShortEdgePx];
  const sizeMessage = photoProblemMessage('too_small', { longEdge: m.longEdge, shortEdge: m.shortEdge });
  if (m.longEdge < minLong) add('too_small', m.longEdge, minLong, 'long edge, px', sizeMessage);
  else if (m.shortEdge < minShort) add('too_small', m.shortEdge, minShort, 'short edge, px', sizeMessage);

  let closest: { kind: UploadKind; bits: number } | null = null;
  for (const other of others) {
    if (other.kind === kind) continue; // a retake in the same slot is expected to look alike
    const bits = hammingDistance(measured.hash, other.hash);
    if (!closest || bits < closest.bits) closest = { kind: other.kind, bits };
  }
  if (closest && closest.bits <= s.photoDuplicateMaxBits) {
    add('duplicate', closest.bits, s.photoDuplicateMaxBits, 'differing bits of the 64-bit dHash', photoProblemMessage('duplicate', { other: closest.kind }));
  }

  return {
    ok: problems.length === 0,
    problems,
    measures: { ...m, sharpness: round(m.sharpness), meanLuminance: round(m.meanLuminance), shadowClipPercent: round(m.shadowClipPercent, 2), highlightClipPercent: round(m.highlightClipPercent, 2) },
  };
}
