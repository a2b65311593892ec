// The browser's side of the case API: one function per call, each answering with an outcome the
// form can act on rather than throwing (a save that fails is normal on a phone signal).
import type { Checklist, ChecklistPatchInput, SectionId, SectionProgress } from '@/lib/schemas/checklist';
import type { StageId } from '@/lib/stages';

/** A case as GET /api/cases/:id answers it (the client's copy of the server's shape). */
export type CaseView = {
  id: string;
  reference: string;
  stage: StageId;
  version: number;
  checklist: Checklist;
  progress: SectionProgress[];
  /** Details the installer filled in from the invitation, not yet confirmed by the customer. */
  prefilled?: string[];
  warnings: Record<string, string>;
  region: string | null;
  editable: boolean;
  submittedAt?: string | null;
  updatedAt: string;
};

export type Gap = { section: SectionId; title: string; missing: string[] };

export type LoadOutcome = { kind: 'loaded'; view: CaseView } | { kind: 'not-found' } | { kind: 'signed-out' } | { kind: 'failed' };

export type PatchOutcome =
  | { kind: 'saved'; view: CaseView }
  | { kind: 'invalid'; fields: Record<string, string> }
  | { kind: 'conflict'; current: CaseView }
  | { kind: 'locked'; message: string }
  | { kind: 'signed-out' }
  | { kind: 'failed' };

export type SubmitOutcome =
  | { kind: 'sent'; view: CaseView }
  | { kind: 'gaps'; gaps: Gap[] }
  | { kind: 'already-sent'; message: string }
  | { kind: 'signed-out' }
  | { kind: 'failed'; message: string };

type ErrorBody = {
  error?: { code?: string; message?: string; fields?: Record<string, string>; current?: CaseView; gaps?: Gap[]; reason?: string };
};

async function call(url: string, init: RequestInit): Promise<{ status: number; body: unknown } | null> {
  try {
    const res = await fetch(url, { ...init, credentials: 'same-origin', headers: { Accept: 'application/json', ...init.headers } });
    return { status: res.status, body: await res.json().catch(() => null) };
  } catch {
    return null;
  }
}

const casePath = (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}`;

/** GET the case. @example const r = await loadCase(id); if (r.kind === 'loaded') show(r.view); */
export async function loadCase(caseId: string): Promise<LoadOutcome> {
  const r = await call(casePath(caseId), { method: 'GET', cache: 'no-store' });
  if (!r) return { kind: 'failed' };
  if (r.status === 200) return { kind: 'loaded', view: r.body as CaseView };
  if (r.status === 404) return { kind: 'not-found' };
  if (r.status === 401) return { kind: 'signed-out' };
  return { kind: 'failed' };
}

/**
 * PATCH some answers, guarded by the version the form last saw (If-Match).
 *
 * @example await patchChecklist(id, { supply: { mpanCore: '1312345678907' } }, 4) // { kind: 'saved', view }
 */
export async function patchChecklist(caseId: string, patch: ChecklistPatchInput, version: number): Promise<PatchOutcome> {
  const r = await call(`${casePath(caseId)}/checklist`, {
    method: 'PATCH',
    headers: { 'Content-Type': 'application/json', 'If-Match': String(version) },
    body: JSON.stringify(patch),
    // A save started as the tab closes or reloads still reaches the server.
    keepalive: true,
  });
  if (!r) return { kind: 'failed' };
  const error = (r.body as ErrorBody | null)?.error;
  if (r.status === 200) return { kind: 'saved', view: r.body as CaseView };
  if (r.status === 422 && error?.fields) return { kind: 'invalid', fields: error.fields };
  if (r.status === 409 && error?.current) return { kind: 'conflict', current: error.current };
  if (r.status === 409) return { kind: 'locked', message: error?.message ?? 'This checklist can no longer be changed.' };
  if (r.status === 401) return { kind: 'signed-out' };
  return { kind: 'failed' };
}

/** POST the case for review; with gaps, only once the customer has seen them. */
export async function submitCase(caseId: string, acknowledgeGaps: boolean): Promise<SubmitOutcome> {
  const r = await call(`${casePath(caseId)}/submit`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ acknowledgeGaps }),
  });
  if (!r) return { kind: 'failed', message: 'We couldn’t reach Groundwork. Please check your connection and try again.' };
  const error = (r.body as ErrorBody | null)?.error;
  if (r.status === 200) return { kind: 'sent', view: r.body as CaseView };
  if (r.status === 409 && error?.gaps) return { kind: 'gaps', gaps: error.gaps };
  if (r.status === 409) return { kind: 'already-sent', message: error?.message ?? 'This checklist has already been sent.' };
  if (r.status === 401) return { kind: 'signed-out' };
  return { kind: 'failed', message: error?.message ?? 'Something went wrong on our side. Please try again.' };
}

/** POST "these details from my installer are right". @example await confirmDetails(id, ['about.fullName']) // { kind: 'saved', view } */
export async function confirmDetails(caseId: string, paths: string[]): Promise<PatchOutcome> {
  const r = await call(`${casePath(caseId)}/confirm-details`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ paths }),
  });
  if (!r) return { kind: 'failed' };
  const error = (r.body as ErrorBody | null)?.error;
  if (r.status === 200) return { kind: 'saved', view: r.body as CaseView };
  if (r.status === 409) return { kind: 'locked', message: error?.message ?? 'This checklist can no longer be changed.' };
  if (r.status === 401) return { kind: 'signed-out' };
  return { kind: 'failed' };
}
