// A tiny HTTP client with a cookie jar, for talking to the running app like a browser would.
export const baseUrl = (() => {
  const url = process.env.APP_URL;
  if (!url) throw new Error('APP_URL is not set: run integration tests through `npm test`.');
  return url;
})();

export class Client {
  constructor(
    /** The address this client talks to: the test stack's app unless told otherwise. */
    readonly base: string = baseUrl,
    private cookies = new Map<string, string>(),
  ) {}

  /** A client holding the same cookies (the same session) that talks to another address. */
  at(base: string): Client {
    return new Client(base, this.cookies);
  }

  /** A second client holding the same cookies, as a copied session cookie would. */
  copy(): Client {
    const other = new Client();
    for (const [k, v] of this.cookies) other.cookies.set(k, v);
    return other;
  }

  /** Signs out through Auth.js as the sign-out button does (CSRF token, POST). */
  async signOut(): Promise<number> {
    return (await this.authPost('/api/auth/signout', { callbackUrl: '/' })).status;
  }

  cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  hasCookie(prefix: string): boolean {
    return [...this.cookies.keys()].some((k) => k.includes(prefix));
  }

  /** fetch against the app; never follows redirects, keeps cookies. */
  async fetch(path: string, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    if (this.cookies.size) headers.set('cookie', this.cookieHeader());
    if (init.method && init.method !== 'GET') headers.set('origin', this.base);
    const res = await fetch(new URL(path, this.base), { ...init, headers, redirect: 'manual' });
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const i = pair!.indexOf('=');
      const name = pair!.slice(0, i);
      const value = pair!.slice(i + 1);
      if (value === '' || /max-age=0|expires=thu, 01 jan 1970/i.test(c)) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
    return res;
  }

  async json<T = any>(path: string, init: RequestInit = {}): Promise<{ status: number; body: T; res: Response }> {
    const res = await this.fetch(path, init);
    const text = await res.text();
    let body: any = text;
    try {
      body = JSON.parse(text);
    } catch {
      /* not JSON: leave as text */
    }
    return { status: res.status, body, res };
  }

  /** Sends JSON with the given method. */
  send<T = any>(method: string, path: string, data: unknown) {
    return this.json<T>(path, { method, headers: { 'content-type': 'application/json' }, body: JSON.stringify(data) });
  }

  /** Posts a form to an Auth.js route with a fresh CSRF token; returns Auth.js's redirect URL. */
  async authPost(path: string, fields: Record<string, string>, headers: Record<string, string> = {}): Promise<{ status: number; url?: string; body: any }> {
    const { body: csrf } = await this.json<{ csrfToken: string }>('/api/auth/csrf');
    const { status, body } = await this.json(path, {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded', 'x-auth-return-redirect': '1', ...headers },
      body: new URLSearchParams({ ...fields, csrfToken: csrf.csrfToken }),
    });
    return { status, url: body?.url, body };
  }
}

/** Signs in a staff member with their password; throws if it fails. */
export async function signInWithPassword(email: string, password: string, base = baseUrl): Promise<Client> {
  const client = new Client(base);
  const r = await client.authPost('/api/auth/callback/credentials', { email, password, callbackUrl: '/home' });
  if (r.status !== 200 || !r.url || r.url.includes('error=')) throw new Error(`password sign-in failed: ${r.status} ${r.url}`);
  return client;
}
