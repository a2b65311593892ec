// Browser-side calls to the office API. Each answers with an outcome the island can act on
// (ok with data, or the API's one error shape) instead of throwing on a 4xx.

/** The API's error body: `{ error: { code, message, fields?, ...extra } }`. */
export type ApiError = {
  code: string;
  message: string;
  fields?: Record<string, string>;
  [extra: string]: unknown;
};

export type ApiResult<T> = { ok: true; status: number; data: T } | { ok: false; status: number; error: ApiError };

const offline: ApiError = { code: 'network', message: 'Could not reach Groundwork. Check the connection and try again.' };

/**
 * Sends one JSON request and reads the JSON answer.
 * @example const r = await apiCall<{ items: Note[] }>('GET', `/api/cases/${id}/notes`); if (r.ok) setNotes(r.data.items);
 */
export async function apiCall<T>(method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE', url: string, body?: unknown, signal?: AbortSignal): Promise<ApiResult<T>> {
  let res: Response;
  try {
    res = await fetch(url, {
      method,
      signal,
      headers: { Accept: 'application/json', ...(body === undefined ? {} : { 'Content-Type': 'application/json' }) },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch (err) {
    if ((err as Error).name === 'AbortError') throw err;
    return { ok: false, status: 0, error: offline };
  }
  const parsed = (await res.json().catch(() => null)) as unknown;
  if (res.ok) return { ok: true, status: res.status, data: parsed as T };
  if (res.status === 401) return { ok: false, status: 401, error: { code: 'unauthenticated', message: 'Your session has ended. Please sign in again.' } };
  const error = (parsed as { error?: ApiError } | null)?.error;
  return { ok: false, status: res.status, error: error?.message ? error : { code: 'internal', message: `Something went wrong (HTTP ${res.status}). Please try again.` } };
}
