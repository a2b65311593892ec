// Server-only: the SMS gateway through Vonage's official Node SDK (@vonage/sms, the SMS API).
// `restHost` points the SDK at the local fake in development and tests (docs/decisions/008).
import { Auth, AlgorithmTypes } from '@vonage/auth';
import { SMS } from '@vonage/sms';
import type { SmsGateway, TextEvent, TextStatus } from './gateway';

export type VonageSettings = { apiKey: string; apiSecret: string; signatureSecret: string; signatureMethod: string; from: string; restHost?: string; statusUrl: string };

const ALGORITHMS: Record<string, AlgorithmTypes> = {
  md5hash: AlgorithmTypes.md5hash,
  md5: AlgorithmTypes.md5hmac,
  sha1: AlgorithmTypes.sha1hmac,
  sha256: AlgorithmTypes.sha256hmac,
  sha512: AlgorithmTypes.sha512hmac,
};

// From memory of the SMS API's delivery receipt documentation: its `status` values.
const RECEIPT_STATUS: Record<string, TextStatus> = {
  accepted: 'submitted',
  buffered: 'submitted',
  delivered: 'delivered',
  expired: 'expired',
  failed: 'failed',
  rejected: 'rejected',
  unknown: 'submitted',
};

// The provider's signing guide asks that a signed request's timestamp be recent, against replay.
const MAX_AGE_SECONDS = 5 * 60;

/**
 * @example const gateway = vonageGateway({ apiKey, apiSecret, signatureSecret, signatureMethod: 'sha256', from: '447700900000', statusUrl });
 */
export function vonageGateway(settings: VonageSettings): SmsGateway {
  const algorithm = ALGORITHMS[settings.signatureMethod.toLowerCase()];
  if (!algorithm) throw new Error(`VONAGE_SIGNATURE_METHOD must be one of ${Object.keys(ALGORITHMS).join(', ')}.`);
  const client = new SMS(new Auth({ apiKey: settings.apiKey, apiSecret: settings.apiSecret }), {
    ...(settings.restHost ? { restHost: settings.restHost } : {}),
    timeout: 10_000,
  });

  function verified(params: Record<string, string>, now: Date): boolean {
    if (typeof params.sig !== 'string' || params.sig === '') return false;
    const timestamp = Number(params.timestamp);
    if (!Number.isFinite(timestamp) || Math.abs(now.getTime() / 1000 - timestamp) > MAX_AGE_SECONDS) return false;
    return client.verifySignature(params.sig, params, settings.signatureSecret, algorithm!);
  }

  return {
    async send({ to, text, reference }) {
      const answer = await client.send({
        to: to.replace(/^\+/, ''),
        from: settings.from,
        text,
        clientRef: reference,
        callback: settings.statusUrl,
      });
      const id = answer.messages[0]?.messageId;
      if (!id) throw new Error('The SMS provider accepted the text but gave no message id.');
      return { providerId: id };
    },
    readWebhook(kind, params, now = new Date()): TextEvent | null {
      if (!verified(params, now)) return null;
      if (kind === 'status') {
        if (!params.messageId || !params.status) return null;
        const status = RECEIPT_STATUS[params.status.toLowerCase()] ?? 'submitted';
        const detail = params['err-code'] && params['err-code'] !== '0' ? `error ${params['err-code']}` : null;
        // client-ref is our log row's id, sent with the text: it finds the row even if the receipt beats our own update.
        return { type: 'status', providerId: params.messageId, reference: params['client-ref'] ?? null, status, detail };
      }
      if (!params.messageId || !params.msisdn || typeof params.text !== 'string') return null;
      return { type: 'inbound', providerId: params.messageId, from: `+${params.msisdn.replace(/^\+/, '')}`, text: params.text };
    },
  };
}
