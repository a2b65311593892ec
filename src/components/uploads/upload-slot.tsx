// One upload slot: what to photograph (one line), a compact Uppy Dashboard (drag and drop, or
// the phone's camera) sending to POST /api/cases/:id/uploads with a progress bar per file and
// Retry on failure, then the files already sent with their review status and Remove.
import { useEffect, useMemo, useRef, useState } from 'react';
import Uppy from '@uppy/core';
// The Dashboard alone: the package index also imports optional plugins that are not installed.
import Dashboard from '@uppy/react/lib/Dashboard.js';
import XHRUpload from '@uppy/xhr-upload';
import '@uppy/core/dist/style.min.css';
import '@uppy/dashboard/dist/style.min.css';
import './uppy-theme.css';
import {
  formatBytes,
  largestUploadBytes,
  maxBytesFor,
  typesFor,
  uploadKindInfo,
  uploadLimits,
  type UploadItem,
  type UploadKind,
} from '../../lib/schemas/uploads';
import { uploadKindStatus } from '../../lib/readiness/upload-status';
import { errorMessageOf, fetchUploads } from './api';
import { AcceptedIcon, ClockIcon, InfoIcon, MissingIcon, NotAcceptedIcon, StopIcon } from '../icons';
import { UploadedFile } from './uploaded-file';

export type UploadSlotProps = {
  caseId: string;
  kind: UploadKind;
  /** Defaults to the kind's customer-facing title. */
  title?: string;
  /** One line on what a good photo shows; defaults to the kind's hint. */
  hint?: string;
  /** Whether the answers call for this upload (see requiredUploadKinds). */
  required?: boolean;
  /** Files already known (from the page or an UploadList); without them the slot loads its own. */
  initialItems?: UploadItem[];
  /** False once the case is closed for changes: files are shown, nothing can be added or removed. */
  editable?: boolean;
  /** Told whenever this slot's files change, e.g. to refresh a step's progress. */
  onChange?: (items: UploadItem[]) => void;
};

type Meta = { kind: UploadKind };
type Body = Record<string, unknown>;

const EXTENSIONS: Record<string, string[]> = {
  'image/jpeg': ['.jpg', '.jpeg'],
  'image/png': ['.png'],
  'image/webp': ['.webp'],
  'application/pdf': ['.pdf'],
};

/** What the file picker offers: the server's types, by MIME type and by extension. */
function allowedFileTypes(kind: UploadKind): string[] {
  return typesFor(kind).flatMap((type) => [type, ...(EXTENSIONS[type] ?? [])]);
}

/** The limits line under the slot, e.g. "JPEG, PNG or WebP up to 15 MB, or PDF up to 10 MB". */
function limitsLine(kind: UploadKind): string {
  const photos = `Photos (JPEG, PNG or WebP) up to ${formatBytes(uploadLimits.imageMaxBytes)}`;
  return typesFor(kind).includes('application/pdf') ? `${photos}, or a PDF up to ${formatBytes(uploadLimits.pdfMaxBytes)}` : photos;
}

const isPdf = (file: { type?: string; extension?: string }) => file.type === 'application/pdf' || file.extension?.toLowerCase() === 'pdf';

// Only network failures and server trouble are worth an automatic retry; a 4xx will not change.
const worthRetrying = (xhr: XMLHttpRequest) => xhr.status === 0 || xhr.status === 408 || xhr.status === 429 || xhr.status >= 500;

