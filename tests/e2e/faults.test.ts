// Faults a customer's phone meets, in Chromium with route interception: a 503 while the database
// is away, a save whose answer never came back, a tab closed while a save is on its way, the same
// answer changed in two tabs, and a page opened while the database is unreachable.
import { spawn } from 'node:child_process';
import net from 'node:net';
import { afterAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import type { Page } from 'playwright-core';
import { close, DESKTOP, newPage, PHONE, problemsOf, snap, signInByLink, waitForIslands } from './browser';
import { db, schema } from '../helpers/db';
import { createCase, createUser } from '../../seeds/factories';

afterAll(close);

const CHECKLIST = '**/api/cases/*/checklist';
const savedRow = async (caseId: string) => (await db.select().from(schema.cases).where(eq(schema.cases.id, caseId)))[0]!;
const status = (page: Page) => page.getByTestId('save-status').textContent();
const waitSaved = (page: Page) => expect.poll(() => status(page), { timeout: 15_000 }).toBe('Saved');
// Chromium logs refused and failed requests as console errors; here they are the point of the test.
const expectedNoise = (p: string) => /ERR_INTERNET_DISCONNECTED|ERR_CONNECTION_RESET|ERR_FAILED|Failed to fetch|status of 503/.test(p);

async function customerOnStep(step: string, checklist: Record<string, unknown> = {}) {
  const user = await createUser(db, { role: 'customer', name: 'Wren Ashdown' });
  const theCase = await createCase(db, { customerId: user.id, checklist });
  const { page, context } = await newPage(PHONE);
  await signInByLink(page, user.email);
  await page.goto(`/my/cases/${theCase.id}#step=${step}`);
  await waitForIslands(page);
  return { user, theCase, page, context };
}

describe('autosave under faults', () => {
  it('a 503 with Retry-After: keeps the answer, says it is retrying, saves once the server is back', async () => {
    const { theCase, page, context } = await customerOnStep('parking');
    await page.getByRole('radio', { name: 'A garage at my home' }).waitFor();
    let refused = 0;
    await context.route(CHECKLIST, (route) => {
      refused++;
      return route.fulfill({
        status: 503,
        headers: { 'content-type': 'application/json', 'retry-after': '1' },
        body: JSON.stringify({ error: { code: 'unavailable', message: 'We are having trouble reaching our database.' } }),
      });
    });
    await page.getByRole('radio', { name: 'A garage at my home' }).check();
    await expect.poll(() => status(page), { timeout: 10_000 }).toMatch(/^Not saved — retrying/);
    await expect.poll(() => refused, { timeout: 10_000 }).toBeGreaterThanOrEqual(2);
    expect((await savedRow(theCase.id)).checklist).toEqual({});
    await context.unroute(CHECKLIST);
    await waitSaved(page);
    const row = await savedRow(theCase.id);
    expect(row.checklist).toEqual({ parking: { kind: 'garage' } });
    expect(row.version).toBe(2);
    expect(problemsOf(page).filter((p) => !expectedNoise(p))).toEqual([]);
    await context.close();
  });

  it('the save reached the server but its answer was lost: the retry neither loses nor doubles it', async () => {
    const { theCase, page, context } = await customerOnStep('parking');
    await page.getByRole('radio', { name: 'A garage at my home' }).waitFor();
    let dropped = false;
    await context.route(CHECKLIST, async (route) => {
      if (dropped) return route.continue();
      dropped = true;
      await route.fetch(); // the server saves it…
      await route.abort('connectionreset'); // …and the phone never hears back.
    });
    await page.getByRole('radio', { name: 'A garage at my home' }).check();
    await waitSaved(page);
    const row = await savedRow(theCase.id);
    expect(dropped).toBe(true);
    expect(row.checklist).toEqual({ parking: { kind: 'garage' } });
    // 1 at creation, +1 for the one save; the retry (409, then the same value again) changes nothing.
    expect(row.version).toBe(2);
    expect(problemsOf(page).filter((p) => !expectedNoise(p))).toEqual([]);
    await context.close();
  });

  it('the tab closed while a save was on its way: the answer is sent on the next visit', async () => {
    const { theCase, page, context } = await customerOnStep('parking');
    await page.getByRole('radio', { name: 'Nose in' }).waitFor();
    let held = 0;
    // The save leaves the tab but never arrives (a tunnel, a lift): the route holds it unanswered.
    await context.route(CHECKLIST, () => {
      held++;
    });
    await page.getByRole('radio', { name: 'Nose in' }).check();
    await expect.poll(() => held, { timeout: 10_000 }).toBe(1);
    await page.close();
    await context.unroute(CHECKLIST);
    expect((await savedRow(theCase.id)).checklist).toEqual({});
    const again = await context.newPage();
    await again.goto(`/my/cases/${theCase.id}#step=parking`);
    await expect.poll(() => again.getByTestId('checklist-notice').textContent()).toContain('typed earlier');
    await waitSaved(again);
    expect((await savedRow(theCase.id)).checklist).toEqual({ parking: { habit: 'nose-in' } });
    await context.close();
  });

  it('the same answer changed in two tabs: the conflict is shown, not silently overwritten', async () => {
    const { theCase, page: first, context } = await customerOnStep('home', { about: { town: 'Oldbridge' } });
    const second = await context.newPage();
    await second.goto(`/my/cases/${theCase.id}#step=home`);
    await expect.poll(() => first.getByLabel('Town or city').inputValue()).toBe('Oldbridge');
    await expect.poll(() => second.getByLabel('Town or city').inputValue()).toBe('Oldbridge');
    // The first tab's save is held back while the second tab saves the same field.
    let release: () => void = () => {};
    const gate = new Promise<void>((r) => (release = r));
    await first.route(CHECKLIST, async (route) => {
      await gate;
      await route.continue();
    });
    await first.getByLabel('Town or city').fill('Eastbridge');
    await first.getByLabel('Town or city').press('Tab');
    await second.getByLabel('Town or city').fill('Westbridge');
    await second.getByLabel('Town or city').press('Tab');
    await waitSaved(second);
    release();
    // The first tab meets a 409, is told the other tab changed this very answer, and keeps its own.
    const notice = () => first.getByTestId('checklist-notice').textContent();
    await expect.poll(notice, { timeout: 15_000 }).toContain('changed on another device or tab');
    await expect.poll(notice).toContain('You had also changed Town or city here');
    await waitSaved(first);
    await first.unroute(CHECKLIST);
    await snap(first, 'autosave-same-answer-conflict-390');
    const row = await savedRow(theCase.id);
    expect((row.checklist as any).about.town).toBe('Eastbridge');
    // Two acknowledged saves, each counted once: 1 + 2.
    expect(row.version).toBe(3);
    // The second tab, on its next look, loads the newer answer rather than keeping a stale one.
    await second.evaluate(() => document.dispatchEvent(new Event('visibilitychange')));
    await expect.poll(() => second.getByLabel('Town or city').inputValue(), { timeout: 10_000 }).toBe('Eastbridge');
    await context.close();
  });
});

describe('a page while the database is unreachable', () => {
  it('is a friendly 503 saying the answers are safe, at phone and desktop widths', async () => {
    const port = await new Promise<number>((resolve) => {
      const s = net.createServer().listen(0, '127.0.0.1', () => {
        const { port } = s.address() as net.AddressInfo;
        s.close(() => resolve(port));
      });
    });
    const deadDb = await new Promise<number>((resolve) => {
      const s = net.createServer().listen(0, '127.0.0.1', () => {
        const { port } = s.address() as net.AddressInfo;
        s.close(() => resolve(port));
      });
    });
    // A second copy of the built app whose database is not there; cookies for 127.0.0.1 reach it too.
    const child = spawn('node', [process.env.APP_ENTRY!], {
      env: { ...process.env, PORT: String(port), HOST: '127.0.0.1', DATABASE_URL: `postgres://x:y@127.0.0.1:${deadDb}/none` },
      stdio: 'ignore',
    });
    try {
      const user = await createUser(db, { role: 'customer', name: 'Ivo Marsh' });
      const { page, context } = await newPage(PHONE);
      await signInByLink(page, user.email);
      const url = `http://127.0.0.1:${port}/my`;
      let res = null;
      for (let i = 0; i < 100 && !res; i++) {
        res = await page.goto(url).catch(() => null);
        if (!res) await new Promise((r) => setTimeout(r, 100));
      }
      expect(res?.status()).toBe(503);
      expect(res?.headers()['retry-after']).toBeTruthy();
      await expect(page.getByRole('heading', { name: 'We’re having trouble right now' }).count()).resolves.toBe(1);
      await expect(page.getByText('Your answers are safe').count()).resolves.toBe(1);
      await snap(page, 'unavailable-390');
      await page.setViewportSize(DESKTOP);
      await snap(page, 'unavailable-1280');
      await context.close();
    } finally {
      child.kill();
    }
  });
});
