// Server-only: text messages about a case — the customer's consent, sending with a log row
// written first, delivery receipts and STOP replies. Off (and harmless) when the SMS provider's
// variables are unset: every function then answers "not sent" and the webhooks 404.
import { and, desc, eq, isNull, or, sql } from 'drizzle-orm';
import { textConsents, textLog } from '@/db/schema';
import { redactLinks, isStopReply, textDecision, type TextConsent, type TextDecision } from '@/lib/text-rules';
import { audit } from './audit.server';
import { config } from './config.server';
import { db } from './db.server';
import { HttpError } from './http';
import { hourInGb, reminderSettings } from './settings.server';
import type { SmsGateway, TextEvent } from './sms/gateway';
import { vonageGateway } from './sms/vonage.server';

let gateway: SmsGateway | null | undefined;

const isUuid = (v: string | null): boolean => v !== null && /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(v);

/** The configured gateway, or null when texts are switched off. */
export function smsGateway(): SmsGateway | null {
  if (gateway === undefined) {
    const sms = config.sms;
    gateway = sms ? vonageGateway({ ...sms, statusUrl: `${config.appUrl}/api/sms/status` }) : null;
  }
  return gateway;
}

export const textsEnabled = () => smsGateway() !== null;

/** The customer's consent row, or null if they never opted in. */
export async function textConsentOf(userId: string): Promise<TextConsent> {
  const [row] = await db().select().from(textConsents).where(eq(textConsents.userId, userId));
  return row ? { mobile: row.mobile, consentedAt: row.consentedAt, withdrawnAt: row.withdrawnAt } : null;
}

/** What the checklist and the office show about texts for one customer. */
export async function textConsentView(userId: string) {
  const consent = await textConsentOf(userId);
  return {
    enabled: textsEnabled(),
    consented: Boolean(consent && !consent.withdrawnAt),
    mobile: consent?.mobile ?? null,
    consentedAt: consent?.consentedAt.toISOString() ?? null,
    withdrawnAt: consent?.withdrawnAt?.toISOString() ?? null,
  };
}

/** The customer says yes to texts on this mobile; the time is stored with it. */
export async function giveTextConsent(userId: string, caseId: string, mobile: string) {
  if (!textsEnabled()) throw new HttpError(409, 'conflict', 'Text messages are not switched on for this installer.');
  const now = new Date();
  await db()
    .insert(textConsents)
    .values({ userId, mobile, consentedAt: now })
    .onConflictDoUpdate({ target: textConsents.userId, set: { mobile, consentedAt: now, withdrawnAt: null, withdrawnVia: null } });
  await audit(db(), { caseId, actorId: userId, action: 'texts.consented', entity: 'user', entityId: userId, after: { mobile, consentedAt: now.toISOString() } });
  return textConsentView(userId);
}

/** Withdraws consent now; `via` says how (the checklist, or a STOP reply). */
export async function withdrawTextConsent(userId: string, via: 'checklist' | 'stop', caseId: string | null, actorId: string | null) {
  const now = new Date();
  const changed = await db()
    .update(textConsents)
    .set({ withdrawnAt: now, withdrawnVia: via })
    .where(and(eq(textConsents.userId, userId), isNull(textConsents.withdrawnAt)))
    .returning({ mobile: textConsents.mobile });
  if (changed.length > 0) {
    await audit(db(), { caseId, actorId, action: 'texts.withdrawn', entity: 'user', entityId: userId, after: { via, withdrawnAt: now.toISOString() } });
  }
  return textConsentView(userId);
}

/** Whether a chase for this customer may also go by text right now, and to which number. */
export async function textDecisionFor(userId: string, now = new Date()): Promise<TextDecision> {
  const s = await reminderSettings();
  return textDecision({ enabled: textsEnabled(), consent: await textConsentOf(userId), hour: hourInGb(now), fromHour: s.sendFromHour, untilHour: s.sendUntilHour });
}

