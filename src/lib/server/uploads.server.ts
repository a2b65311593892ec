// Server-only: receiving, re-encoding, storing, serving and deleting evidence uploads.
// The body is streamed to a temporary file and cut off at the limit; images are decoded and
// re-encoded so no metadata survives; the file moves into storage before its row commits.
import { countOf } from '@/lib/grammar';
import { createHash, randomUUID } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { mkdir, open, rm, type FileHandle } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { Readable, Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import busboy from 'busboy';
import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { and, asc, eq, isNotNull, ne, sql } from 'drizzle-orm';
import { cases, uploadKindEnum, uploads, type CaseRow, type UploadRow } from '@/db/schema';
import {
  documentTypes,
  formatBytes,
  imageTypes,
  largestUploadBytes,
  maxBytesFor,
  sanitiseFileName,
  typesFor,
  uploadKindSchema,
  uploadKinds,
  uploadLimits,
  type ImageType,
  type StoredType,
  type UploadItem,
  type UploadKind,
} from '@/lib/schemas/uploads';
import { audit } from './audit.server';
import { reencodePhoto, TooManyPixels, Undecodable } from './images.server';
import { assessPhoto, measurePhoto, type Measured, type OtherPhoto } from './photo-quality.server';
import type { PhotoQuality } from '@/lib/photo-quality';
import type { ReadinessSettings } from '@/lib/readiness/settings';
import { editableStages } from './case-view.server';
import { findVisibleCase } from './cases.server';
import { config } from './config.server';
import { db, transaction } from './db.server';
import { isUuid } from '@/lib/ids';
import { HttpError, notFound } from './http';
import { refreshReadiness } from './readiness.server';
import { readinessSettings } from './settings.server';
import { uploadRateLimits } from './rate-limit.server';
import { noteChangeSinceReady, tellOfficeOfChange } from './changes-since-ready.server';
import { firm } from './office.server';
import { uploadKindLabels } from '@/lib/readiness/upload-status';
import { uploadStorage } from './storage/index.server';
import type { SessionUser } from './users.server';

// The database enum and the client-safe list must name the same kinds.
type SameKinds = (typeof uploadKindEnum.enumValues)[number] extends UploadKind
  ? UploadKind extends (typeof uploadKindEnum.enumValues)[number]
    ? true
    : never
  : never;
const kindsMatch: SameKinds = true;
void kindsMatch;

/** Room for the multipart envelope (boundaries, part headers, the kind field) around the file. */
const ENVELOPE_BYTES = 64 * 1024;
/** After refusing, we keep reading (and dropping) this much so the client can read our answer. */
const DRAIN_CAP_BYTES = 64 * 1024 * 1024;
/** file-type reads at most this many bytes to recognise a format. */
const SNIFF_BYTES = 4100;

/** HEIC (iPhone) photos only if this machine's libvips has an HEVC decoder. */
export const heicDecodable = Boolean(sharp.format.heif?.input?.fileSuffix?.includes('.heic'));

/** Where uploads are written while they arrive; always the local disk, whatever the storage. */
export const scratchDir = () => join(resolve(config.uploadDir), '.incoming');

// ---- customer-facing refusals ---------------------------------------------------------------

const refuse = {
  notMultipart: () =>
    new HttpError(415, 'unsupported_media_type', 'Send the upload as multipart/form-data with the fields "kind" and "file".'),
  unknownType: () =>
    new HttpError(
      415,
      'unsupported_media_type',
      'We can take photos (JPEG, PNG or WebP) and PDF documents only, and this file is neither. Please take a photo of it, or save it as a PDF, and send that.',
    ),
  heic: () =>
    new HttpError(
      415,
      'unsupported_media_type',
      'This photo is in the HEIC format, which we cannot open. Please send it as a JPEG: on an iPhone, go to Settings → Camera → Formats, choose "Most Compatible", and take the photo again (or send a screenshot of it).',
    ),
  photoOnly: () =>
    new HttpError(415, 'unsupported_media_type', 'Please send a photo here (JPEG, PNG or WebP), not a document: we need to see it for ourselves.'),
  tooLarge: (type: StoredType | null) =>
    new HttpError(
      413,
      'payload_too_large',
      type === 'application/pdf'
        ? `This PDF is larger than ${formatBytes(uploadLimits.pdfMaxBytes)}, the most we can take. Please send just the pages we need, or a smaller copy.`
        : `This file is larger than ${formatBytes(uploadLimits.imageMaxBytes)}, the most we can take. Please send a smaller photo: most phones and cameras have a setting for a smaller picture size.`,
    ),
  tooManyPixels: (megapixels: number) =>
    new HttpError(
      422,
      'invalid',
      `This image is ${megapixels} megapixels; the most we can take is ${uploadLimits.imageMaxPixels / 1_000_000}. Please send a smaller version — an ordinary phone photo is well within that.`,
      { file: 'The image has too many pixels.' },
    ),
  undecodable: () =>
    new HttpError(
      422,
      'invalid',
      'We could not open this image: the file may be damaged or only partly copied. Please take or save the photo again and send that.',
      { file: 'The image could not be read.' },
    ),
  badPdf: () =>
    new HttpError(422, 'invalid', 'This PDF looks incomplete or damaged. Please save it again and send the new copy.', {
      file: 'The PDF could not be read.',
    }),
  empty: () => new HttpError(422, 'invalid', 'That file is empty. Please choose the photo or PDF again.', { file: 'The file is empty.' }),
  interrupted: () =>
    new HttpError(400, 'bad_request', 'The upload broke off before the whole file arrived. Please check your connection and try again.'),
  noFile: () => new HttpError(422, 'invalid', 'Choose a photo or a PDF to upload.', { file: 'Choose a file.' }),
  badKind: () =>
    new HttpError(422, 'invalid', 'Say what this file shows (for example the meter or the cut-out).', {
      kind: `Use one of: ${uploadKinds.join(', ')}.`,
    }),
  caseFull: (files: number, bytes: number) =>
    new HttpError(
      413,
      'payload_too_large',
      `This case already holds ${countOf(files, 'file')} (${formatBytes(bytes)}), the most we keep for one home (${uploadLimits.caseMaxFiles} files, ${formatBytes(uploadLimits.caseMaxBytes)}). Please remove a photo you no longer need, or ask your installer.`,
    ),
  tooFast: (seconds: number) =>
    new HttpError(429, 'rate_limited', `That is a lot of uploads in a short time. Please wait ${countOf(Math.ceil(seconds / 60), 'minute')} and try again.`, undefined, {
      retryAfterSeconds: seconds,
    }),
  locked: () =>
    new HttpError(409, 'conflict', 'This case can no longer be changed. Please contact your installer.', undefined, { reason: 'locked' }),
};

// ---- temporary files --------------------------------------------------------------------------

/** A file under the scratch folder that is either kept (moved away) or removed, never left. */
class ScratchFile {
  private constructor(
    readonly path: string,
    private handle: FileHandle | null,
  ) {}

  static async create(suffix: string): Promise<ScratchFile> {
    const dir = scratchDir();
    await mkdir(dir, { recursive: true, mode: 0o700 });
    const path = join(dir, `${randomUUID()}.${suffix}`);
    // Readable by the app's own user only: customers' photos are nobody else's business.
    return new ScratchFile(path, await open(path, 'wx', 0o600));
  }

  /** A path for a tool (sharp) to write itself; removed with `remove()` like the others. */
  static async reserve(suffix: string): Promise<ScratchFile> {
    const dir = scratchDir();
    await mkdir(dir, { recursive: true, mode: 0o700 });
    return new ScratchFile(join(dir, `${randomUUID()}.${suffix}`), null);
  }

  async write(chunk: Buffer): Promise<void> {
    await this.handle!.write(chunk);
  }

  async close(): Promise<void> {
    const h = this.handle;
    this.handle = null;
    await h?.close();
  }

  async remove(): Promise<void> {
    await this.close().catch(() => {});
    await rm(this.path, { force: true });
  }
}

// ---- reading the multipart body ---------------------------------------------------------------

type Received = {
  kind: string | undefined;
  file: ScratchFile;
  type: StoredType;
  bytes: number;
  sha256: string;
  originalName: string | null;
};

/** Reads and drops the rest of a body (up to a cap) so the client sees our answer, not a reset. */
function discardBody(request: Request): void {
  if (!request.body) return;
  const reader = request.body.getReader();
  let seen = 0;
  const pump = (): Promise<void> =>
    reader.read().then(({ done, value }) => {
      if (done) return;
      seen += value.byteLength;
      if (seen > DRAIN_CAP_BYTES) return void reader.cancel().catch(() => {});
      return pump();
    });
  pump().catch(() => {});
}

/** The content type we would keep, decided from the first bytes only (never the name or header). */
async function sniff(head: Buffer, kindSoFar: string | undefined): Promise<StoredType> {
  const found = await fileTypeFromBuffer(head);
  const mime = found?.mime === 'image/apng' ? 'image/png' : found?.mime;
  if (mime === 'image/heic' || mime === 'image/heif' || mime === 'image/heic-sequence' || mime === 'image/heif-sequence') {
    if (!heicDecodable) throw refuse.heic();
    return 'image/jpeg';
  }
  if (!mime || !(mime in imageTypes || mime in documentTypes)) throw refuse.unknownType();
  const type = mime as StoredType;
  const kind = uploadKindSchema.safeParse(kindSoFar);
  if (kind.success && !typesFor(kind.data).includes(type)) throw refuse.photoOnly();
  return type;
}

/**
 * Streams the multipart body: the `file` part goes to a scratch file, checked for type on its
 * first bytes and cut off at its limit. Rejects as soon as the upload is refused; the rest of
 * the body is then read and dropped in the background.
 */
function receiveMultipart(request: Request): Promise<Received> {
  const contentType = request.headers.get('content-type') ?? '';
  let parser: busboy.Busboy | undefined;
  try {
    if (request.body && contentType.toLowerCase().startsWith('multipart/form-data')) {
      parser = busboy({
        headers: { 'content-type': contentType },
        defParamCharset: 'utf8',
        limits: { files: 1, fields: 8, fieldSize: 256, parts: 10, fileSize: largestUploadBytes + 1 },
      });
    }
  } catch {
    parser = undefined;
  }
  if (!parser || !request.body) {
    discardBody(request);
    return Promise.reject(refuse.notMultipart());
  }
  const body = request.body as import('node:stream/web').ReadableStream<Uint8Array>;
  const bb = parser;

  return new Promise<Received>((resolvePromise, rejectPromise) => {
    let kind: string | undefined;
    let settled = false;
    let part: FilePart | undefined;

    // Anything but our own refusals means the body broke off or was malformed.
    const fail = (err: unknown) => {
      if (settled) return;
      settled = true;
      part?.abort();
      rejectPromise(err instanceof HttpError || isDiskError(err) ? err : refuse.interrupted());
    };

    bb.on('field', (name, value) => {
      if (name !== 'kind') return;
      kind = value;
      if (!uploadKindSchema.safeParse(value).success) fail(refuse.badKind());
    });

    bb.on('file', (name, stream, info) => {
      if (name !== 'file' || part || settled) return void stream.resume();
      part = writeFilePart(stream, unescapeFormName(info.filename), () => kind, fail);
    });

    bb.on('close', () => {
      if (!part) return fail(refuse.noFile());
      part.done.then((file) => {
        if (settled) return void file?.file.remove();
        if (!file) return fail(refuse.noFile());
        settled = true;
        resolvePromise({ kind, ...file });
      });
    });
    bb.on('error', (err) => fail(err));

    // Count every byte read; past the drain cap the connection is dropped.
    let total = 0;
    const counter = new Transform({
      transform(chunk: Buffer, _enc, done) {
        total += chunk.length;
        if (total > DRAIN_CAP_BYTES) return done(refuse.tooLarge(null));
        done(null, chunk);
      },
    });
    // An interrupted upload lands here (or in the parser's error): the client went away mid-file.
    pipeline(Readable.fromWeb(body), counter, bb).catch(fail);
  });
}

// Our own disk failing is a 500 for us to fix, not an interrupted upload for the customer to retry.
const DISK_ERRORS = new Set(['ENOSPC', 'EDQUOT', 'EACCES', 'EPERM', 'EROFS', 'EIO', 'EMFILE', 'ENFILE']);
const isDiskError = (err: unknown) => DISK_ERRORS.has((err as NodeJS.ErrnoException)?.code ?? '');

// The HTML form-data encoding escapes " CR LF in file names as %22 %0D %0A; browsers and undici do.
const unescapeFormName = (name: string | undefined) => name?.replace(/%22/g, '"').replace(/%0[ad]/gi, ' ');

type FilePart = {
  /** The written file, or null when it was refused (and removed). */
  done: Promise<Omit<Received, 'kind'> | null>;
  /** Stop keeping this part: remove what was written and drop the rest. */
  abort: () => void;
};

/**
 * Writes one file part to a scratch file. On refusal it calls `fail` at once, removes what it
 * wrote and keeps draining the part, so the parser (and the client) can finish.
 */
function writeFilePart(stream: Readable, rawName: string | undefined, kindSoFar: () => string | undefined, fail: (err: unknown) => void): FilePart {
  const hash = createHash('sha256');
  let head: Buffer[] = [];
  let headBytes = 0;
  let bytes = 0;
  let type: StoredType | null = null;
  let file: ScratchFile | null = null;
  let refused = false;
  // Every file operation runs on this chain, in order; a refusal appends the removal.
  let chain: Promise<void> = Promise.resolve();
  let resolvePart: (value: Omit<Received, 'kind'> | null) => void = () => {};
  const done = new Promise<Omit<Received, 'kind'> | null>((r) => (resolvePart = r));

  const refuseWith = (err: unknown) => {
    if (refused) return;
    refused = true;
    fail(err);
    chain = chain
      .catch(() => {})
      .then(() => file?.remove())
      .catch(() => {});
    void chain.then(() => resolvePart(null));
  };
  const step = (work: () => Promise<void>) => {
    stream.pause();
    chain = chain.then(work).then(
      () => void stream.resume(),
      (err) => {
        refuseWith(err);
        stream.resume();
      },
    );
  };

  // Decide the type once the head is in, then write the head and everything after it.
  const start = async () => {
    const first = Buffer.concat(head);
    head = [];
    type = await sniff(first, kindSoFar());
    if (bytes > maxBytesFor(type)) throw refuse.tooLarge(type);
    file = await ScratchFile.create('part');
    await file.write(first);
  };

  stream.on('data', (chunk: Buffer) => {
    if (refused) return;
    bytes += chunk.length;
    hash.update(chunk);
    if (type === null) {
      head.push(chunk);
      headBytes += chunk.length;
      if (headBytes >= SNIFF_BYTES) step(start);
      return;
    }
    if (bytes > maxBytesFor(type)) return refuseWith(refuse.tooLarge(type));
    step(() => file!.write(chunk));
  });

  stream.on('end', () => {
    if (refused) return;
    chain = chain.then(async () => {
      if (refused) return;
      if (type === null) {
        if (bytes === 0) throw refuse.empty();
        await start();
      }
      if ((stream as Readable & { truncated?: boolean }).truncated) throw refuse.tooLarge(type);
      await file!.close();
      resolvePart({ file: file!, type: type!, bytes, sha256: hash.digest('hex'), originalName: sanitiseFileName(rawName) });
    });
    chain.catch((err) => refuseWith(err));
  });
  stream.on('error', (err) => refuseWith(err));

  return { done, abort: () => refuseWith(null) };
}

// ---- images and documents ---------------------------------------------------------------------

type Prepared = {
  main: ScratchFile;
  thumb: ScratchFile | null;
  type: StoredType;
  width: number | null;
  height: number | null;
  bytes: number;
  sha256: string;
  /** The photo check's figures and hash; null for documents. */
  measured: Measured | null;
};

/**
 * Re-encodes a photo (see images.server.ts) into scratch files, then measures it for the photo
 * check (photo-quality.server.ts) from the sent file, turning failures into refusals.
 */
async function reencodeImage(input: ScratchFile, type: StoredType): Promise<Prepared> {
  const main = await ScratchFile.reserve(imageTypes[type as keyof typeof imageTypes]);
  const thumb = await ScratchFile.reserve('webp');
  try {
    const done = await reencodePhoto(input.path, type as ImageType, main.path, thumb.path);
    // The check advises: if it cannot measure, the photo is still kept, without a verdict.
    const measured = await measurePhoto(input.path, done.width, done.height).catch(() => null);
    return { main, thumb, type, ...done, measured };
  } catch (err) {
    await Promise.all([main.remove(), thumb.remove()]);
    if (err instanceof TooManyPixels) throw refuse.tooManyPixels(err.megapixels);
    if (err instanceof Undecodable) throw refuse.undecodable();
    throw err;
  }
}

/** PDFs are kept as sent (not re-encoded); check they at least begin and end like a PDF. */
async function checkPdf(file: ScratchFile, bytes: number): Promise<void> {
  const handle = await open(file.path, 'r');
  try {
    const head = Buffer.alloc(5);
    await handle.read(head, 0, 5, 0);
    const tailLength = Math.min(bytes, 2048);
    const tail = Buffer.alloc(tailLength);
    await handle.read(tail, 0, tailLength, bytes - tailLength);
    // ISO 32000-1 §7.5.2 and §7.5.5: a PDF starts with "%PDF-" and its last lines hold "%%EOF".
    if (head.toString('latin1') !== '%PDF-' || !tail.toString('latin1').includes('%%EOF')) throw refuse.badPdf();
  } finally {
    await handle.close();
  }
}

async function sha256Of(path: string): Promise<string> {
  const hash = createHash('sha256');
  await pipeline(createReadStream(path), hash);
  return hash.digest('hex');
}

// ---- the API shape ------------------------------------------------------------------------------

const extensionOf = (mime: string) => ({ ...imageTypes, ...documentTypes })[mime as StoredType] ?? 'bin';

/**
 * One row as the API hands it out.
 * @example toUploadItem(row).thumbUrl // '/api/uploads/…?size=thumb'
 */
export function toUploadItem(row: UploadRow): UploadItem {
  return {
    id: row.id,
    kind: row.kind,
    status: row.status,
    reason: row.reason,
    mimeType: row.mimeType,
    sizeBytes: row.sizeBytes,
    width: row.width,
    height: row.height,
    originalName: row.originalName,
    createdAt: row.createdAt.toISOString(),
    reviewedAt: row.reviewedAt?.toISOString() ?? null,
    url: `/api/uploads/${row.id}`,
    thumbUrl: row.thumbKey ? `/api/uploads/${row.id}?size=thumb` : null,
    quality: (row.quality as PhotoQuality | null) ?? null,
  };
}

// ---- receiving --------------------------------------------------------------------------------

/**
 * Receives one multipart upload for a case the caller may see, keeps it and answers its item.
 * Nothing is left behind when it is refused or interrupted: no scratch file, no row.
 *
 * @example const item = await receiveUpload(user, caseRow, ctx.request); // 201 with item
 */
export async function receiveUpload(user: SessionUser, caseRow: CaseRow, request: Request): Promise<UploadItem> {
  if (user.role === 'customer' && !editableStages.includes(caseRow.stage)) {
    discardBody(request);
    throw refuse.locked();
  }
  const declared = Number(request.headers.get('content-length') ?? NaN);
  if (declared > largestUploadBytes + ENVELOPE_BYTES) {
    discardBody(request);
    throw refuse.tooLarge(null);
  }
  // Both before a byte is read: the per-user rate, then the case's room (checked again on keeping).
  const rate = await uploadRateLimits.perUser.hit(user.id);
  if (!rate.allowed) {
    discardBody(request);
    throw refuse.tooFast(rate.retryAfterSeconds);
  }
  try {
    await assertCaseHasRoom(db(), caseRow.id, 0);
  } catch (err) {
    discardBody(request);
    throw err;
  }
  const received = await receiveMultipart(request);
  const scratch: ScratchFile[] = [received.file];
  try {
    const parsedKind = uploadKindSchema.safeParse(received.kind);
    if (!parsedKind.success) throw refuse.badKind();
    const kind = parsedKind.data;
    if (!typesFor(kind).includes(received.type)) throw refuse.photoOnly();
    const prepared = await prepare(received);
    scratch.push(prepared.main, ...(prepared.thumb ? [prepared.thumb] : []));
    // Read before the transaction opens: inside it, every query must go through tx.
    const settings = await readinessSettings();
    const quality = prepared.measured ? assessPhoto(prepared.measured, kind, settings, await otherPhotos(caseRow.id)) : null;
    return await keep(user, caseRow, kind, received.originalName, prepared, settings, quality);
  } finally {
    await Promise.all(scratch.map((f) => f.remove()));
  }
}

async function prepare(received: Received): Promise<Prepared> {
  if (received.type === 'application/pdf') {
    await checkPdf(received.file, received.bytes);
    return { main: received.file, thumb: null, type: received.type, width: null, height: null, bytes: received.bytes, sha256: received.sha256, measured: null };
  }
  return inImageSlot(() => reencodeImage(received.file, received.type));
}

// A 40-megapixel decode takes ~120 MB; two at a time bounds memory when many arrive at once.
const IMAGE_SLOTS = 2;
let busySlots = 0;
const waitingForSlot: Array<() => void> = [];

async function inImageSlot<T>(work: () => Promise<T>): Promise<T> {
  if (busySlots >= IMAGE_SLOTS) await new Promise<void>((r) => waitingForSlot.push(r));
  else busySlots++;
  try {
    return await work();
  } finally {
    const next = waitingForSlot.shift();
    if (next) next();
    else busySlots--;
  }
}

/** The case's photos that have a hash, for the duplicate check (read before the transaction). */
async function otherPhotos(caseId: string): Promise<OtherPhoto[]> {
  const rows = await db()
    .select({ kind: uploads.kind, hash: uploads.perceptualHash })
    .from(uploads)
    .where(and(eq(uploads.caseId, caseId), isNotNull(uploads.perceptualHash)));
  return rows.map((r) => ({ kind: r.kind, hash: r.hash! }));
}

/** 413 when one more file of `bytes` would pass the case's quota (files or total bytes). */
async function assertCaseHasRoom(q: Pick<ReturnType<typeof db>, 'select'>, caseId: string, bytes: number): Promise<void> {
  const [used] = await q
    .select({ files: sql<number>`count(*)::int`, bytes: sql<number>`coalesce(sum(${uploads.sizeBytes}), 0)::bigint` })
    .from(uploads)
    .where(eq(uploads.caseId, caseId));
  const files = Number(used?.files ?? 0);
  const total = Number(used?.bytes ?? 0);
  if (files + 1 > uploadLimits.caseMaxFiles || total + bytes > uploadLimits.caseMaxBytes) throw refuse.caseFull(files, total);
}

/**
 * Moves the files into storage, then commits the row (with its audit entry); removes the files
 * again if the row does not commit. Killed in between, the process leaves files without a row,
 * never a row without its file: the storage sweep (storage-sweep.server.ts) removes such files
 * after its grace period.
 */
async function keep(
  user: SessionUser,
  caseRow: CaseRow,
  kind: UploadKind,
  originalName: string | null,
  p: Prepared,
  settings: ReadinessSettings,
  quality: PhotoQuality | null,
): Promise<UploadItem> {
  const id = randomUUID();
  const shard = id.slice(0, 2);
  const storageKey = `${shard}/${id}.${extensionOf(p.type)}`;
  const thumbKey = p.thumb ? `${shard}/${id}-thumb.webp` : null;
  let firstChangeAfterReady = false;
  const storage = uploadStorage();
  const removeStored = () => Promise.all([storage.delete(storageKey), thumbKey ? storage.delete(thumbKey) : null]).catch(() => {});
  try {
    await storage.put(storageKey, { file: p.main.path });
    if (thumbKey && p.thumb) await storage.put(thumbKey, { file: p.thumb.path });
    const row = await transaction(async (tx) => {
      // The case row is locked so two uploads at once cannot both take the last room.
      await tx.select({ id: cases.id }).from(cases).where(eq(cases.id, caseRow.id)).for('update');
      await assertCaseHasRoom(tx, caseRow.id, p.bytes);
      const [inserted] = await tx
        .insert(uploads)
        .values({
          id,
          caseId: caseRow.id,
          kind,
          mimeType: p.type,
          sizeBytes: p.bytes,
          sha256: p.sha256,
          width: p.width,
          height: p.height,
          originalName,
          uploadedBy: user.id,
          storageKey,
          thumbKey,
          qualityOk: quality ? quality.ok : null,
          quality,
          perceptualHash: p.measured?.hash ?? null,
        })
        .returning();
      await audit(tx, { caseId: caseRow.id, actorId: user.id, action: 'upload.added', entity: 'upload', entityId: id, after: auditView(inserted!) });
      if (user.role === 'customer') {
        await tx.update(cases).set({ lastCustomerActivityAt: new Date() }).where(eq(cases.id, caseRow.id));
      }
      firstChangeAfterReady = await noteChangeSinceReady(tx, user, caseRow.id, { what: 'upload_added', detail: uploadKindLabels[kind] });
      // The documents check counts this file, so the stored light moves with it.
      await refreshReadiness(tx, caseRow.id, settings);
      return inserted!;
    });
    // Told after the row has committed (tellOfficeOfChange never throws for a failed e-mail).
    if (firstChangeAfterReady) await tellOfficeOfChange(caseRow, user, { what: 'upload_added', detail: uploadKindLabels[kind] }, (await firm()).email);
    return toUploadItem(row);
  } catch (err) {
    await removeStored();
    throw err;
  }
}

const auditView = (row: UploadRow) => ({
  kind: row.kind,
  mimeType: row.mimeType,
  sizeBytes: row.sizeBytes,
  sha256: row.sha256,
  originalName: row.originalName,
  status: row.status,
});

// ---- reading ----------------------------------------------------------------------------------

/** A case's uploads, oldest first (the order they were sent). */
export async function listUploads(caseId: string, kind?: UploadKind): Promise<UploadItem[]> {
  const rows = await db()
    .select()
    .from(uploads)
    .where(kind ? and(eq(uploads.caseId, caseId), eq(uploads.kind, kind)) : eq(uploads.caseId, caseId))
    .orderBy(asc(uploads.createdAt), asc(uploads.id));
  return rows.map(toUploadItem);
}

/** One upload if this user may see its case (same rule as the case itself); undefined otherwise. */
export async function findVisibleUpload(user: SessionUser, id: string): Promise<{ row: UploadRow; caseRow: CaseRow } | undefined> {
  if (!isUuid(id)) return undefined;
  const [row] = await db().select().from(uploads).where(eq(uploads.id, id)).limit(1);
  if (!row) return undefined;
  const caseRow = await findVisibleCase(user, row.caseId);
  return caseRow ? { row, caseRow } : undefined;
}

/**
 * RFC 6266 §4.3: a quoted ASCII `filename` fallback plus RFC 8187 `filename*` in UTF-8.
 * @example contentDisposition('Zoë’s meter.jpg') // inline; filename="Zo_s meter.jpg"; filename*=UTF-8''Zo%C3%AB%E2%80%99s%20meter.jpg
 */
export function contentDisposition(name: string, disposition: 'inline' | 'attachment' = 'inline'): string {
  const ascii = name.replace(/[^\x20-\x7e]|["\\%]/g, '_');
  const encoded = encodeURIComponent(name).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `${disposition}; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}

/** The name a download is offered under: the sender's name with the stored type's extension. */
export function downloadName(row: Pick<UploadRow, 'id' | 'kind' | 'mimeType' | 'originalName'>, thumb: boolean): string {
  const stem = (row.originalName ?? '').replace(/\.[^.]{1,10}$/, '') || `${row.kind.replace(/_/g, '-')}-${row.id.slice(0, 8)}`;
  return thumb ? `${stem}-preview.webp` : `${stem}.${extensionOf(row.mimeType)}`;
}

/** Opens the stored file (or its thumbnail) as a streamed response with safe headers. */
export async function uploadResponse(row: UploadRow, size: 'full' | 'thumb'): Promise<Response> {
  const key = size === 'thumb' ? row.thumbKey : row.storageKey;
  if (!key) throw new HttpError(404, 'not_found', 'This file has no preview.');
  const stored = await uploadStorage().get(key);
  if (!stored) throw notFound('That file');
  return new Response(Readable.toWeb(stored.stream) as ReadableStream, {
    status: 200,
    headers: {
      'Content-Type': size === 'thumb' ? 'image/webp' : row.mimeType,
      'Content-Length': String(stored.size),
      // A PDF can carry script and links: it is downloaded, never opened inside our origin.
      'Content-Disposition': contentDisposition(downloadName(row, size === 'thumb'), row.mimeType === 'application/pdf' && size === 'full' ? 'attachment' : 'inline'),
      'Content-Security-Policy': "default-src 'none'; sandbox",
      'X-Content-Type-Options': 'nosniff',
      'Cache-Control': 'private, max-age=600',
      'Cross-Origin-Resource-Policy': 'same-origin',
    },
  });
}

// ---- deleting ---------------------------------------------------------------------------------

/**
 * The case's customer removes an upload the office has not accepted: the row (with an audit
 * entry) first, then the files. 409 once it is accepted.
 */
export async function deleteUpload(user: SessionUser, row: UploadRow, caseRow: CaseRow): Promise<void> {
  if (user.role !== 'customer' || caseRow.customerId !== user.id) {
    throw new HttpError(403, 'forbidden', 'Only the customer who owns this case can remove its uploads; the office rejects them instead.');
  }
  if (row.uploadedBy !== user.id) {
    throw new HttpError(403, 'forbidden', 'This file was added by your installer or surveyor, so it stays with your case. Contact your installer if it is wrong.');
  }
  if (!editableStages.includes(caseRow.stage)) throw refuse.locked();
  // Read before the transaction opens: inside it, every query must go through tx.
  const settings = await readinessSettings();
  let firstChangeAfterReady = false;
  const deleted = await transaction(async (tx) => {
    // Conditional delete, so an office accept that lands first wins.
    const [gone] = await tx
      .delete(uploads)
      .where(and(eq(uploads.id, row.id), ne(uploads.status, 'accepted')))
      .returning();
    if (!gone) return undefined;
    await audit(tx, { caseId: row.caseId, actorId: user.id, action: 'upload.deleted', entity: 'upload', entityId: row.id, before: auditView(gone) });
    await tx.update(cases).set({ lastCustomerActivityAt: sql`now()` }).where(eq(cases.id, row.caseId));
    firstChangeAfterReady = await noteChangeSinceReady(tx, user, row.caseId, { what: 'upload_removed', detail: uploadKindLabels[gone.kind] });
    await refreshReadiness(tx, row.caseId, settings);
    return gone;
  });
  if (deleted && firstChangeAfterReady) await tellOfficeOfChange(caseRow, user, { what: 'upload_removed', detail: uploadKindLabels[deleted.kind] }, (await firm()).email);
  if (!deleted) {
    throw new HttpError(409, 'conflict', 'The office has already accepted this file, so it stays with your case. Contact your installer if it is wrong.', undefined, {
      reason: 'accepted',
    });
  }
  const storage = uploadStorage();
  await Promise.all([storage.delete(deleted.storageKey), deleted.thumbKey ? storage.delete(deleted.thumbKey) : null]);
}
