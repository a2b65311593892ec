// `npm run bench:photo`: how long the server's photo processing takes for one 12-megapixel phone
// photo, beside sharp's own re-encode of the same file in the same run. Target: ≤ 1.3×.
//
// The photo is made here (no binaries in the repository): 4032 × 3024 (a 12 MP phone camera's
// 4:3 frame), blurred gaussian noise so it has the fine texture of a real photo, JPEG quality 92
// — about the 3–7 MB phones write. Each pipeline runs ROUNDS times, alternating; medians shown.
import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { mkdtemp, rm, stat, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pipeline } from 'node:stream/promises';
import sharp from 'sharp';
import { reencodePhoto } from '@/lib/server/images.server';

const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 7);
const dir = await mkdtemp(join(tmpdir(), 'groundwork-photo-'));
try {
  const input = join(dir, 'phone.jpg');
  const photo = await sharp({ create: { width: 4032, height: 3024, channels: 3, background: '#808080', noise: { type: 'gaussian', mean: 128, sigma: 60 } } })
    .blur(1.2)
    .jpeg({ quality: 92 })
    .toBuffer();
  await writeFile(input, photo);
  console.log(`photo: 4032 × 3024, ${(photo.length / 1024 / 1024).toFixed(1)} MB JPEG; sharp ${sharp.versions.sharp}, libvips ${sharp.versions.vips}, ${sharp.concurrency()} threads`);

  const runs = {
    // sharp alone: decode, re-encode at the same quality, write.
    'sharp re-encode alone': () => sharp(input).jpeg({ quality: 85 }).toFile(join(dir, 'plain.jpg')),
    // What the server does to every photo it keeps (src/lib/server/images.server.ts).
    'server processing (re-encode, rotate, preview, checksum)': () => reencodePhoto(input, 'image/jpeg', join(dir, 'main.jpg'), join(dir, 'thumb.webp')),
    // The pipeline before: the preview decoded the re-encoded file again, the checksum re-read it.
    'previous server processing (for comparison)': async () => {
      await sharp(input, { limitInputPixels: false }).metadata();
      await sharp(input).rotate().jpeg({ quality: 85 }).toFile(join(dir, 'old.jpg'));
      await sharp(join(dir, 'old.jpg')).resize({ width: 480, withoutEnlargement: true }).webp({ quality: 75 }).toFile(join(dir, 'old.webp'));
      await pipeline(createReadStream(join(dir, 'old.jpg')), createHash('sha256'));
    },
  };
  const times: Record<string, number[]> = Object.fromEntries(Object.keys(runs).map((k) => [k, []]));
  for (const run of Object.values(runs)) await run(); // warm up libvips and the file cache
  for (let i = 0; i < ROUNDS; i++) {
    for (const [name, run] of Object.entries(runs)) {
      const t = performance.now();
      await run();
      times[name]!.push(performance.now() - t);
    }
  }
  const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
  const base = median(times['sharp re-encode alone']!);
  console.log(`\n${ROUNDS} rounds each, medians`);
  console.log('| measured | median ms | × sharp alone |');
  console.log('| --- | --- | --- |');
  for (const [name, xs] of Object.entries(times)) console.log(`| ${name} | ${median(xs).toFixed(0)} | ${(median(xs) / base).toFixed(2)} |`);
  const ratio = median(times['server processing (re-encode, rotate, preview, checksum)']!) / base;
  console.log(`\nserver / sharp alone = ${ratio.toFixed(2)} (target ≤ 1.30): ${ratio <= 1.3 ? 'met' : 'NOT met'}`);
  const kept = await stat(join(dir, 'main.jpg'));
  console.log(`kept file ${(kept.size / 1024 / 1024).toFixed(1)} MB`);
} finally {
  await rm(dir, { recursive: true, force: true });
}
