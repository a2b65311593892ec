// On a slow phone a page is on screen seconds before its scripts have run. What the customer
// types or picks in that time must be kept when the page comes alive, and saved.
import { afterAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import type { Page } from 'playwright-core';
import { baseUrl, close, newPage, PHONE, problemsOf, signInByLink, slotFileInput, snapBoth, uploadSlot, waitForIslands } from './browser';
import { db, schema } from '../helpers/db';
import { createCase, createUser } from '../../seeds/factories';
import { smallImage } from '../fixtures/uploads';

afterAll(close);

/**
 * Holds the page's own scripts back, as a slow connection does, until `release` is called.
 * Module scripts delay DOMContentLoaded, so pages are opened with waitUntil 'commit'.
 */
async function holdScripts(page: Page): Promise<() => void> {
  let release!: () => void;
  const scriptsMayGo = new Promise<void>((resolve) => (release = resolve));
  await page.route('**/_astro/**/*.js', async (route) => {
    await scriptsMayGo;
    await route.continue();
  });
  return release;
}

/** A new customer with a case, signed in on a phone, with `path` (under the case) opened while its scripts are held. */
async function openHeld(name: string, addressLine1: string, path: string) {
  const user = await createUser(db, { role: 'customer', name });
  const theCase = await createCase(db, { customerId: user.id, addressLine1, town: 'Brackenford' });
  const { page } = await newPage(PHONE);
  await signInByLink(page, user.email);
  const release = await holdScripts(page);
  await page.goto(`${baseUrl}/my/cases/${theCase.id}${path}`, { waitUntil: 'commit' });
  return { page, theCase, release };
}

describe('answers typed before the checklist has hydrated', () => {
  it('are kept through hydration and saved like any other answer', async () => {
    const { page, theCase, release } = await openHeld('Perpetua Lind', '3 Sorrel Yard', '');
    await expect.poll(() => page.locator('#step-heading').textContent()).toBe('About you');
    expect(await page.locator('astro-island[ssr]').count()).toBeGreaterThan(0);

    // Typed into the server-drawn fields (before this change they were disabled until hydration).
    await page.getByLabel('Full name').fill('Perpetua Lind', { timeout: 5_000 });
    await page.getByLabel('E-mail address').fill('perpetua.lind@example.org', { timeout: 5_000 });
    expect(await page.locator('astro-island[ssr]').count()).toBeGreaterThan(0);

    release();
    await waitForIslands(page);
    expect(await page.getByLabel('Full name').inputValue()).toBe('Perpetua Lind');
    expect(await page.getByLabel('E-mail address').inputValue()).toBe('perpetua.lind@example.org');
    await expect.poll(() => page.getByTestId('save-status').textContent(), { timeout: 10_000 }).toBe('Saved');
    await snapBoth(page, 'checklist-typed-before-hydration');

    const [row] = await db.select().from(schema.cases).where(eq(schema.cases.id, theCase.id));
    const about = (row!.checklist as { about?: Record<string, string> }).about ?? {};
    expect(about.fullName).toBe('Perpetua Lind');
    expect(about.email).toBe('perpetua.lind@example.org');

    // And after a reload the saved answers are what the server draws.
    await page.unroute('**/_astro/**/*.js');
    await page.reload();
    await waitForIslands(page);
    expect(await page.getByLabel('Full name').inputValue()).toBe('Perpetua Lind');
    expect(problemsOf(page)).toEqual([]);
  });

  it('a photo chosen before the photos page has hydrated is sent once it has', async () => {
    const { page, theCase, release } = await openHeld('Ottilie Marsh', '11 Teasel Row', '/photos');
    await uploadSlot(page, 'meter_photo').getByTestId('drop-zone').waitFor({ timeout: 10_000 });
    expect(await page.locator('astro-island[ssr]').count()).toBeGreaterThan(0);
    await slotFileInput(page, 'meter_photo').setInputFiles({ name: 'meter.png', mimeType: 'image/png', buffer: await smallImage('png', 900, 1200) });
    expect(await page.locator('astro-island[ssr]').count()).toBeGreaterThan(0);

    release();
    await waitForIslands(page);
    const sent = uploadSlot(page, 'meter_photo').getByTestId('uploaded-file');
    await sent.waitFor({ timeout: 30_000 });
    await expect(sent.textContent()).resolves.toContain('meter.png');
    await snapBoth(page, 'photos-picked-before-hydration');
    const rows = await db.select().from(schema.uploads).where(eq(schema.uploads.caseId, theCase.id));
    expect(rows.map((r) => [r.kind, r.originalName])).toEqual([['meter_photo', 'meter.png']]);
    expect(problemsOf(page)).toEqual([]);
  });
});
