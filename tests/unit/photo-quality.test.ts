// The photo check at upload, on photos drawn for the purpose in this file's fixtures: a sharp
// label full of fine characters, and its blurred, darkened, over-exposed and shrunk copies.
// The measures: variance of the Laplacian as a focus measure (Pech-Pacheco et al., "Diatom
// autofocusing in brightfield microscopy: a comparative study", ICPR 2000 — from memory); dHash
// (N. Krawetz, "Kind of Like That", 2013 — from memory). Every threshold is common practice — no
// published source; the defaults are in src/lib/readiness/settings.ts.
import { describe, expect, it } from 'vitest';
import sharp from 'sharp';
import {
  assessPhoto,
  differenceHash,
  exposure,
  hammingDistance,
  laplacianVariance,
  measurePhoto,
  type Measured,
} from '@/lib/server/photo-quality.server';
import { defaultReadinessSettings, resolveReadinessSettings } from '@/lib/readiness/settings';
import { rejectionWords } from '@/lib/photo-quality';
import { sharpPhoto, spoil } from '../fixtures/photo-quality';

const settings = defaultReadinessSettings;

async function measure(photo: Buffer): Promise<Measured> {
  const m = await sharp(photo).metadata();
  return measurePhoto(photo, m.width!, m.height!);
}
const codes = (m: Measured, kind: Parameters<typeof assessPhoto>[1] = 'cutout_photo', others: Parameters<typeof assessPhoto>[3] = []) =>
  assessPhoto(m, kind, settings, others).problems.map((p) => p.code);

describe('the arithmetic, worked by hand', () => {
  it('takes the variance of the 4-neighbour Laplacian over the interior pixels', () => {
    // 4 × 3, one white pixel at (1,1). 1st percentile 0, 99th 255: no stretch (gain 1).
    // L(1,1) = 0+0+0+0 − 4·255 = −1020; L(2,1) = 255+0+0+0 − 4·0 = 255.
    // mean = −382.5; variance = ((−637.5)² + 637.5²) / 2 = 406406.25.
    const img = { data: new Uint8Array([0, 0, 0, 0, 0, 255, 0, 0, 0, 0, 0, 0]), width: 4, height: 3 };
    expect(laplacianVariance(img)).toBeCloseTo(406406.25, 6);
  });

  it('stretches the contrast first, so the same picture at a fifth of the brightness measures the same', () => {
    // The same picture at 0 and 51 (= 255 / 5): 99th percentile 51, gain 255 / 51 = 5, so the
    // variance is 5² times that of the dim one, which is (637.5 / 5)² — back to 406406.25.
    const img = { data: new Uint8Array([0, 0, 0, 0, 0, 51, 0, 0, 0, 0, 0, 0]), width: 4, height: 3 };
    expect(laplacianVariance(img)).toBeCloseTo(406406.25, 6);
  });

  it('finds no detail in a blank photo', () => {
    const img = { data: new Uint8Array(100).fill(128), width: 10, height: 10 };
    expect(laplacianVariance(img)).toBe(0);
  });

  it('counts mean luminance and the shares clipped to black (≤ 5) and white (≥ 250)', () => {
    // Four pixels 0, 5, 250, 255 and six at 100: mean = (0+5+250+255+600)/10 = 111; 20 % and 20 %.
    const img = { data: new Uint8Array([0, 5, 250, 255, 100, 100, 100, 100, 100, 100]), width: 10, height: 1 };
    expect(exposure(img)).toEqual({ meanLuminance: 111, shadowClipPercent: 20, highlightClipPercent: 20 });
  });

  it('reads dHash bits row by row, 1 where a pixel is darker than its right neighbour', () => {
    const rising = { data: new Uint8Array(72).map((_, i) => (i % 9) * 10), width: 9, height: 8 };
    const falling = { data: new Uint8Array(72).map((_, i) => 90 - (i % 9) * 10), width: 9, height: 8 };
    // Only the first row rising: bits 0–7 set, the first byte ff.
    const firstRow = { data: new Uint8Array(72).map((_, i) => (i < 9 ? i * 10 : 50)), width: 9, height: 8 };
    expect(differenceHash(rising)).toBe('ffffffffffffffff');
    expect(differenceHash(falling)).toBe('0000000000000000');
    expect(differenceHash(firstRow)).toBe('ff00000000000000');
    expect(hammingDistance('ffffffffffffffff', '0000000000000000')).toBe(64);
    expect(hammingDistance('ff00000000000000', '0f00000000000000')).toBe(4);
  });
});

