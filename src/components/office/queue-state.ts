// The queue's view (filters, sort, page) and its place in the URL, so a view can be
// bookmarked, shared and restored on reload. Pure: no window access here.
import { lights, queueQueryFromParams, type QueueQuery, type QueueSortKey } from '@/lib/schemas/queue';
import type { StageId } from '@/lib/stages';

export type Light = (typeof lights)[number];

export type QueueView = {
  light: Light[];
  stage: StageId[];
  /** A surveyor's id, 'none' for not assigned, or '' for anyone. */
  surveyor: string;
  q: string;
  deliveryWithin: number | null;
  /** Only cases with a photo the check at upload flagged, still waiting for review. */
  photosFlagged: boolean;
  sort: QueueSortKey;
  dir: 'asc' | 'desc';
  page: number;
  pageSize: number;
};

export const defaultView: QueueView = { light: [], stage: [], surveyor: '', q: '', deliveryWithin: null, photosFlagged: false, sort: 'light', dir: 'asc', page: 1, pageSize: 50 };

/**
 * The view a query string describes; an invalid link falls back to the defaults and says so.
 * @example viewFromSearch('?light=red&sort=invited&dir=desc').view.light // ['red']
 */
export function viewFromSearch(search: string): { view: QueueView; invalid: boolean } {
  const parsed = queueQueryFromParams(new URLSearchParams(search));
  if (!parsed.success) return { view: defaultView, invalid: true };
  return { view: fromQuery(parsed.data), invalid: false };
}

function fromQuery(q: QueueQuery): QueueView {
  return {
    light: q.light ?? [],
    stage: q.stage ?? [],
    surveyor: q.surveyor ?? '',
    q: q.q ?? '',
    deliveryWithin: q.deliveryWithin ?? null,
    photosFlagged: q.photos === 'flagged',
    sort: q.sort,
    dir: q.dir,
    page: q.page,
    pageSize: q.pageSize,
  };
}

/**
 * The query string for a view, leaving out defaults so links stay short.
 * @example searchFromView({ ...defaultView, light: ['red', 'amber'] }) // 'light=red%2Camber'
 */
export function searchFromView(view: QueueView, { paging = true } = {}): string {
  const p = new URLSearchParams();
  if (view.light.length) p.set('light', view.light.join(','));
  if (view.stage.length) p.set('stage', view.stage.join(','));
  if (view.surveyor) p.set('surveyor', view.surveyor);
  if (view.q.trim()) p.set('q', view.q.trim());
  if (view.deliveryWithin !== null) p.set('deliveryWithin', String(view.deliveryWithin));
  if (view.photosFlagged) p.set('photos', 'flagged');
  if (view.sort !== defaultView.sort || view.dir !== defaultView.dir) {
    p.set('sort', view.sort);
    p.set('dir', view.dir);
  }
  if (paging && view.page !== 1) p.set('page', String(view.page));
  if (paging && view.pageSize !== defaultView.pageSize) p.set('pageSize', String(view.pageSize));
  return p.toString();
}

/** Whether any filter (not sort or paging) narrows the view. */
export function hasFilters(view: QueueView): boolean {
  return view.light.length > 0 || view.stage.length > 0 || view.surveyor !== '' || view.q.trim() !== '' || view.deliveryWithin !== null || view.photosFlagged;
}

/** The same sort and page size with every filter cleared. */
export function clearFilters(view: QueueView): QueueView {
  return { ...defaultView, sort: view.sort, dir: view.dir, pageSize: view.pageSize };
}

/** Adds or removes one value of a multi-choice filter. */
export function toggle<T>(list: readonly T[], value: T): T[] {
  return list.includes(value) ? list.filter((v) => v !== value) : [...list, value];
}
