// Server-only: the parameters of a provider's webhook, from the query (GET) or a JSON body
// (POST-JSON, the setting to choose in the provider's dashboard). Values become strings, as signed.
import { z } from 'zod';
import { HttpError, parseJsonBody } from '@/lib/server/http';

const paramsSchema = z.record(z.union([z.string(), z.number(), z.boolean()]).transform(String));

/** @example const params = await webhookParams(ctx.request); // { msisdn: '447…', text: 'STOP', sig: '…' } */
export async function webhookParams(request: Request): Promise<Record<string, string>> {
  if (request.method === 'GET') return Object.fromEntries(new URL(request.url).searchParams);
  const params = await parseJsonBody(request, paramsSchema);
  if (Object.keys(params).length > 50) throw new HttpError(422, 'invalid', 'Too many parameters for a text message webhook.');
  return params;
}
