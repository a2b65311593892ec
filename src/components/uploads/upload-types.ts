// What a slot accepts, shared by the light drop zone and the Uppy widget. Client-safe.
import { formatBytes, typesFor, uploadLimits, type UploadKind } from '@/lib/schemas/uploads';

const EXTENSIONS: Record<string, string[]> = {
  'image/jpeg': ['.jpg', '.jpeg'],
  'image/png': ['.png'],
  'image/webp': ['.webp'],
  'application/pdf': ['.pdf'],
};

/** What the file picker offers: the server's types, by MIME type and by extension. */
export function allowedFileTypes(kind: UploadKind): string[] {
  return typesFor(kind).flatMap((type) => [type, ...(EXTENSIONS[type] ?? [])]);
}

/** The limits line under the slot, e.g. "JPEG, PNG or WebP up to 15 MB, or PDF up to 10 MB". */
export function limitsLine(kind: UploadKind): string {
  const photos = `Photos (JPEG, PNG or WebP) up to ${formatBytes(uploadLimits.imageMaxBytes)}`;
  return typesFor(kind).includes('application/pdf') ? `${photos}, or a PDF up to ${formatBytes(uploadLimits.pdfMaxBytes)}` : photos;
}

export const isPdf = (file: { type?: string; extension?: string }) => file.type === 'application/pdf' || file.extension?.toLowerCase() === 'pdf';

