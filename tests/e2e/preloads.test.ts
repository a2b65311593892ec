// Pages name, in their <head>, every script their islands will import (<link rel="modulepreload">),
// so a phone asks for the whole chain at once instead of one round trip per level of imports.
// Checked in Chromium against what the browser itself then fetched: its own resource timings,
// not our build's list, are the reference.
import { afterAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { baseUrl, close, DESKTOP, newPage, PHONE, problemsOf, signInByLink, signInStaff, waitForIslands } from './browser';
import { db } from '../helpers/db';
import { createCase, createUser } from '../../seeds/factories';

afterAll(close);

/** The scripts the page named in its HTML, and the scripts Chromium fetched until its islands hydrated. */
async function namedAndFetched(page: Page) {
  await waitForIslands(page);
  return page.evaluate(() => {
    const named = [...document.querySelectorAll<HTMLLinkElement>('head link[rel="modulepreload"]')].map((l) => new URL(l.href).pathname);
    const scripts = [...document.querySelectorAll<HTMLScriptElement>('script[type="module"][src]')].map((s) => new URL(s.src).pathname);
    const fetched = performance
      .getEntriesByType('resource')
      .map((e) => new URL(e.name).pathname)
      .filter((path) => path.endsWith('.js'));
    return { named, scripts, fetched };
  });
}

describe('module preloads', () => {
  it('the office queue names every script it fetches before hydrating', async () => {
    const { page } = await newPage(DESKTOP);
    await signInStaff(page, 'admin@example.com');
    await page.waitForURL('**/office');
    await page.goto(`${baseUrl}/office`);
    const { named, scripts, fetched } = await namedAndFetched(page);
    expect(named.length).toBeGreaterThan(2);
    expect(fetched.filter((path) => !named.includes(path) && !scripts.includes(path))).toEqual([]);
    // Nothing named that the page does not use.
    expect(named.filter((path) => !fetched.includes(path))).toEqual([]);
    expect(problemsOf(page)).toEqual([]);
  });

  it('the driveway plan too, and the photo uploader (loaded only when a slot is used) is not named', async () => {
    const user = await createUser(db, { role: 'customer', name: 'Wilfred Ashcombe' });
    const theCase = await createCase(db, { customerId: user.id, addressLine1: '4 Linnet Close', town: 'Brackenford' });
    const { page } = await newPage(PHONE);
    await signInByLink(page, user.email);
    await page.goto(`${baseUrl}/my/cases/${theCase.id}/plan`);
    const plan = await namedAndFetched(page);
    expect(plan.named.length).toBeGreaterThan(2);
    expect(plan.fetched.filter((path) => !plan.named.includes(path) && !plan.scripts.includes(path))).toEqual([]);

    await page.goto(`${baseUrl}/my/cases/${theCase.id}/photos`);
    const photos = await namedAndFetched(page);
    expect(photos.fetched.filter((path) => !photos.named.includes(path) && !photos.scripts.includes(path))).toEqual([]);
    expect(photos.named.filter((path) => /upload-widget/.test(path))).toEqual([]);
    expect(problemsOf(page)).toEqual([]);
  });
});
