// Where a customer is asked for photos, the cautions from src/lib/cautions.ts stand beside the
// slots (phone and desktop); the chase e-mail shows them in the fake inbox's HTML part; and the
// demo's registered cars (age identifier 29, on the look-up fake's records) show no plate
// warning on the office's case page.
import { afterAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { close, DESKTOP, newPage, PHONE, problemsOf, signInByLink, snap, waitForIslands } from './browser';
import { db, schema } from '../helpers/db';
import { waitForMessage } from '../helpers/mail';
import { newStaff } from '../helpers/people';
import { createCase, createUser } from '../../seeds/factories';
import { customerPhotoCautions } from '@/lib/cautions';
import { demoHomes, demoPlates } from '../../seeds/demo-checklists';

afterAll(close);

describe('cautions where photos are asked for', () => {
  for (const [width, viewport] of [['390', PHONE], ['1280', DESKTOP]] as const) {
    it(`lists every photo caution on the supply step and under each supply slot at ${width} px`, async () => {
      const user = await createUser(db, { role: 'customer', name: `Ottilie Marsh ${width}` });
      const row = await createCase(db, { customerId: user.id, addressLine1: '2 Reedbed Walk', town: 'Quillbury', postcode: 'YY2 6PW' });
      const { page } = await newPage(viewport);
      await signInByLink(page, user.email);
      // The safety box at the top of the supply step reads the same module.
      await page.goto(`/my/cases/${row.id}#step=supply`);
      await waitForIslands(page);
      await expect.poll(() => page.locator('#step-heading').textContent()).toBe('Your meter and fuse');
      expect(await page.locator('main').textContent()).toContain('call 105');
      // The supply photos have a step of their own.
      await page.goto(`/my/cases/${row.id}#step=supplyphotos`);
      await expect.poll(() => page.locator('#step-heading').textContent()).toBe('Photos of your supply');
      const list = page.getByTestId('step-evidence').getByTestId('photo-cautions');
      await list.waitFor();
      const items = await list.locator('li').allTextContents();
      expect(items).toEqual([...customerPhotoCautions]);
      await expect(page.getByTestId('upload-slot-meter_photo').getByTestId('slot-caution').textContent()).resolves.toContain('meter cupboard door');
      await expect(page.getByTestId('upload-slot-consumer_unit_photo').getByTestId('slot-caution').textContent()).resolves.toContain('with its cover closed');
      await expect(page.getByTestId('upload-slot-charger_location_photo').getByTestId('slot-caution').count()).resolves.toBe(0);
      await page.getByTestId('step-evidence').scrollIntoViewIfNeeded();
      await snap(page, `cautions-supply-step-${width}`);
      // The loads' help, on the next step, reads the same module.
      await page.getByTestId('step-next').click();
      await expect.poll(() => page.locator('#step-heading').textContent()).toBe('Big electric loads');
      expect(await page.locator('main').textContent()).toContain('Never take the cover off an appliance to read its rating');
      await page.goto(`/my/cases/${row.id}/photos`);
      await page.getByTestId('photo-caution').waitFor();
      await expect(page.getByTestId('photo-caution').textContent()).resolves.toContain('call 105');
      await snap(page, `cautions-photos-page-${width}`);
      expect(problemsOf(page)).toEqual([]);
    });
  }

  it('shows the chase e-mail’s HTML part, with the cautions, in the fake inbox (390 and 1280 px)', async () => {
    const { client: admin } = await newStaff('admin');
    const email = `inbox-${Date.now()}@example.org`;
    const invited = await admin.send('POST', '/api/cases', { customer: { name: 'Ottilie Marsh', email } });
    expect(invited.status).toBe(201);
    expect((await admin.send('POST', `/api/cases/${invited.body.id}/chase`, {})).status).toBe(200);
    const chase = await waitForMessage(email, 2);
    for (const [width, viewport] of [['390', PHONE], ['1280', DESKTOP]] as const) {
      const { page } = await newPage(viewport);
      await page.goto(`${process.env.MAIL_API_URL}/messages/${chase.id}`);
      const frame = page.frameLocator('iframe[title="HTML part of the message"]');
      await expect(frame.getByText('Staying safe while you take photos:').isVisible()).resolves.toBe(true);
      await expect(frame.locator('li').filter({ hasText: 'call 105' }).count()).resolves.toBe(1);
      await expect(page.locator('pre').textContent()).resolves.toContain('call 105');
      await snap(page, `inbox-chase-html-${width}`);
    }
  });
});

async function signInAdmin(viewport = DESKTOP) {
  const { page } = await newPage(viewport);
  await page.goto('/signin');
  await page.locator('[data-ready="true"]').waitFor();
  await page.getByRole('tab', { name: 'Installer staff' }).click();
  await page.getByLabel('E-mail address').fill('admin@example.com');
  await page.getByLabel('Password').fill(process.env.DEMO_PASSWORD ?? 'groundwork-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL('**/office');
  return page;
}

describe('the settings page names published sources', () => {
  for (const [width, viewport] of [['390', PHONE], ['1280', DESKTOP]] as const) {
    it(`at ${width} px: the On-Site Guide table and the ENA's own route names, no "from memory"`, async () => {
      const page = await signInAdmin(viewport);
      await page.goto('/office/settings');
      await waitForIslands(page);
      // The settings island fetches its values after hydrating.
      await expect.poll(() => page.locator('main').textContent(), { timeout: 15_000 }).toContain('IET On-Site Guide Appendix A, Table A2');
      const text = (await page.locator('main').textContent()) ?? '';
      expect(text).toContain('Connect & Notify');
      expect(text).not.toMatch(/from memory|Electrician's Guide|trade reference/i);
      await snap(page, `settings-sources-${width}`);
    });
  }
});

describe('the demo’s registered cars', () => {
  it('show no plate warning on the customer’s vehicle step once the records answer (390 px)', async () => {
    const { page } = await newPage(PHONE);
    await signInByLink(page, 'sunita.marlowe@example.org');
    const [chandlers] = await db.select().from(schema.cases).where(eq(schema.cases.addressLine1, demoHomes.chandlers.addressLine1));
    await page.goto(`/my/cases/${chandlers!.id}#step=vehicle`);
    await waitForIslands(page);
    const plate = page.getByLabel('Registration number');
    await expect.poll(() => plate.inputValue()).toBe(demoPlates.chandlers.registration);
    // Before the look-up has answered (it starts half a second after the step opens) no warning either.
    expect(await page.locator('main').textContent()).not.toContain('not in use yet');
    // The look-up answers from the fake's records; the age-identifier warning never shows.
    await expect.poll(() => page.locator('main').textContent(), { timeout: 15_000 }).toContain('Larkspur');
    expect(await page.locator('main').textContent()).not.toContain('not in use yet');
    await snap(page, 'demo-chandlers-vehicle-390');
  });

  it('show no plate warning on the office case page, though their age identifier is not issued yet', async () => {
    const [forge] = await db.select().from(schema.cases).where(eq(schema.cases.addressLine1, demoHomes.forge.addressLine1));
    expect(forge, 'the demo seed has the Old Forge').toBeDefined();
    const admin = await signInAdmin();
    await admin.goto(`/office/cases/${forge!.id}`);
    await waitForIslands(admin);
    const vehicle = admin.getByTestId('answers-vehicle');
    await vehicle.waitFor();
    const text = await vehicle.textContent();
    expect(text).toContain(demoPlates.forge.registration);
    expect(text).not.toContain('not in use yet');
    await expect(admin.getByTestId('vehicle-source').textContent()).resolves.toContain(`vehicle records look-up of ${demoPlates.forge.registration}`);
    await vehicle.scrollIntoViewIfNeeded();
    await snap(admin, 'demo-forge-office-1280');
  });
});
