import { describe, expect, it } from 'vitest';
import { clientAddressOf, trustedProxies } from '@/lib/server/request-context.server';

// X-Forwarded-For: each proxy appends the address it received the request from, so only the
// entries added by proxies we trust can be believed; the right-most untrusted entry is the client
// (MDN, "X-Forwarded-For", Security and privacy concerns; RFC 7239 §5.2 describes the same chain).
const h = (xff?: string) => new Headers(xff ? { 'x-forwarded-for': xff } : {});

describe('clientAddressOf', () => {
  it('uses the socket address when nothing is forwarded', () => {
    expect(clientAddressOf(h(), '::ffff:203.0.113.5', undefined, new Set())).toBe('203.0.113.5');
  });

  it('never believes the header without TRUST_PROXY: forged values share one key', () => {
    const none = trustedProxies('');
    expect(clientAddressOf(h('198.51.100.1'), '198.51.100.1', undefined, none)).toBe('forwarded-untrusted');
    expect(clientAddressOf(h('198.51.100.2'), '198.51.100.2', undefined, none)).toBe('forwarded-untrusted');
    // When the server knows the socket's own address, that is the client.
    expect(clientAddressOf(h('198.51.100.2'), '198.51.100.2', '203.0.113.7', none)).toBe('203.0.113.7');
  });

  it('behind a named proxy takes the right-most address the proxy did not add itself', () => {
    const proxies = trustedProxies('127.0.0.1, 10.0.0.2');
    // The client forged "198.51.100.1"; the proxy appended the real address it saw.
    expect(clientAddressOf(h('198.51.100.1, 203.0.113.9'), '198.51.100.1', '127.0.0.1', proxies)).toBe('203.0.113.9');
    // Two proxies in a row: both skipped.
    expect(clientAddressOf(h('203.0.113.9, 10.0.0.2'), '203.0.113.9', '127.0.0.1', proxies)).toBe('203.0.113.9');
    // A peer that is not the named proxy is itself the client, whatever its header says.
    expect(clientAddressOf(h('203.0.113.9'), '203.0.113.9', '192.0.2.44', proxies)).toBe('192.0.2.44');
    expect(clientAddressOf(h('not-an-address'), 'x', '127.0.0.1', proxies)).toBe('forwarded-invalid');
  });
});
