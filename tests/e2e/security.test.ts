// In Chromium: sign-in never lands on another site whatever the callbackUrl, and the checklist,
// the driveway plan, the office queue and the survey pack all work under the Content-Security-Policy
// with no violation reported. Screenshots of the new visible states (changed since ready, sign out
// everywhere) at phone and desktop widths.
import { afterAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { eq } from 'drizzle-orm';
import { baseUrl, close, DESKTOP, newPage, PHONE, problemsOf, signInByLink, snap, waitForIslands } from './browser';
import { db, schema } from '../helpers/db';
import { createCase, createUser } from '../../seeds/factories';

afterAll(close);

const PASSWORD = 'correct horse battery staple';

/** Records every CSP violation the page reports (the browser fires this event for each). */
async function watchCsp(page: Page) {
  await page.addInitScript(() => {
    (window as unknown as { cspViolations: string[] }).cspViolations = [];
    document.addEventListener('securitypolicyviolation', (e) =>
      (window as unknown as { cspViolations: string[] }).cspViolations.push(`${e.violatedDirective} ${e.blockedURI} ${e.sample}`),
    );
  });
}
const violations = (page: Page) => page.evaluate(() => (window as unknown as { cspViolations: string[] }).cspViolations);

async function signInStaff(page: Page, email: string, callbackUrl?: string) {
  await page.goto(callbackUrl === undefined ? '/signin' : `/signin?callbackUrl=${callbackUrl}`);
  await page.locator('[data-ready="true"]').waitFor();
  await page.getByRole('tab', { name: 'Installer staff' }).click();
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

async function snapBoth(page: Page, name: string) {
  await page.setViewportSize(PHONE);
  await page.evaluate(() => window.scrollTo(0, 0));
  await snap(page, `${name}-390`);
  await page.setViewportSize(DESKTOP);
  await page.evaluate(() => window.scrollTo(0, 0));
  await snap(page, `${name}-1280`);
}

describe('no open redirect after sign-in', () => {
  // Each is the raw query-string value. Decoded, the browser's URL parser (WHATWG URL Standard:
  // "\" is "/" for http(s), tab and newline are dropped) reads each as another host.
  const attempts = [
    '/%5Cevil.example/phish',
    '%5C%5Cevil.example',
    '/%09/evil.example/phish',
    '/%0A/evil.example',
    '%2F%2Fevil.example',
    'https:evil.example',
  ];

  it('stays on Groundwork for every backslash, tab, newline and encoded variant', async () => {
    const admin = await createUser(db, { role: 'admin', password: PASSWORD });
    const { page, context } = await newPage(DESKTOP);
    // Should anything try to leave, it lands here instead of the real network.
    await context.route((url) => url.hostname.endsWith('evil.example'), (route) => route.fulfill({ status: 200, contentType: 'text/html', body: '<h1>phished</h1>' }));
    for (const attempt of attempts) {
      await signInStaff(page, admin.email, attempt);
      await page.waitForURL((u) => !u.pathname.startsWith('/signin'), { timeout: 15_000 });
      await page.waitForLoadState('load');
      expect(new URL(page.url()).origin, attempt).toBe(baseUrl);
      await context.clearCookies();
    }
    // A path on the app itself is still honoured.
    await signInStaff(page, admin.email, encodeURIComponent('/office/settings'));
    await page.waitForURL('**/office/settings');
    expect(problemsOf(page)).toEqual([]);
    await context.close();
  });
});

describe('pages work under the Content-Security-Policy', () => {
  it('checklist, plan, queue and pack hydrate, save and log no violation', async () => {
    const customer = await createUser(db, { role: 'customer', name: 'Wren Halloway' });
    const surveyor = await createUser(db, { role: 'surveyor', name: 'Ivo Brackett', password: PASSWORD });
    const admin = await createUser(db, { role: 'admin', password: PASSWORD });
    const open = await createCase(db, { customerId: customer.id, addressLine1: '7 Cinder Lane', town: 'Quillbury' });

    // Customer: checklist and driveway plan.
    const c = await newPage(PHONE);
    await watchCsp(c.page);
    const res = await c.page.goto('/signin');
    const csp = res!.headers()['content-security-policy'] ?? '';
    expect(csp).toContain("script-src 'self'");
    expect(csp).not.toContain('unsafe-eval');
    await signInByLink(c.page, customer.email);
    await c.page.goto(`/my/cases/${open.id}`);
    await waitForIslands(c.page);
    await c.page.getByLabel('Full name').fill('Wren Halloway');
    await expect.poll(() => c.page.getByTestId('save-status').textContent(), { timeout: 10_000 }).toBe('Saved');
    await c.page.goto(`/my/cases/${open.id}/plan`);
    await c.page.locator('astro-island:not([ssr]) [data-testid="driveway-plan"]').waitFor();
    await c.page.getByRole('button', { name: 'Move the charge point right by 10 cm' }).click();
    await c.page.locator('[data-testid="plan-save-status"][data-status="saved"]').waitFor({ timeout: 10_000 });
    expect(await violations(c.page)).toEqual([]);
    expect(problemsOf(c.page)).toEqual([]);
    await c.context.close();

    // Office: the queue, with a case the customer changed after it was marked ready.
    const ready = await createCase(db, { customerId: (await createUser(db, { role: 'customer', name: 'Tamsin Orchard' })).id, stage: 'ready_for_survey', addressLine1: '2 Weir Cottages', town: 'Brackenford' });
    await db
      .update(schema.cases)
      .set({ changedSinceReadyAt: new Date(), changesSinceReady: [{ at: new Date().toISOString(), what: 'answers', detail: 'the main fuse rating' }] })
      .where(eq(schema.cases.id, ready.id));
    const o = await newPage(DESKTOP);
    await watchCsp(o.page);
    await signInStaff(o.page, admin.email);
    await o.page.waitForURL('**/office');
    await waitForIslands(o.page);
    await o.page.getByTestId('case-link').first().waitFor();
    await o.page.goto(`/office?q=${encodeURIComponent(ready.reference)}`);
    await waitForIslands(o.page);
    await o.page.getByTestId('changed-since-ready').first().waitFor();
    await snapBoth(o.page, 'office-queue-changed-since-ready');
    await o.page.goto(`/office/cases/${ready.id}`);
    await waitForIslands(o.page);
    await expect(o.page.getByTestId('changed-since-ready').textContent()).resolves.toContain('the main fuse rating');
    await snapBoth(o.page, 'office-case-changed-since-ready');
    // Book the survey for the pack (the office's own stage move, through the island).
    await db.update(schema.cases).set({ stage: 'survey_booked', surveyorId: surveyor.id, surveyDate: '2099-07-01' }).where(eq(schema.cases.id, ready.id));
    expect(await violations(o.page)).toEqual([]);
    expect(problemsOf(o.page)).toEqual([]);
    await o.context.close();

    // Surveyor: the pack, and the header's "Sign out everywhere".
    const s = await newPage(PHONE);
    await watchCsp(s.page);
    await signInStaff(s.page, surveyor.email);
    await s.page.waitForURL('**/surveys');
    await s.page.goto(`/surveys/cases/${ready.id}`);
    await s.page.getByTestId('pack').waitFor();
    await waitForIslands(s.page);
    await snapBoth(s.page, 'surveyor-header-sign-out-everywhere');
    expect(await violations(s.page)).toEqual([]);
    await s.page.getByTestId('sign-out-everywhere').click();
    await s.page.waitForURL((u) => u.pathname === '/');
    const after = await s.page.request.get('/api/me');
    expect(after.status()).toBe(401);
    expect(problemsOf(s.page)).toEqual([]);
    await s.context.close();
  });
});