/**
 * Sends and logs one text. The log row (with links redacted) is written first; with a dedupeKey
 * it is unique, so a retried reminder job can never text twice.
 * @returns false when the dedupeKey was already used and nothing was sent.
 */
export async function sendCaseText(input: { caseId: string; userId: string; kind: string; mobile: string; text: string; sentById: string | null; dedupeKey?: string }): Promise<boolean> {
  const sms = smsGateway();
  if (!sms) return false;
  const [row] = await db()
    .insert(textLog)
    .values({
      caseId: input.caseId,
      userId: input.userId,
      kind: input.kind,
      mobile: input.mobile,
      text: redactLinks(input.text),
      sentById: input.sentById,
      dedupeKey: input.dedupeKey ?? null,
    })
    .onConflictDoNothing({ target: textLog.dedupeKey })
    .returning({ id: textLog.id });
  if (!row) return false;
  try {
    const { providerId } = await sms.send({ to: input.mobile, text: input.text, reference: row.id });
    // A receipt that arrived first has already set a later status: keep it.
    await db()
      .update(textLog)
      .set({ providerId, status: sql`case when ${textLog.status} = 'queued' then 'submitted' else ${textLog.status} end`, statusAt: sql`coalesce(${textLog.statusAt}, now())` })
      .where(eq(textLog.id, row.id));
    return true;
  } catch (err) {
    // The e-mail has gone; a text the provider refused is history with its reason, not a crash.
    const detail = err instanceof Error ? err.message.slice(0, 200) : 'not accepted';
    await db().update(textLog).set({ status: 'failed', statusDetail: detail, statusAt: new Date() }).where(eq(textLog.id, row.id));
    return false;
  }
}

/** Applies a verified delivery receipt or reply. STOP withdraws every consent on that mobile at once. */
export async function applyTextEvent(event: TextEvent): Promise<{ applied: boolean }> {
  if (event.type === 'status') {
    const updated = await db()
      .update(textLog)
      .set({ providerId: event.providerId, status: event.status, statusDetail: event.detail, statusAt: new Date() })
      .where(and(eq(textLog.direction, 'outbound'), isUuid(event.reference) ? or(eq(textLog.providerId, event.providerId), eq(textLog.id, event.reference!)) : eq(textLog.providerId, event.providerId)))
      .returning({ id: textLog.id });
    return { applied: updated.length > 0 };
  }
  const holders = await db()
    .select({ userId: textConsents.userId })
    .from(textConsents)
    .where(eq(textConsents.mobile, event.from));
  const stop = isStopReply(event.text);
  for (const { userId } of holders) {
    // The reply is kept on the customer's latest text, so it shows in that case's history.
    const [last] = await db()
      .select({ caseId: textLog.caseId })
      .from(textLog)
      .where(and(eq(textLog.userId, userId), eq(textLog.direction, 'outbound')))
      .orderBy(desc(textLog.createdAt))
      .limit(1);
    await db().insert(textLog).values({
      caseId: last?.caseId ?? null,
      userId,
      direction: 'inbound',
      kind: stop ? 'stop' : 'reply',
      mobile: event.from,
      text: redactLinks(event.text.slice(0, 500)),
      providerId: event.providerId,
      status: 'received',
      statusAt: new Date(),
    });
    if (stop) await withdrawTextConsent(userId, 'stop', last?.caseId ?? null, null);
  }
  return { applied: holders.length > 0 };
}

/** Reads a webhook through the gateway: 404 when texts are off, 401 when the signature fails. */
export function readTextWebhook(kind: 'status' | 'inbound', params: Record<string, string>): TextEvent {
  const sms = smsGateway();
  if (!sms) throw new HttpError(404, 'not_found', 'Text messages are not switched on.');
  const event = sms.readWebhook(kind, params);
  if (!event) throw new HttpError(401, 'unauthenticated', 'The signature on this request does not verify.');
  return event;
}
