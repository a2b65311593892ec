// Server-only helpers for API endpoints: one JSON error shape, one body parser.
import type { APIContext } from 'astro';
import type { ZodType, ZodTypeDef } from 'zod';
import { zodIssuesToFields } from '@/lib/schemas/checklist';
import { isDatabaseUnavailable } from './db-errors.server';

/** Seconds a client should wait before trying again after a 503. */
export const RETRY_AFTER_SECONDS = 10;
import { readCappedText } from './body-limit.server';

export type ErrorCode =
  | 'bad_request'
  | 'unauthenticated'
  | 'forbidden'
  | 'not_found'
  | 'conflict'
  | 'length_required'
  | 'payload_too_large'
  | 'unsupported_media_type'
  | 'invalid'
  | 'rate_limited'
  | 'unavailable'
  | 'internal';

/** Thrown anywhere in an endpoint; `api()` turns it into the JSON error response. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly fields?: Record<string, string>,
    readonly extra?: Record<string, unknown>,
  ) {
    super(message);
  }
}

/** `{ "error": { code, message, fields? } }` — the one error shape of the API. */
export function errorResponse(err: HttpError): Response {
  const body = { error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}), ...err.extra } };
  // RFC 9110 §10.2.3: a 503 says when to come back.
  return json(body, err.status, err.status === 503 ? { 'Retry-After': String(err.extra?.retryAfter ?? RETRY_AFTER_SECONDS) } : {});
}

/** Set by src/pages/500.astro when the database was the trouble; src/middleware.ts makes that page a 503. */
export const UNAVAILABLE_HEADER = 'x-groundwork-unavailable';

/** The 503 an unreachable or timed-out database becomes. */
export const databaseUnavailable = () =>
  new HttpError(503, 'unavailable', 'We are having trouble reaching our database. Your answers are safe: please try again in a minute.', undefined, {
    retryAfter: RETRY_AFTER_SECONDS,
  });

export function json(data: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(data), {
    status,
    headers: { 'Content-Type': 'application/json; charset=utf-8', 'Cache-Control': 'no-store', ...headers },
  });
}

/**
 * Wraps an endpoint so thrown HttpErrors answer in the JSON error shape.
 * @example export const GET = api(async (ctx) => json(await listCases(requireUser(ctx))));
 */
export function api(handler: (ctx: APIContext) => Promise<Response>) {
  return async (ctx: APIContext): Promise<Response> => {
    try {
      return await handler(ctx);
    } catch (err) {
      if (err instanceof HttpError) return errorResponse(err);
      if (isDatabaseUnavailable(err)) {
        // The driver's own message, never Drizzle's wrapper: that one lists the query's parameters (answers).
        const root = rootCause(err);
        console.warn(`[db] unavailable: ${root.code ?? ''} ${root.message ?? ''}`.trim());
        return errorResponse(databaseUnavailable());
      }
      console.error(err);
      return errorResponse(new HttpError(500, 'internal', 'Something went wrong on our side. Please try again.'));
    }
  };
}

/** Reads a JSON body and parses it with the shared zod schema: 400 if not JSON, 422 with fields if invalid. */
export async function parseJsonBody<T>(request: Request, schema: ZodType<T, ZodTypeDef, unknown>): Promise<T> {
  const type = request.headers.get('content-type') ?? '';
  if (!type.includes('application/json')) {
    throw new HttpError(415, 'unsupported_media_type', 'Send the body as JSON (Content-Type: application/json).');
  }
  // Read through the cap, never whole: see body-limit.server.ts.
  const text = await readCappedText(request);
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw new HttpError(400, 'bad_request', 'The request body is not valid JSON.');
  }
  const parsed = schema.safeParse(raw);
  if (!parsed.success) {
    throw new HttpError(422, 'invalid', 'Some answers need fixing before they can be saved.', zodIssuesToFields(parsed.error));
  }
  return parsed.data;
}

function rootCause(err: unknown): { code?: string; message?: string } {
  let e = err as { cause?: unknown; code?: string; message?: string };
  for (let i = 0; e?.cause && i < 5; i++) e = e.cause as typeof e;
  return { code: e?.code, message: e?.message };
}

export const notFound = (what = 'That') => new HttpError(404, 'not_found', `${what} was not found.`);
