// One upload slot: what to photograph (one line), a drop zone, then the files already sent with
// their review status and Remove. The drop zone starts as plain HTML (drop, choose a file, take
// a photo); the Uppy widget (upload-widget.tsx: progress bar per file, Retry, resizing) loads
// only once the customer uses it, so a page full of slots stays light on a phone.
import { useEffect, useMemo, useRef, useState, type DragEvent } from 'react';
import { uploadKindInfo, type UploadItem, type UploadKind } from '@/lib/schemas/uploads';
import { uploadKindStatus } from '@/lib/readiness/upload-status';
import { slotCaution } from '@/lib/cautions';
import { fetchUploads, removeUpload } from './api';
import { goodPhotoAdvice } from '@/lib/photo-quality';
import { GoodPhotoPicture } from './good-photo-picture';
import { allowedFileTypes, limitsLine } from './upload-types';
import type { SlotUppy } from './upload-widget';
import { AcceptedIcon, CameraIcon, ClockIcon, InfoIcon, MissingIcon, NotAcceptedIcon, StopIcon, WarningIcon } from '@/components/icons';
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

type WidgetModule = typeof import('./upload-widget');
type Widget = { uppy: SlotUppy; mod: WidgetModule };

let widgetModule: Promise<WidgetModule> | null = null;
/** The Uppy widget's module, fetched once per page whichever slot asks first. */
function loadWidget(): Promise<WidgetModule> {
  widgetModule ??= import('./upload-widget').catch((err) => {
    widgetModule = null;
    throw err;
  });
  return widgetModule;
}

/**
 * The drop zone before Uppy is loaded: the same three ways in (drop, choose, camera), in plain
 * HTML. Pressing it, dragging over it or picking a file loads the widget.
 */
function DropZone({ kind, photoOnly, touch, opening, onOpen }: { kind: UploadKind; photoOnly: boolean; touch: boolean; opening: boolean; onOpen: (files?: File[]) => void }) {
  const picked = (input: HTMLInputElement) => {
    const files = [...(input.files ?? [])];
    input.value = '';
    if (files.length) onOpen(files);
  };
  // The zone is drawn on the server, so a photo can be chosen before the page's script has run:
  // it waits in its input, and is sent from here as soon as the slot comes alive.
  const inputs = useRef<HTMLDivElement>(null);
  useEffect(() => {
    for (const input of inputs.current?.querySelectorAll<HTMLInputElement>('input[type="file"]') ?? []) {
      if (input.files?.length) picked(input);
    }
    // Once, on hydration: later choices arrive through onChange.
  }, []);
  const stop = (event: DragEvent) => {
    event.preventDefault();
    event.stopPropagation();
  };
  return (
    <div
      className={`flex ${touch ? 'h-[230px]' : 'h-[160px]'} flex-col items-center justify-center gap-3 rounded-lg border-2 border-dashed border-ground-300 bg-paper p-4 text-center`}
      data-testid="drop-zone"
      aria-busy={opening}
      onClick={(event) => event.target === event.currentTarget && onOpen()}
      onDragEnter={(event) => {
        stop(event);
        onOpen();
      }}
      onDragOver={stop}
      onDrop={(event) => {
        stop(event);
        onOpen([...event.dataTransfer.files]);
      }}
    >
      {opening ? (
        <p className="font-semibold text-ground-800" role="status">Getting the uploader ready…</p>
      ) : (
        <>
          <p className="font-semibold text-ink">{touch ? (photoOnly ? 'Add a photo' : 'Add a photo or a PDF') : photoOnly ? 'Drop a photo here, or' : 'Drop a photo or PDF here, or'}</p>
          <div ref={inputs} className="flex flex-wrap justify-center gap-2">
            <label className="btn-secondary cursor-pointer focus-within:ring-2 focus-within:ring-ground-600">
              {photoOnly ? 'Choose a photo' : 'Choose a file'}
              <input
                type="file"
                name="files[]"
                multiple
                accept={allowedFileTypes(kind).join(',')}
                className="sr-only"
                onChange={(event) => picked(event.currentTarget)}
              />
            </label>
            {touch && photoOnly && (
              <label className="btn-secondary cursor-pointer focus-within:ring-2 focus-within:ring-ground-600">
                Take a photo
                <input type="file" name="camera-photo" accept="image/*" capture="environment" className="sr-only" onChange={(event) => picked(event.currentTarget)} />
              </label>
            )}
          </div>
        </>
      )}
    </div>
  );
}

/**
 * What the photo check found on the photo just sent, in plain words, beside a drawing of what a
 * good one looks like, with Take again (the new photo replaces this one once it has arrived) and Keep this one (the
 * office decides). The check advises; nothing is refused.
 */
