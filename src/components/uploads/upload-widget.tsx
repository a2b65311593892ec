// The upload widget of a slot: Uppy's Dashboard, its XHR upload to POST /api/cases/:id/uploads
// (real progress per file, Retry on failure) and photo resizing before sending. About 65 KB of
// script once compressed, so a slot loads this module only when the customer opens it, drops a
// file on it or picks one (see upload-slot.tsx).
import Uppy from '@uppy/core';
// The Dashboard alone: the package index also imports optional plugins that are not installed.
import Dashboard from '@uppy/react/lib/Dashboard.js';
import XHRUpload from '@uppy/xhr-upload';
import Compressor from '@uppy/compressor';
import '@uppy/core/dist/style.min.css';
import '@uppy/dashboard/dist/style.min.css';
import './uppy-theme.css';
import { formatBytes, largestUploadBytes, maxBytesFor, type UploadKind } from '@/lib/schemas/uploads';
import { errorMessageOf } from './api';
import { allowedFileTypes, isPdf } from './upload-types';

export { Dashboard };
export type SlotUppy = Uppy<Meta, Body>;

/**
 * Photos are scaled in the browser so their long edge is at most this many pixels before they
 * are sent. A 12 MP phone photo (4032 × 3024) becomes 2560 × 1920: each side keeps 63 % of its
 * pixels, so the digits of a meter register or the "100" on a fuse carrier that are 40 px tall in
 * the original are still about 25 px tall, where 10–12 px is enough to read them (common practice
 * — no published source). The file carries 40 % of the pixels, so it is sent in well under half
 * the time on mobile data. Photos already smaller than this are sent as they are.
 */
export const PHOTO_LONG_EDGE = 2560;
/** JPEG/WebP quality for the resized photo: 0.85 keeps fine print sharp (common practice — no published source). */
export const PHOTO_QUALITY = 0.85;

type Meta = { kind: UploadKind };
type Body = Record<string, unknown>;

// Only network failures and server trouble are worth an automatic retry; a 4xx will not change.
const worthRetrying = (xhr: XMLHttpRequest) => xhr.status === 0 || xhr.status === 408 || xhr.status === 429 || xhr.status >= 500;

/** A configured Uppy for one slot. @example const uppy = createUppy(caseId, 'meter_photo'); */
export function createUppy(caseId: string, kind: UploadKind): SlotUppy {
  const uppy: Uppy<Meta, Body> = new Uppy<Meta, Body>({
    id: `upload-${kind}`,
    autoProceed: true,
    meta: { kind },
    // A refused upload is shown to the customer in the slot; in the console it is only a warning.
    logger: { debug: () => {}, warn: (...args: unknown[]) => console.warn(...args), error: (...args: unknown[]) => console.warn(...args) },
    restrictions: { allowedFileTypes: allowedFileTypes(kind), maxFileSize: largestUploadBytes, maxNumberOfFiles: 5 },
    // PDFs have a smaller limit than photos; Uppy's own check knows one size only.
    onBeforeFileAdded: (file) => {
      const limit = maxBytesFor(isPdf(file) ? 'application/pdf' : 'image/jpeg');
      if ((file.size ?? 0) <= limit) return true;
      uppy.info(`${file.name} is larger than ${formatBytes(limit)}, the most we can take for a ${isPdf(file) ? 'PDF' : 'photo'}.`, 'error', 8000);
      return false;
    },
    locale: {
      strings: {
        exceedsSize: '%{file} is larger than %{size}, the most we can take. Please send a smaller photo.',
        youCanOnlyUploadFileTypes: 'We can take these kinds of file here: %{types}',
        noDuplicates: 'You have already added %{fileName}.',
        failedToUpload: 'Could not send %{file}',
      },
      pluralize: (n: number) => (n === 1 ? 0 : 1),
    },
  });
  // Resize photos before sending; PDFs pass untouched. The server still re-encodes everything
  // it keeps, so a photo that slips through unresized (an old browser) is handled there.
  // compressorjs keeps whichever is smaller, the original or the resized copy (strict mode).
  uppy.use(Compressor, { quality: PHOTO_QUALITY, maxWidth: PHOTO_LONG_EDGE, maxHeight: PHOTO_LONG_EDGE, limit: 1 });
  uppy.use(XHRUpload<Meta, Body>, {
    endpoint: `/api/cases/${caseId}/uploads`,
    fieldName: 'file',
    formData: true,
    allowedMetaFields: ['kind'],
    limit: 2,
    timeout: 60_000,
    shouldRetry: worthRetrying,
    // Turn the server's error into the message the customer sees beside the file.
    onAfterResponse: (xhr) => {
      if (xhr.status < 400) return;
      let body: unknown = null;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        /* not JSON: use the fallback */
      }
      throw new Error(errorMessageOf(body, 'The upload did not go through. Please press Retry.'));
    },
  });
  return uppy;
}

export const dashboardStrings = (photoOnly: boolean) => ({
  strings: {
    dropPasteFiles: photoOnly ? 'Drop a photo here or %{browseFiles}' : 'Drop a photo or PDF here or %{browseFiles}',
    // On a touch screen Uppy lists "Choose" and "Take a photo" under this line instead.
    dropPasteImportFiles: photoOnly ? 'Add a photo' : 'Add a photo or a PDF',
    browseFiles: 'choose a file',
    myDevice: photoOnly ? 'Choose a photo' : 'Choose a file',
    takePictureBtn: 'Take a photo',
    uploadComplete: 'Sent',
    uploading: 'Sending',
    complete: 'Sent',
    uploadFailed: 'Not sent',
    uploadingXFiles: { 0: 'Sending %{smart_count} file', 1: 'Sending %{smart_count} files' },
    xFilesSelected: { 0: '%{smart_count} file chosen', 1: '%{smart_count} files chosen' },
    retry: 'Retry',
    retryUpload: 'Retry',
    cancel: 'Cancel',
    done: 'Done',
    dropHint: 'Drop your file here',
    addMore: 'Add another',
  },
  pluralize: (n: number) => (n === 1 ? 0 : 1),
});

