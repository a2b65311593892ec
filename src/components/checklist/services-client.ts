// The browser's side of the two optional hosted services: the registration look-up and the
// text-message opt-in. Each answers an outcome the form can act on, never throws.

export type LookupVehicle = { registration: string; make: string | null; makeWords: string | null; colour: string | null; fuelType: string | null; yearOfManufacture: number | null };
export type LookupOutcome = { kind: 'found'; vehicle: LookupVehicle; advice: string | null } | { kind: 'not_found' } | { kind: 'unavailable' } | { kind: 'off' } | { kind: 'limited' };

export type TextsView = { enabled: boolean; consented: boolean; mobile: string | null; consentedAt: string | null; withdrawnAt: string | null };
export type TextsOutcome = { kind: 'ok'; view: TextsView } | { kind: 'invalid'; fields: Record<string, string> } | { kind: 'failed'; message: string };

async function call(method: string, url: string, body?: unknown, timeoutMs = 8000): Promise<{ status: number; body: any } | null> {
  try {
    const res = await fetch(url, {
      method,
      credentials: 'same-origin',
      headers: { Accept: 'application/json', ...(body === undefined ? {} : { 'Content-Type': 'application/json' }) },
      body: body === undefined ? undefined : JSON.stringify(body),
      signal: AbortSignal.timeout(timeoutMs),
    });
    return { status: res.status, body: await res.json().catch(() => null) };
  } catch {
    return null;
  }
}

/** @example const r = await lookupVehicle(caseId, 'GW29 EVA'); if (r.kind === 'found') fill(r.vehicle.makeWords); */
export async function lookupVehicle(caseId: string, registration: string): Promise<LookupOutcome> {
  const r = await call('POST', `/api/cases/${encodeURIComponent(caseId)}/vehicle-lookup`, { registration });
  if (!r) return { kind: 'unavailable' };
  if (r.status === 429) return { kind: 'limited' };
  if (r.status !== 200) return { kind: 'unavailable' };
  if (r.body?.status === 'found') return { kind: 'found', vehicle: r.body.vehicle, advice: r.body.advice ?? null };
  if (r.body?.status === 'not_found') return { kind: 'not_found' };
  if (r.body?.status === 'off') return { kind: 'off' };
  return { kind: 'unavailable' };
}

const textsPath = (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/texts`;

function textsOutcome(r: { status: number; body: any } | null): TextsOutcome {
  if (!r) return { kind: 'failed', message: 'We couldn’t reach Groundwork. Please check your connection and try again.' };
  if (r.status === 200) return { kind: 'ok', view: r.body as TextsView };
  if (r.status === 422 && r.body?.error?.fields) return { kind: 'invalid', fields: r.body.error.fields };
  return { kind: 'failed', message: r.body?.error?.message ?? 'Something went wrong on our side. Please try again.' };
}

export const loadTexts = async (caseId: string) => textsOutcome(await call('GET', textsPath(caseId)));
export const agreeToTexts = async (caseId: string, mobile: string) => textsOutcome(await call('PUT', textsPath(caseId), { mobile, agree: true }));
export const stopTexts = async (caseId: string) => textsOutcome(await call('DELETE', textsPath(caseId)));