function PhotoCheck({ item, kind, touch, onRetake, onKeep }: { item: UploadItem; kind: UploadKind; touch: boolean; onRetake: (file: File) => void; onKeep: () => void }) {
  const problems = item.quality?.problems ?? [];
  const headingId = `photo-check-${item.id}`;
  return (
    <div className="rounded-lg border-2 border-attention/40 bg-attention-soft p-3" role="region" aria-labelledby={headingId} data-testid="photo-check">
      <p id={headingId} className="flex items-center gap-2 font-bold text-ink">
        <WarningIcon className="h-5 w-5 text-attention" />
        This photo may be hard to read
      </p>
      <ul className="mt-1 list-disc pl-6 text-ink" data-testid="photo-problems">
        {problems.map((p) => (
          <li key={p.code} data-code={p.code}>{p.message}</li>
        ))}
      </ul>
      <div className="mt-3 flex items-start gap-3">
        <GoodPhotoPicture kind={kind} />
        <p className="text-sm text-ink">
          <span className="font-semibold">A good photo: </span>
          {goodPhotoAdvice[kind]}
        </p>
      </div>
      <div className="mt-3 flex flex-wrap gap-2">
        <label className="btn-primary cursor-pointer focus-within:ring-2 focus-within:ring-ground-600">
          <CameraIcon className="h-5 w-5" />
          Take again
          <input
            type="file"
            name="retake"
            accept="image/*"
            {...(touch ? { capture: 'environment' } : {})}
            className="sr-only"
            data-testid="retake-input"
            onChange={(event) => {
              const file = event.currentTarget.files?.[0];
              event.currentTarget.value = '';
              if (file) onRetake(file);
            }}
          />
        </label>
        <button type="button" className="btn-secondary" onClick={onKeep}>
          Keep this one
        </button>
      </div>
      <p className="mt-2 text-xs text-ground-800">Keeping it is fine: your installer will look at it and ask again only if they need to.</p>
    </div>
  );
}

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
  const [widget, setWidget] = useState<Widget | null>(null);
  const [opening, setOpening] = useState(false);
  const widgetRef = useRef<Widget | null>(null);
  const [touch, setTouch] = useState(false);
  const [expanded, setExpanded] = useState(false);
  const [busy, setBusy] = useState(false);
  // The photo just sent, while the customer decides on what the photo check found.
  const [checking, setChecking] = useState<UploadItem | null>(null);
  // The flagged photo a retake replaces: removed once the new one has arrived, never before.
  const replaceRef = useRef<string | null>(null);
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

  useEffect(() => {
    setTouch(window.matchMedia?.('(pointer: coarse)').matches ?? false);
    return () => {
      widgetRef.current?.uppy.destroy();
      widgetRef.current = null;
    };
  }, []);

  /** Loads the widget (once) and hands it any files already dropped or picked. */
  const open = (files: File[] = []) => {
    if (!editable) return;
    const add = (w: Widget) => {
      if (files.length === 0) return;
      try {
        w.uppy.addFiles(files.map((data) => ({ source: 'drop-zone', name: data.name, type: data.type, data })));
      } catch (err) {
        setSendError((err as Error).message);
      }
    };
    if (widgetRef.current) return add(widgetRef.current);
    setOpening(true);
    loadWidget().then(
      (mod) => {
        if (!widgetRef.current) {
          const uppy = mod.createUppy(caseId, kind);
          uppy.on('upload-success', (file, response) => {
            const item = response.body as unknown as UploadItem;
            setSendError(null);
            update((prev) => [...prev.filter((i) => i.id !== item.id), item]);
            setChecking(item.quality && !item.quality.ok ? item : null);
            const replaced = replaceRef.current;
            if (replaced && replaced !== item.id) {
              replaceRef.current = null;
              removeUpload(replaced).then(
                () => update((prev) => prev.filter((i) => i.id !== replaced)),
                (err: Error) => setSendError(err.message),
              );
            }
            // Leave "Sent" in view for a moment, then clear the Dashboard for the next photo.
            if (file) setTimeout(() => uppy.getFile(file.id) && uppy.removeFile(file.id), 1500);
          });
          uppy.on('upload-error', (_file, error) => setSendError(error.message));
          uppy.on('restriction-failed', (_file, error) => setSendError(error.message));
          uppy.on('file-added', () => {
            setSendError(null);
            setBusy(true);
          });
          // Keep the Dashboard open while it holds files (sending, sent, or failed and waiting for Retry).
          uppy.on('file-removed', () => setBusy(uppy.getFiles().length > 0));
          uppy.on('cancel-all', () => setBusy(false));
          widgetRef.current = { uppy, mod };
          setWidget(widgetRef.current);
        }
        setOpening(false);
        add(widgetRef.current);
      },
      () => {
        setOpening(false);
        setSendError('The uploader did not load. Please check your connection and try again.');
      },
    );
  };

  /** Take again: the new photo is sent, and the flagged one is removed once it has arrived. */
  const retake = (flagged: UploadItem, file: File) => {
    replaceRef.current = flagged.id;
    setChecking(null);
    open([file]);
  };

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
      {slotCaution(kind) && (
        <p className="flex items-start gap-2 text-sm text-ground-800" data-testid="slot-caution">
          <StopIcon className="mt-0.5 h-5 w-5 text-clay-600" />
          <span>{slotCaution(kind)}</span>
        </p>
      )}

      {showDashboard && (
        <div className="gw-uppy" aria-describedby={ids.hint}>
          {widget ? (
            <widget.mod.Dashboard
              uppy={widget.uppy}
              height={touch ? 230 : 160}
              width="100%"
              theme="light"
              proudlyDisplayPoweredByUppy={false}
              showProgressDetails
              hideProgressAfterFinish
              showRemoveButtonAfterComplete={false}
              doneButtonHandler={null}
              showNativePhotoCameraButton={touch && photoOnly}
              nativeCameraFacingMode="environment"
              fileManagerSelectionType="files"
              locale={widget.mod.dashboardStrings(photoOnly)}
            />
          ) : (
            <DropZone kind={kind} photoOnly={photoOnly} touch={touch} opening={opening} onOpen={open} />
          )}
          <p className="mt-1 text-sm text-ground-700">{limitsLine(kind)}.</p>
        </div>
      )}

      {checking && (
        <PhotoCheck
          item={checking}
          kind={kind}
          touch={touch}
          onRetake={(file) => retake(checking, file)}
          onKeep={() => setChecking(null)}
        />
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
                showFlag={checking?.id !== item.id}
                onRemoved={(id) => {
                  if (checking?.id === id) setChecking(null);
                  update((prev) => prev.filter((i) => i.id !== id));
                }}
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
