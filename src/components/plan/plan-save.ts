// Saving the plan: PATCH /api/cases/:id/checklist with { charger: { plan } }, guarded by the
// case version (If-Match). Answers with an outcome rather than throwing, since a failed save
// on a phone signal is ordinary.
import type { DrivewayPlan } from '@/lib/readiness/plan';
import type { ChargePort, ChargerPreference, ParkingHabit } from '@/lib/readiness/types';

/** The parts of the case view the plan needs. */
export type PlanCaseView = {
  version: number;
  checklist: {
    vehicle?: { chargePort?: ChargePort | null } | null;
    charger?: { plan?: unknown; preference?: ChargerPreference | null; tetherMetres?: number | null } | null;
    parking?: { habit?: ParkingHabit | null; cars?: number | null } | null;
  };
};

export type PlanSaveOutcome =
  | { kind: 'saved'; view: PlanCaseView }
  | { kind: 'conflict'; current: PlanCaseView }
  | { kind: 'invalid'; message: string }
  | { kind: 'locked'; message: string }
  | { kind: 'signed-out' }
  | { kind: 'failed' };

type ErrorBody = { error?: { message?: string; fields?: Record<string, string>; current?: PlanCaseView } };

/**
 * Sends the whole plan. `keepalive` lets a save started as the tab closes still arrive.
 *
 * @example await savePlan('c1', plan, 3) // { kind: 'saved', view: { version: 4, … } }
 */
export async function savePlan(caseId: string, plan: DrivewayPlan, version: number, keepalive = false): Promise<PlanSaveOutcome> {
  let res: Response;
  try {
    res = await fetch(`/api/cases/${encodeURIComponent(caseId)}/checklist`, {
      method: 'PATCH',
      credentials: 'same-origin',
      keepalive,
      headers: { 'Content-Type': 'application/json', Accept: 'application/json', 'If-Match': String(version) },
      body: JSON.stringify({ charger: { plan } }),
    });
  } catch {
    return { kind: 'failed' };
  }
  const body = (await res.json().catch(() => null)) as (PlanCaseView & ErrorBody) | null;
  const error = body?.error;
  if (res.status === 200 && body && typeof body.version === 'number') return { kind: 'saved', view: body };
  if (res.status === 409 && error?.current) return { kind: 'conflict', current: error.current };
  if (res.status === 409) return { kind: 'locked', message: error?.message ?? 'This case can no longer be changed.' };
  if (res.status === 422) return { kind: 'invalid', message: firstField(error?.fields) ?? error?.message ?? 'Something in the plan could not be saved.' };
  if (res.status === 401) return { kind: 'signed-out' };
  return { kind: 'failed' };
}

function firstField(fields: Record<string, string> | undefined): string | null {
  const first = fields ? Object.values(fields)[0] : undefined;
  return first ?? null;
}

/** Waits before the n-th retry: 2 s, 4 s, 8 s … up to 30 s. @example retryDelayMs(1) // 2000 */
export function retryDelayMs(failures: number): number {
  return Math.min(30_000, 1000 * 2 ** Math.max(1, failures));
}
