// Several upload slots fed by one list request: the "Photos and documents" page, or any step
// that asks for more than one kind.
import { useEffect, useState } from 'react';
import { uploadKinds, type UploadItem, type UploadKind } from '@/lib/schemas/uploads';
import { fetchUploads } from './api';
import UploadSlot from './upload-slot';

export type UploadListProps = {
  caseId: string;
  /** The kinds to show, in this order; defaults to every kind. */
  kinds?: readonly UploadKind[];
  /** The kinds the answers call for (requiredUploadKinds). */
  required?: readonly UploadKind[];
  /** Every upload of the case, when the page already has them; otherwise loaded here. */
  initialItems?: UploadItem[];
  editable?: boolean;
  onChange?: (kind: UploadKind, items: UploadItem[]) => void;
};

/**
 * One slot per kind, loaded with a single request.
 * @example <UploadList caseId={caseId} kinds={['meter_photo', 'cutout_photo']} required={['meter_photo', 'cutout_photo']} />
 */
export default function UploadList({ caseId, kinds = uploadKinds, required = [], initialItems, editable = true, onChange }: UploadListProps) {
  const [items, setItems] = useState<UploadItem[] | null>(initialItems ?? null);
  const [error, setError] = useState<string | null>(null);

  useEffect(() => {
    if (initialItems) return;
    let live = true;
    fetchUploads(caseId).then(
      (loaded) => live && setItems(loaded),
      (err: Error) => live && setError(err.message),
    );
    return () => {
      live = false;
    };
  }, [caseId, initialItems]);

  if (error) {
    return (
      <p role="alert" className="card font-semibold text-blocked">
        {error}
      </p>
    );
  }
  if (!items) {
    return (
      <p role="status" className="card text-ground-800">
        Loading your photos and documents…
      </p>
    );
  }
  return (
    // data-early-answers: a file chosen before hydration is kept and sent (see DropZone).
    <div className="grid items-start gap-4 lg:grid-cols-2" data-early-answers="">
      {kinds.map((kind) => (
        <UploadSlot
          key={kind}
          caseId={caseId}
          kind={kind}
          required={required.includes(kind)}
          initialItems={items.filter((item) => item.kind === kind)}
          editable={editable}
          onChange={onChange ? (next) => onChange(kind, next) : undefined}
        />
      ))}
    </div>
  );
}
