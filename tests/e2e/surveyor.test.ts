// The surveyor's day in Chromium: sign in, open a booked visit's pack, download the PDF, record
// the outcome; plus screenshots of the demo's richest pack at A4 print size and at phone width.
import { readFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { close, DESKTOP, newPage, PHONE, problemsOf, snap, waitForIslands } from './browser';
import { db, schema } from '../helpers/db';
import { createCase, createUser } from '../../seeds/factories';

afterAll(close);

const password = process.env.DEMO_PASSWORD ?? 'groundwork-demo';
const A4_PRINT = { width: 794, height: 1123 };

async function signIn(page: import('playwright-core').Page) {
  await page.goto('/signin');
  await page.locator('[data-ready="true"]').waitFor();
  await page.getByRole('tab', { name: 'Installer staff' }).click();
  await page.getByLabel('E-mail address').fill('surveyor@example.com');
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL('**/surveys');
  await waitForIslands(page);
}

async function bookedVisit() {
  const [surveyor] = await db.select().from(schema.users).where(eq(schema.users.email, 'surveyor@example.com'));
  const customer = await createUser(db, { role: 'customer', name: 'Elin Marchbank' });
  return createCase(db, {
    customerId: customer.id,
    stage: 'survey_booked',
    surveyorId: surveyor!.id,
    // Today, so it sorts first on the surveyor's home.
    surveyDate: new Date().toISOString().slice(0, 10),
    addressLine1: '12 Saddlers Yard',
    town: 'Quillbury',
    postcode: 'AB12 9JL',
    checklist: {
      supply: { mpanCore: '1312345678907', mainFuseAmps: 80, looped: 'no', earthing: 'unknown' },
      charger: { cableRunMetres: 12, route: 'along-wall', softGround: true, softGroundMetres: 4, preference: 'tethered', tetherMetres: 5 },
    },
  });
}

describe('the surveyor, in Chromium', () => {
  it('signs in, opens a booked visit, downloads the pack and records the outcome', async () => {
    const visit = await bookedVisit();
    const { page, context } = await newPage(DESKTOP);
    await signIn(page);
    const card = page.locator(`[data-testid="visit"][data-reference="${visit.reference}"]`);
    await expect(card.textContent()).resolves.toContain('12 Saddlers Yard');
    await expect(card.textContent()).resolves.toContain('Needs attention');
    await snap(page, 'surveyor-home-1280');
    await page.setViewportSize(PHONE);
    await snap(page, 'surveyor-home-390');
    await page.setViewportSize(DESKTOP);
    await card.getByTestId('open-pack').click();
    await page.waitForURL(`**/surveys/cases/${visit.id}`);
    await waitForIslands(page);
    await expect(page.getByTestId('pack-mpan').textContent()).resolves.toContain('1312345678907');

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('download-pdf').click()]);
    expect(download.suggestedFilename()).toBe(`groundwork-pack-${visit.reference}.pdf`);
    const bytes = readFileSync((await download.path())!);
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');

    await page.getByTestId('record-outcome').click();
    await page.waitForURL(`**/surveys/cases/${visit.id}/outcome`);
    await waitForIslands(page);
    // Saving with nothing chosen names what is missing, before anything is sent.
    await page.getByTestId('save-outcome').click();
    await expect(page.getByTestId('outcome-errors').textContent()).resolves.toContain('Choose the outcome of the survey.');
    await page.getByLabel('Go ahead with changes').check();
    await page.getByLabel('TN-S').check();
    await page.getByLabel('100 A').check();
    await page.getByLabel(/External earth fault loop impedance/).fill('0.28');
    await page.getByLabel(/^Notes/).fill('TN-S confirmed at the cut-out; run the cable along the wall, not under the drive.');
    await snap(page, 'surveyor-outcome-1280');
    await page.getByTestId('save-outcome').click();
    await page.waitForURL(`**/surveys/cases/${visit.id}?recorded=1`);
    await waitForIslands(page);
    await expect(page.getByTestId('pack-stage').textContent()).resolves.toBe('Surveyed');
    await expect(page.getByTestId('pack-outcome').textContent()).resolves.toContain('Go ahead with changes');
    // The earthing check now reads the confirmed TN-S.
    await expect(page.locator('[data-check="earthing"]').textContent()).resolves.toContain('Confirmed on site');
    await expect(page.getByTestId('record-outcome').count()).resolves.toBe(0);
    const [saved] = await db.select().from(schema.surveyOutcomes).where(eq(schema.surveyOutcomes.caseId, visit.id));
    expect(saved).toMatchObject({ outcome: 'go_ahead_with_changes', confirmedEarthing: 'tns', confirmedFuseAmps: 100, measurements: { zeOhms: 0.28 } });
    expect(problemsOf(page)).toEqual([]);
    await context.close();
  });

  it('the demo’s richest pack, printed at A4 and read on a phone', async () => {
    const [heron] = await db.select().from(schema.cases).where(eq(schema.cases.addressLine1, '8 Heron Close'));
    expect(heron, 'the demo seed has 8 Heron Close').toBeDefined();
    const { page, context } = await newPage(A4_PRINT);
    await signIn(page);
    await page.goto(`/surveys/cases/${heron!.id}`);
    await page.emulateMedia({ media: 'print' });
    // Every photo is loaded before the picture is taken.
    await page.waitForFunction(() => [...document.images].every((img) => img.complete && img.naturalWidth > 0));
    await expect(page.locator('body > header').isVisible()).resolves.toBe(false);
    const widths = await page.locator('[data-testid="pack-photos"] img').evaluateAll((imgs) => imgs.map((img) => img.getBoundingClientRect().width));
    expect(widths.length).toBe(8);
    for (const width of widths) expect(width).toBeGreaterThanOrEqual(300);
    await snap(page, 'pack-print-a4-794');
    await page.emulateMedia({ media: 'screen' });
    await page.setViewportSize(PHONE);
    await page.waitForFunction(() => [...document.images].every((img) => img.complete && img.naturalWidth > 0));
    const phoneWidths = await page.locator('[data-testid="pack-photos"] img').evaluateAll((imgs) => imgs.map((img) => img.getBoundingClientRect().width));
    for (const width of phoneWidths) expect(width).toBeGreaterThanOrEqual(300);
    // Nothing wider than the phone: tables scroll inside their own boxes.
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await snap(page, 'pack-390');
    expect(problemsOf(page)).toEqual([]);
    await context.close();
  });
});
