// Server-only: what Groundwork needs from an SMS provider, so the rest of the app never names one.

/** Provider-neutral delivery states, as the message history shows them. */
export type TextStatus = 'queued' | 'submitted' | 'delivered' | 'failed' | 'rejected' | 'expired' | 'received';

/** A delivery receipt or inbound reply, already checked to come from the provider. */
export type TextEvent =
  | { type: 'status'; providerId: string; reference: string | null; status: TextStatus; detail: string | null }
  | { type: 'inbound'; providerId: string; from: string; text: string };

export interface SmsGateway {
  /** Sends one text to an E.164 number; resolves with the provider's message id. */
  send(input: { to: string; text: string; reference: string }): Promise<{ providerId: string }>;
  /**
   * Reads a webhook's parameters: null when the signature does not verify or the request is
   * stale, so a forged STOP or receipt changes nothing.
   */
  readWebhook(kind: 'status' | 'inbound', params: Record<string, string>, now?: Date): TextEvent | null;
}
