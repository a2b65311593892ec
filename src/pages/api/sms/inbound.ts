import type { APIRoute } from 'astro';
import { api } from '@/lib/server/http';
import { applyTextEvent, readTextWebhook } from '@/lib/server/text-messages.server';
import { webhookParams } from '@/lib/server/sms/webhook.server';

/** GET or POST /api/sms/inbound — a reply to one of our texts (signed); STOP withdraws consent at once. */
const handler: APIRoute = api(async (ctx) => {
  const event = readTextWebhook('inbound', await webhookParams(ctx.request));
  if (event.type !== 'inbound') return new Response(null, { status: 204 });
  await applyTextEvent(event);
  return new Response(null, { status: 204 });
});
export const GET = handler;
export const POST = handler;
