// Server-only: the re-encode every kept photo goes through (sharp/libvips). No database, no
// request: `npm run bench:photo` times it against sharp's own re-encode of the same photo.
import { createHash } from 'node:crypto';
import { writeFile } from 'node:fs/promises';
import sharp from 'sharp';
import { uploadLimits, type ImageType } from '@/lib/schemas/uploads';

/** The photo has more pixels than we take. */
export class TooManyPixels extends Error {
  constructor(readonly megapixels: number) {
    super(`image of ${megapixels} MP`);
  }
}
/** The file does not decode as an image. */
export class Undecodable extends Error {}

export type Reencoded = { width: number; height: number; bytes: number; sha256: string };

// Temporary files are deleted at once; sharp's open-file cache would keep them on disk.
sharp.cache({ files: 0 });

/**
 * Decodes, auto-rotates and re-encodes a photo into `mainPath` (sharp drops every bit of
 * metadata unless asked to keep it), and writes a WebP preview `thumbWidth` wide into
 * `thumbPath`. The sent bytes are never kept.
 *
 * Cost: one full decode and one encode, as sharp's own re-encode. The preview is made from
 * the sent file, not from the re-encoded one, so libvips can decode a JPEG at 1/2, 1/4 or 1/8
 * scale straight into the small size (shrink-on-load) instead of a second full decode; it runs
 * beside the main encode. The checksum is taken from the encoded bytes in memory.
 *
 * @example await reencodePhoto('/tmp/in.jpg', 'image/jpeg', '/tmp/main.jpg', '/tmp/thumb.webp')
 */
export async function reencodePhoto(inputPath: string, type: ImageType, mainPath: string, thumbPath: string): Promise<Reencoded> {
  const limit = uploadLimits.imageMaxPixels;
  let meta: sharp.Metadata;
  try {
    meta = await sharp(inputPath, { limitInputPixels: false }).metadata();
  } catch {
    throw new Undecodable();
  }
  const pixels = (meta.width ?? 0) * (meta.height ?? 0);
  if (pixels > limit) throw new TooManyPixels(Math.round(pixels / 1_000_000));
  if (!pixels) throw new Undecodable();

  const open = () => sharp(inputPath, { limitInputPixels: limit, failOn: 'error' }).rotate();
  const image = open();
  const encoded =
    type === 'image/png' ? image.png() : type === 'image/webp' ? image.webp({ quality: 85 }) : image.jpeg({ quality: 85 });
  try {
    const [{ data, info }] = await Promise.all([
      encoded.toBuffer({ resolveWithObject: true }),
      open().resize({ width: uploadLimits.thumbWidth, withoutEnlargement: true }).webp({ quality: 75 }).toFile(thumbPath),
    ]);
    await writeFile(mainPath, data);
    return { width: info.width, height: info.height, bytes: data.length, sha256: createHash('sha256').update(data).digest('hex') };
  } catch (err) {
    if (err instanceof Error && /pixel limit/i.test(err.message)) throw new TooManyPixels(Math.round(pixels / 1_000_000));
    if (isCodecError(err)) throw new Undecodable();
    throw err;
  }
}

// sharp reports decode failures as plain Errors from libvips; anything with an errno is ours (disk).
const isCodecError = (err: unknown) => err instanceof Error && !(err as NodeJS.ErrnoException).code;
