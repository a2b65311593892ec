// Browser-side calls to the uploads API, with the server's own messages passed through.
import type { UploadItem, UploadKind } from '@/lib/schemas/uploads';

/** The message of an API error body (`{ error: { message } }`), or a fallback. */
export function errorMessageOf(body: unknown, fallback: string): string {
  const message = (body as { error?: { message?: unknown } } | null)?.error?.message;
  return typeof message === 'string' && message ? message : fallback;
}

/**
 * The case's uploads, optionally of one kind.
 * @example const items = await fetchUploads(caseId, 'cutout_photo');
 */
export async function fetchUploads(caseId: string, kind?: UploadKind): Promise<UploadItem[]> {
  const query = kind ? `?kind=${encodeURIComponent(kind)}` : '';
  const res = await fetch(`/api/cases/${caseId}/uploads${query}`, { headers: { Accept: 'application/json' } });
  const body = await res.json().catch(() => null);
  if (!res.ok) throw new Error(errorMessageOf(body, 'We could not load your files. Please refresh the page.'));
  return (body as { items: UploadItem[] }).items;
}

/** Removes one upload; throws with the server's message (e.g. once the office has accepted it). */
export async function removeUpload(id: string): Promise<void> {
  const res = await fetch(`/api/uploads/${id}`, { method: 'DELETE', headers: { Accept: 'application/json' } });
  if (!res.ok) {
    const body = await res.json().catch(() => null);
    throw new Error(errorMessageOf(body, 'We could not remove that file. Please try again.'));
  }
}