describe('photos made for the purpose', () => {
  it('finds nothing wrong with the sharp, well-lit, full-size photo, in any slot', async () => {
    const m = await measure(await sharpPhoto());
    for (const kind of ['meter_photo', 'cutout_photo', 'consumer_unit_photo', 'charger_location_photo', 'landlord_permission'] as const) {
      expect(assessPhoto(m, kind, settings, [])).toMatchObject({ ok: true, problems: [] });
    }
    expect(m.measures.sharpness).toBeGreaterThan(settings.photoSharpnessMin * 10);
  });

  it('flags the Gaussian-blurred copy as blurred, and only that', async () => {
    const m = await measure(await spoil.blurred(await sharpPhoto()));
    expect(codes(m)).toEqual(['blurry']);
    const [problem] = assessPhoto(m, 'cutout_photo', settings, []).problems;
    expect(problem).toMatchObject({ code: 'blurry', threshold: 100 });
    expect(problem!.measured).toBeLessThan(100);
    expect(problem!.message).toMatch(/blurred/);
  });

  it('flags the darkened copy as too dark, and not as blurred', async () => {
    const m = await measure(await spoil.darkened(await sharpPhoto()));
    expect(codes(m)).toEqual(['too_dark']);
    expect(assessPhoto(m, 'meter_photo', settings, []).problems[0]).toMatchObject({ code: 'too_dark', threshold: 45 });
  });

  it('flags the over-exposed copy as too bright, except in a slot for a paper letter', async () => {
    const m = await measure(await spoil.overExposed(await sharpPhoto()));
    expect(codes(m)).toEqual(['too_bright']);
    expect(codes(m, 'landlord_permission')).toEqual([]);
  });

  it('flags the down-scaled copy as too small where digits must be read, not for a view of a wall', async () => {
    const m = await measure(await spoil.downScaled(await sharpPhoto()));
    expect(codes(m, 'cutout_photo')).toEqual(['too_small']);
    expect(assessPhoto(m, 'cutout_photo', settings, []).problems[0]).toMatchObject({ measured: 960, threshold: 1200 });
    expect(codes(m, 'charger_location_photo')).toEqual([]);
  });

  it('follows the settings: a stricter sharpness bar flags even the sharp photo', async () => {
    const m = await measure(await sharpPhoto());
    const strict = resolveReadinessSettings({ photoSharpnessMin: m.measures.sharpness + 1 });
    expect(assessPhoto(m, 'meter_photo', strict, []).problems.map((p) => p.code)).toEqual(['blurry']);
  });
});

describe('the same photo in two slots', () => {
  it('flags a photo already sent for another slot, even blurred, and not a retake in the same slot', async () => {
    const original = await measure(await sharpPhoto(1));
    const again = await measure(await spoil.blurred(await sharpPhoto(1)));
    expect(hammingDistance(original.hash, again.hash)).toBeLessThanOrEqual(settings.photoDuplicateMaxBits);
    const others = [{ kind: 'meter_photo' as const, hash: original.hash }];
    const found = assessPhoto(again, 'cutout_photo', settings, others).problems;
    expect(found.map((p) => p.code)).toEqual(['blurry', 'duplicate']);
    expect(found[1]!.message).toBe('This looks like the same photo as your photo of your electricity meter.');
    expect(codes(again, 'meter_photo', others)).toEqual(['blurry']);
  });

  it('does not take a different photo for the same one', async () => {
    const one = await measure(await sharpPhoto(1));
    const other = await measure(await sharpPhoto(2));
    expect(hammingDistance(one.hash, other.hash)).toBeGreaterThan(settings.photoDuplicateMaxBits);
    expect(codes(other, 'cutout_photo', [{ kind: 'meter_photo', hash: one.hash }])).toEqual([]);
  });
});

describe('words for a rejection', () => {
  it('puts what the check found before what a good photo shows', () => {
    expect(rejectionWords('cutout_photo', [{ message: 'This photo looks blurred, so the small print on it may not be readable.' }])).toMatch(
      /^This photo looks blurred.*The fuse rating \(60, 80 or 100 A\) is usually printed on the fuse carrier/,
    );
  });
});
