// `npm run bench:photo-quality`: what the photo check at upload costs and how often it is wrong.
//
// 1. Milliseconds the check adds to one upload (src/lib/server/photo-quality.server.ts: one
//    shrink-on-load decode to a 1024 px greyscale copy, the Laplacian, the histogram, the dHash,
//    the verdict), beside the re-encode every photo already goes through, for a 12 MP phone photo
//    (4032 × 3024) and for what the browser sends of it (2560 × 1920). Medians of ROUNDS runs.
// 2. Its false-positive rate on the project's demo photos (seeds/demo.ts: invented drawings that
//    can be read), and what it says of the two drawn hard to read on purpose.
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import sharp from 'sharp';
import { reencodePhoto } from '@/lib/server/images.server';
import { assessPhoto, measurePhoto, type OtherPhoto } from '@/lib/server/photo-quality.server';
import { defaultReadinessSettings } from '@/lib/readiness/settings';
import { demoPhotos } from '../seeds/demo';

const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 9);
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

async function time(run: () => Promise<unknown>): Promise<number> {
  const t = performance.now();
  await run();
  return performance.now() - t;
}

const dir = await mkdtemp(join(tmpdir(), 'groundwork-photo-check-'));
try {
  console.log(`sharp ${sharp.versions.sharp}, libvips ${sharp.versions.vips}, ${sharp.concurrency()} threads, ${ROUNDS} rounds, medians\n`);
  console.log('| photo | re-encode + preview ms | photo check ms | check / re-encode |');
  console.log('| --- | --- | --- | --- |');
  for (const [width, height, label] of [
    [4032, 3024, '12 MP phone photo, 4032 × 3024'],
    [2560, 1920, 'as the browser sends it, 2560 × 1920'],
  ] as const) {
    // Blurred gaussian noise: the fine texture of a real photo, about the size phones write (as bench-photo.ts).
    const photo = await sharp({ create: { width, height, channels: 3, background: '#808080', noise: { type: 'gaussian', mean: 128, sigma: 60 } } })
      .blur(1.2)
      .jpeg({ quality: 92 })
      .toBuffer();
    const input = join(dir, `${width}.jpg`);
    await writeFile(input, photo);
    const reencode = () => reencodePhoto(input, 'image/jpeg', join(dir, 'main.jpg'), join(dir, 'thumb.webp'));
    const check = async () => assessPhoto(await measurePhoto(input, width, height), 'cutout_photo', defaultReadinessSettings, []);
    await reencode();
    await check(); // warm up libvips and the file cache
    const a: number[] = [];
    const b: number[] = [];
    for (let i = 0; i < ROUNDS; i++) {
      a.push(await time(reencode));
      b.push(await time(check));
    }
    console.log(`| ${label}, ${(photo.length / 1024 / 1024).toFixed(1)} MB | ${median(a).toFixed(0)} | ${median(b).toFixed(0)} | ${(median(b) / median(a)).toFixed(2)} |`);
  }

  console.log('\nDemo photos (seeds/demo.ts), checked as at upload, in each case\'s order (so duplicates count):\n');
  console.log('| case | slot | file | office | drawn | flagged |');
  console.log('| --- | --- | --- | --- | --- | --- |');
  const seen = new Map<string, OtherPhoto[]>();
  let good = 0;
  let falsePositives = 0;
  let bad = 0;
  let caught = 0;
  for (const p of demoPhotos()) {
    const { data, info } = await sharp(Buffer.from(p.svg)).jpeg({ quality: 85 }).toBuffer({ resolveWithObject: true });
    const measured = await measurePhoto(data, info.width, info.height);
    const others = seen.get(p.case) ?? [];
    const q = assessPhoto(measured, p.kind, defaultReadinessSettings, others);
    seen.set(p.case, [...others, { kind: p.kind, hash: measured.hash }]);
    const flagged = q.problems.map((x) => `${x.code} (${x.measured} vs ${x.threshold})`).join(', ') || '—';
    console.log(`| ${p.case} | ${p.kind} | ${p.name} | ${p.status} | ${p.poor ? 'hard to read' : 'readable'} | ${flagged} |`);
    if (!p.poor) {
      good++;
      if (!q.ok) falsePositives++;
    } else {
      bad++;
      if (!q.ok) caught++;
    }
  }
  console.log(`\nfalse positives: ${falsePositives} of ${good} readable demo photos flagged (${((100 * falsePositives) / good).toFixed(0)} %)`);
  console.log(`caught: ${caught} of ${bad} demo photos drawn hard to read`);
} finally {
  await rm(dir, { recursive: true, force: true });
}
