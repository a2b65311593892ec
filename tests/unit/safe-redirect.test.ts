import { describe, expect, it } from 'vitest';
import { safeCallbackPath } from '@/lib/safe-redirect';

// What a browser makes of each value follows the WHATWG URL Standard (url.spec.whatwg.org):
// §4.4 "basic URL parser" strips ASCII tab and newline anywhere, and for special schemes (http,
// https) treats "\" as "/" — so "/\evil.example" and "/\t/evil.example" are "//evil.example",
// another host. Node's URL implements the same standard, which is why the check parses.
const app = 'http://127.0.0.1:4321';

describe('safeCallbackPath', () => {
  it.each([
    ['/\\evil.example/phish'],
    ['/%5Cevil.example/phish'.replace('%5C', '\\')],
    ['//evil.example/phish'],
    ['/\t/evil.example/phish'],
    ['/\n/evil.example'],
    ['\\\\evil.example'],
    ['https://evil.example/'],
    ['https:evil.example'],
    ['javascript:alert(1)'],
    ['http://127.0.0.1:4322/other-port'],
    ['https://127.0.0.1:4321/other-scheme'],
  ])('refuses %j', (value) => {
    expect(safeCallbackPath(value, app)).toBe('/home');
  });

  it.each([
    ['/my', '/my'],
    ['/office?light=red&page=2', '/office?light=red&page=2'],
    ['http://127.0.0.1:4321/my/cases/1#photos', '/my/cases/1#photos'],
    // Percent-encoded backslash stays inside the path: the browser does not decode it into a slash.
    ['/%5Cevil.example/phish', '/%5Cevil.example/phish'],
    ['my', '/my'],
  ])('keeps %j as %j', (value, expected) => {
    expect(safeCallbackPath(value, app)).toBe(expected);
  });

  it('falls back when there is nothing or nonsense', () => {
    expect(safeCallbackPath(null, app)).toBe('/home');
    expect(safeCallbackPath('', app, '/signin/check-email')).toBe('/signin/check-email');
    expect(safeCallbackPath('http://[::1', app)).toBe('/home');
  });
});
