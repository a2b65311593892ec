import { afterEach, describe, expect, it } from 'vitest';
import { withSecurityHeaders } from '@/lib/server/security-headers.server';

// RFC 6797 §7.2: HSTS is sent only over secure transport; a browser ignores it over plain http.
describe('withSecurityHeaders', () => {
  const saved = process.env.APP_URL;
  afterEach(() => {
    process.env.APP_URL = saved;
  });

  it('adds HSTS only when APP_URL is https', () => {
    process.env.APP_URL = 'https://groundwork.example.com';
    expect(withSecurityHeaders(new Response('x'), { signedIn: false }).headers.get('strict-transport-security')).toMatch(/^max-age=\d{7,}/);
    process.env.APP_URL = 'http://127.0.0.1:4321';
    expect(withSecurityHeaders(new Response('x'), { signedIn: false }).headers.get('strict-transport-security')).toBeNull();
  });

  it('copies a response whose headers cannot change (a redirect) instead of failing', () => {
    const res = withSecurityHeaders(Response.redirect('http://127.0.0.1/x', 302), { signedIn: true });
    expect(res.status).toBe(302);
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('cache-control')).toBe('no-store');
  });
});
