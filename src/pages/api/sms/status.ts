import type { APIRoute } from 'astro';
import { api } from '@/lib/server/http';
import { applyTextEvent, readTextWebhook } from '@/lib/server/text-messages.server';
import { webhookParams } from '@/lib/server/sms/webhook.server';

/** GET or POST /api/sms/status — the SMS provider's delivery receipt (signed); updates the message history. */
const handler: APIRoute = api(async (ctx) => {
  await applyTextEvent(readTextWebhook('status', await webhookParams(ctx.request)));
  // The provider retries anything but a 2xx, so a receipt for an unknown message is still taken.
  return new Response(null, { status: 204 });
});
export const GET = handler;
export const POST = handler;
