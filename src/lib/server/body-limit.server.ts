// Server-only: request bodies are capped before anything buffers them. Astro hands endpoints the
// body as a stream; Auth.js and `request.json()` would read it whole, so a 100 MB POST would sit
// in memory. The middleware refuses a declared length over the cap at once; parseJsonBody reads
// at most the cap while streaming, so a body with no declared length cannot grow past it either.
import { HttpError } from './http';

/** The most a JSON or form body may carry: far above any checklist save (a few KB). */
export const BODY_LIMIT_BYTES = 1024 * 1024;

/** Routes that stream a larger body themselves, with their own limits (uploads: busboy). */
const STREAMING_ROUTES = new Set(['/api/cases/[id]/uploads']);

const tooLarge = () =>
  new HttpError(413, 'payload_too_large', `The request is larger than ${BODY_LIMIT_BYTES / 1024 / 1024} MB, the most this address takes.`);

/**
 * Decides from the headers alone whether a body may be read: a declared length over the cap is
 * 413; a body of unknown length (chunked) is taken only where it is read through a capped
 * stream (JSON endpoints) or by a streaming route, else 411.
 * @example const refusal = bodyRefusal(ctx.request, ctx.routePattern); if (refusal) return errorResponse(refusal);
 */
export function bodyRefusal(request: Request, routePattern: string): HttpError | null {
  if (request.method === 'GET' || request.method === 'HEAD' || !request.body) return null;
  if (STREAMING_ROUTES.has(routePattern)) return null;
  const declared = request.headers.get('content-length');
  if (declared !== null) return Number(declared) > BODY_LIMIT_BYTES ? tooLarge() : null;
  // HTTP/1.1 (RFC 9112 §6.3): with neither Content-Length nor Transfer-Encoding there is no body.
  if (!request.headers.has('transfer-encoding')) return null;
  const type = (request.headers.get('content-type') ?? '').toLowerCase();
  if (type.includes('application/json')) return null;
  return new HttpError(411, 'length_required', 'Send the request with a Content-Length header.');
}

/**
 * Reads a body as text, stopping with 413 as soon as it passes the cap.
 * @example const text = await readCappedText(request);
 */
export async function readCappedText(request: Request, limit = BODY_LIMIT_BYTES): Promise<string> {
  if (!request.body) return '';
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limit) {
      await reader.cancel().catch(() => {});
      throw tooLarge();
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks).toString('utf8');
}