function createUppy(caseId: string, kind: UploadKind) {
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

const dashboardStrings = (photoOnly: boolean) => ({
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

/** The slot's overall standing, in words with an icon. */
function SlotStatus({ kind, items, required }: { kind: UploadKind; items: UploadItem[]; required: boolean }) {
  const { state } = uploadKindStatus(kind, items);
  const look = {
    accepted: { Icon: AcceptedIcon, text: 'Accepted', cls: 'text-clear' },
    waiting: { Icon: ClockIcon, text: 'Waiting for review', cls: 'text-ground-700' },
    rejected: { Icon: NotAcceptedIcon, text: 'Not accepted — please send another', cls: 'text-blocked' },
    missing: { Icon: MissingIcon, text: required ? 'Still needed' : 'Optional', cls: required ? 'text-attention' : 'text-ground-600' },
  }[state];
  return (
    <span className={`inline-flex items-center gap-1 text-sm font-semibold ${look.cls}`} data-testid="slot-status" data-state={state}>
      <look.Icon className="h-4 w-4" />
      {look.text}
    </span>
  );
}

/**
 * A self-contained upload slot for one kind of photo or document.
 * @example <UploadSlot caseId={caseId} kind="cutout_photo" required />
 */
export default function UploadSlot({ caseId, kind, title, hint, required = false, initialItems, editable = true, onChange }: UploadSlotProps) {
  const info = uploadKindInfo[kind];
  const heading = title ?? info.title;
  const [items, setItems] = useState<UploadItem[]>(initialItems ?? []);
  const [loadError, setLoadError] = useState<string | null>(null);
  const [sendError, setSendError] = useState<string | null>(null);
  const [uppy, setUppy] = useState<Uppy<Meta, Body> | null>(null);
  const [touch, setTouch] = useState(false);
  const [expanded, setExpanded] = useState(false);
  const [busy, setBusy] = useState(false);
  const onChangeRef = useRef(onChange);
  onChangeRef.current = onChange;
  const ids = useMemo(() => ({ heading: `upload-${kind}-heading`, hint: `upload-${kind}-hint` }), [kind]);

  const update = (next: (prev: UploadItem[]) => UploadItem[]) =>
    setItems((prev) => {
      const value = next(prev);
      queueMicrotask(() => onChangeRef.current?.(value));
      return value;
    });

  useEffect(() => {
    if (initialItems) return;
    let live = true;
    fetchUploads(caseId, kind).then(
      (loaded) => live && setItems(loaded),
      (err: Error) => live && setLoadError(err.message),
    );
    return () => {
      live = false;
    };
  }, [caseId, kind, initialItems]);

  // Uppy touches the DOM, so it is made in the browser only (the slot also renders on the server).
  useEffect(() => {
    if (!editable) return;
    const coarse = window.matchMedia?.('(pointer: coarse)').matches ?? false;
    setTouch(coarse);
    const instance = createUppy(caseId, kind);
    instance.on('upload-success', (file, response) => {
      const item = response.body as unknown as UploadItem;
      setSendError(null);
      update((prev) => [...prev.filter((i) => i.id !== item.id), item]);
      // Leave "Sent" in view for a moment, then clear the Dashboard for the next photo.
      if (file) setTimeout(() => instance.getFile(file.id) && instance.removeFile(file.id), 1500);
    });
    instance.on('upload-error', (_file, error) => setSendError(error.message));
    instance.on('restriction-failed', (_file, error) => setSendError(error.message));
    instance.on('file-added', () => {
      setSendError(null);
      setBusy(true);
    });
    // Keep the Dashboard open while it holds files (sending, sent, or failed and waiting for Retry).
    instance.on('file-removed', () => setBusy(instance.getFiles().length > 0));
    instance.on('cancel-all', () => setBusy(false));
    setUppy(instance);
    return () => {
      instance.destroy();
      setUppy(null);
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [caseId, kind, editable]);

  const photoOnly = info.accepts === 'photo';
  const { state } = uploadKindStatus(kind, items);
  // Once a file is waiting or accepted, the drop zone folds away behind "Add another".
  const showDashboard = editable && (expanded || busy || state === 'missing' || state === 'rejected');
  return (
    <section className="card flex flex-col gap-3" aria-labelledby={ids.heading} data-testid={`upload-slot-${kind}`}>
      <div className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-1">
        <h3 id={ids.heading} className="text-lg font-bold text-ground-900">
          {heading}
        </h3>
        <SlotStatus kind={kind} items={items} required={required} />
      </div>
      <p id={ids.hint} className="flex items-start gap-2 text-ground-800">
        {/never (open|remove)/i.test(hint ?? info.hint) ? (
          <StopIcon className="mt-0.5 h-5 w-5 text-clay-600" />
        ) : (
          <InfoIcon className="mt-0.5 h-5 w-5 text-ground-600" />
        )}
        <span>{hint ?? info.hint}</span>
      </p>

      {showDashboard && (
        <div className="gw-uppy" aria-describedby={ids.hint}>
          {uppy ? (
            <Dashboard
              uppy={uppy}
              height={touch ? 230 : 160}
              width="100%"
              theme="light"
              proudlyDisplayPoweredByUppy={false}
              showProgressDetails
              hideProgressAfterFinish
              showRemoveButtonAfterComplete={false}
              doneButtonHandler={null}
              showNativePhotoCameraButton={touch}
              nativeCameraFacingMode="environment"
              fileManagerSelectionType="files"
              locale={dashboardStrings(photoOnly)}
            />
          ) : (
            <div className="flex h-[160px] items-center justify-center rounded-md border border-dashed border-ground-300 bg-paper text-ground-700">
              Getting the uploader ready…
            </div>
          )}
          <p className="mt-1 text-sm text-ground-700">{limitsLine(kind)}.</p>
        </div>
      )}

      {sendError && (
        <p role="alert" className="flex items-start gap-2 rounded-md border border-blocked/30 bg-blocked-soft p-2 text-sm font-semibold text-blocked" data-testid="upload-error">
          <NotAcceptedIcon className="mt-0.5 h-4 w-4" />
          <span>{sendError}</span>
        </p>
      )}
      {loadError && (
        <p role="alert" className="text-sm font-semibold text-blocked">
          {loadError}
        </p>
      )}

      {items.length > 0 && (
        <div>
          <h4 className="mb-1 text-sm font-semibold uppercase tracking-wide text-ground-700">Sent so far</h4>
          <ul className="grid grid-cols-[repeat(auto-fill,minmax(15rem,1fr))] gap-2" aria-label={`Files sent for ${heading.toLowerCase()}`}>
            {items.map((item) => (
              <UploadedFile
                key={item.id}
                item={item}
                title={heading}
                canRemove={editable}
                onRemoved={(id) => update((prev) => prev.filter((i) => i.id !== id))}
              />
            ))}
          </ul>
        </div>
      )}
      {editable && !showDashboard && (
        <div>
          <button type="button" className="btn-secondary" onClick={() => setExpanded(true)}>
            {photoOnly ? 'Add another photo' : 'Add another file'}
          </button>
        </div>
      )}
    </section>
  );
}
