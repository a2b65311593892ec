import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import http from 'node:http';
import { SMS } from '@vonage/sms';
import { Auth, AlgorithmTypes } from '@vonage/auth';
import { signParams, startSmsServer } from '../../fake-services/sms-server.mjs';

// The fake stands in for the SMS provider, so it is checked against the provider's own SDK:
// the SDK sends through it (restHost) and the SDK's verifySignature accepts what it signs.

let sms: Awaited<ReturnType<typeof startSmsServer>>;
let receiver: http.Server;
let received: Record<string, string>[] = [];
let receiverUrl = '';

beforeAll(async () => {
  receiver = http.createServer((req, res) => {
    let body = '';
    req.on('data', (c) => (body += c));
    req.on('end', () => {
      received.push(JSON.parse(body));
      res.writeHead(204).end();
    });
  });
  await new Promise<void>((r) => receiver.listen(0, '127.0.0.1', () => r()));
  const a = receiver.address();
  receiverUrl = `http://127.0.0.1:${typeof a === 'object' && a ? a.port : 0}/hook`;
  sms = await startSmsServer({ port: 0, quiet: true, receiptDelayMs: 10, inboundUrl: receiverUrl, signatureMethod: 'sha256', signatureSecret: 'shh' });
});

afterAll(async () => {
  await sms?.close();
  receiver?.closeAllConnections();
  await new Promise((r) => receiver?.close(r));
});

const client = () => new SMS(new Auth({ apiKey: 'fake-key', apiSecret: 'fake-secret' }), { restHost: `http://127.0.0.1:${sms.port}` });

describe('fake SMS service', () => {
  it('accepts a text from the SDK, lists it, and sends a signed delivery receipt to its callback', async () => {
    received = [];
    const answer = await client().send({ to: '447400123456', from: '447700900000', text: 'Hello', callback: receiverUrl, clientRef: 'ref-1' });
    const id = answer.messages[0]!.messageId!;
    expect(answer.messages[0]!.status).toBe('0');
    const list = (await (await fetch(`http://127.0.0.1:${sms.port}/api/sms?to=447400123456`)).json()) as { id: string; text: string }[];
    expect(list.find((t) => t.id === id)?.text).toBe('Hello');
    await expect.poll(() => received.length).toBe(1);
    const receipt = received[0]!;
    expect(receipt).toMatchObject({ messageId: id, status: 'delivered', msisdn: '447400123456', 'client-ref': 'ref-1' });
    expect(client().verifySignature(receipt.sig!, receipt, 'shh', AlgorithmTypes.sha256hmac)).toBe(true);
    expect(client().verifySignature(receipt.sig!, { ...receipt, status: 'failed' }, 'shh', AlgorithmTypes.sha256hmac)).toBe(false);
  });

  it('refuses wrong credentials the way the provider does (status 4), which the SDK throws on', async () => {
    const bad = new SMS(new Auth({ apiKey: 'fake-key', apiSecret: 'wrong' }), { restHost: `http://127.0.0.1:${sms.port}` });
    await expect(bad.send({ to: '447400123456', from: '447700900000', text: 'x' })).rejects.toThrow(/failed/);
  });

  it('plays a signed inbound reply with the provider’s fields', async () => {
    received = [];
    const r = await fetch(`http://127.0.0.1:${sms.port}/api/sms/reply`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ from: '+447400123456', text: 'STOP' }) });
    expect((await r.json()).delivered).toBe(204);
    const inbound = received[0]!;
    expect(inbound).toMatchObject({ msisdn: '447400123456', text: 'STOP', keyword: 'STOP', type: 'text' });
    expect(Math.abs(Number(inbound.timestamp) - Date.now() / 1000)).toBeLessThan(60);
    expect(client().verifySignature(inbound.sig!, inbound, 'shh', AlgorithmTypes.sha256hmac)).toBe(true);
  });

  it('signs as the SDK verifies for every method the provider offers, & and = in values included', () => {
    const params = { msisdn: '447400123456', text: 'a&b=c', timestamp: '1', nonce: 'n' };
    const methods = [['md5hash', AlgorithmTypes.md5hash], ['md5', AlgorithmTypes.md5hmac], ['sha1', AlgorithmTypes.sha1hmac], ['sha256', AlgorithmTypes.sha256hmac], ['sha512', AlgorithmTypes.sha512hmac]] as const;
    for (const [method, algorithm] of methods) {
      expect(client().verifySignature(signParams(params, 'k', method), params, 'k', algorithm), method).toBe(true);
    }
  });
});
