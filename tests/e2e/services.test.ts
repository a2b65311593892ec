// The two optional hosted services in Chromium, against their fakes: a registration pre-fills
// the make (and a petrol car is questioned), the customer opts in to texts, and the office sees
// e-mails and texts together with their status and where the vehicle details came from.
import { afterAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import type { Page } from 'playwright-core';
import { close, DESKTOP, newPage, PHONE, problemsOf, snap, signInByLink, waitForIslands, snapBoth } from './browser';
import { db, schema } from '../helpers/db';
import { createCase, createUser } from '../../seeds/factories';
import { textsTo, uniqueMobile, until } from '../helpers/services';
import { sendReminder } from '@/lib/server/reminders.server';

afterAll(close);

const waitLong = { timeout: 15_000 };


async function savedVehicle(caseId: string) {
  const [row] = await db.select().from(schema.cases).where(eq(schema.cases.id, caseId));
  return (row!.checklist as { vehicle?: { make?: string; registration?: string } }).vehicle ?? {};
}

describe('registration look-up and texts, in Chromium', () => {
  it('a typed registration pre-fills the make; a petrol car is questioned; texts are opted into', async () => {
    const user = await createUser(db, { role: 'customer', name: 'Odile Brackwater' });
    const theCase = await createCase(db, { customerId: user.id, stage: 'invited', invitedDaysAgo: 5 });
    const { page } = await newPage(PHONE);
    await signInByLink(page, user.email);
    await page.goto(`/my/cases/${theCase.id}#step=about`);
    await expect.poll(() => page.locator('#step-heading').textContent(), waitLong).toBe('About you');

    // Texts: a separate, unticked yes for a UK mobile.
    const mobile = uniqueMobile();
    const national = `0${mobile.slice(3)}`;
    await page.getByLabel('Phone number').fill(national);
    await page.getByLabel('Phone number').press('Tab');
    const optIn = page.getByTestId('text-opt-in');
    await expect.poll(() => page.getByLabel('Mobile number for texts').inputValue(), waitLong).not.toBe('');
    await expect(optIn.getByRole('checkbox').isChecked()).resolves.toBe(false);
    await optIn.scrollIntoViewIfNeeded();
    await snapBoth(page, 'checklist-texts-opt-in');
    await optIn.getByRole('button', { name: 'Turn on text reminders' }).click();
    await expect.poll(() => optIn.textContent(), waitLong).toContain('Please tick the box');
    await optIn.getByRole('checkbox').check();
    await optIn.getByRole('button', { name: 'Turn on text reminders' }).click();
    await expect.poll(() => optIn.textContent(), waitLong).toContain('Texts are on');
    await optIn.screenshot({ path: 'screenshots/checklist-texts-on-390.png' });
    const [consent] = await db.select().from(schema.textConsents).where(eq(schema.textConsents.userId, user.id));
    expect(consent!.mobile).toBe(mobile);

    // The vehicle step (after "Your home"): a petrol car on record is questioned in plain words, the make filled in.
    await page.getByTestId('step-next').click();
    await expect.poll(() => page.locator('#step-heading').textContent(), waitLong).toBe('Your home');
    await page.getByTestId('step-next').click();
    await expect.poll(() => page.locator('#step-heading').textContent(), waitLong).toBe('Your vehicle');
    await page.getByLabel('Registration number').fill('gw29pet');
    await expect.poll(() => page.getByLabel('Make').inputValue(), waitLong).toBe('Kestrune');
    await expect.poll(() => page.getByTestId('vehicle-fuel-advice').textContent(), waitLong).toContain('Is this the right car?');
    await expect(page.getByTestId('vehicle-fuel-advice').textContent()).resolves.toContain('petrol');
    await snapBoth(page, 'checklist-vehicle-lookup-petrol');

    // The right plate: the make the look-up filled in is replaced, the question goes, it saves.
    await page.getByLabel('Registration number').fill('GW29 EVA');
    await expect.poll(() => page.getByLabel('Make').inputValue(), waitLong).toBe('Larkspur');
    await expect.poll(() => page.getByTestId('vehicle-fuel-advice').count(), waitLong).toBe(0);
    await expect(page.getByTestId('vehicle-lookup').textContent()).resolves.toContain('blue Larkspur, made in 2025, electric');
    await page.getByLabel('Registration number').press('Tab');
    await expect.poll(() => savedVehicle(theCase.id), waitLong).toMatchObject({ make: 'Larkspur', registration: 'GW29 EVA' });
    await snapBoth(page, 'checklist-vehicle-lookup');

    // A make the customer typed is theirs: a later look-up does not overwrite it.
    await page.getByLabel('Make').fill('Ostrel');
    await page.getByLabel('Registration number').fill('GW29 PHV');
    await expect.poll(() => page.getByTestId('vehicle-fuel-advice').textContent(), waitLong).toContain('hybrid');
    await expect(page.getByLabel('Make').inputValue()).resolves.toBe('Ostrel');

    // A plate the records do not hold never blocks: the customer types the make.
    await page.getByLabel('Registration number').fill('GW29 QQQ');
    await expect.poll(() => page.getByTestId('vehicle-lookup').textContent(), waitLong).toContain('please type the make yourself');
    await page.getByLabel('Registration number').fill('GW29 EVA');
    await page.getByLabel('Make').fill('Larkspur');
    await page.getByLabel('Make').press('Tab');
    await expect.poll(() => savedVehicle(theCase.id), waitLong).toMatchObject({ make: 'Larkspur', registration: 'GW29 EVA' });
    expect(problemsOf(page)).toEqual([]);

    // A reminder at noon goes by e-mail and text; the receipt comes back from the fake.
    expect(await sendReminder(theCase.id, 1, new Date(new Date().setUTCHours(12, 0, 0, 0)))).toMatchObject({ sent: true, text: { sent: true } });
    await until(() => textsTo(mobile), (t) => t.length === 1);
    await until(async () => (await db.select().from(schema.textLog).where(eq(schema.textLog.caseId, theCase.id)))[0]?.status ?? '', (s) => s === 'delivered');

    // The office: e-mails and texts together with their status; the make's source.
    const office = await newPage(DESKTOP);
    await office.page.goto('/signin');
    await office.page.locator('[data-ready="true"]').waitFor();
    await office.page.getByRole('tab', { name: 'Installer staff' }).click();
    await office.page.getByLabel('E-mail address').fill('admin@example.com');
    await office.page.getByLabel('Password').fill(process.env.DEMO_PASSWORD ?? 'groundwork-demo');
    await office.page.getByRole('button', { name: 'Sign in' }).click();
    await office.page.waitForURL('**/office**');
    await office.page.goto(`/office/cases/${theCase.id}`);
    await waitForIslands(office.page);
    const messages = office.page.getByTestId('messages');
    await expect.poll(() => messages.textContent(), waitLong).toContain('Delivered');
    await expect(office.page.getByTestId('message-text').count()).resolves.toBe(1);
    await expect(office.page.getByTestId('message-email').count()).resolves.toBeGreaterThanOrEqual(1);
    await expect(office.page.getByTestId('vehicle-source').textContent()).resolves.toContain('Make from the vehicle records look-up of GW29 EVA');
    await expect(office.page.getByTestId('text-consent').textContent()).resolves.toContain('Texts: agreed');
    await office.page.getByTestId('message-text').locator('summary').click();
    await expect(office.page.getByTestId('message-text').textContent()).resolves.toContain('[sign-in link]');
    await office.page.locator('#messages').screenshot({ path: 'screenshots/office-messages-1280.png' });
    await office.page.locator('#answers').screenshot({ path: 'screenshots/office-vehicle-source-1280.png' });
    await office.page.setViewportSize(PHONE);
    await office.page.locator('#messages').screenshot({ path: 'screenshots/office-messages-390.png' });
    await snap(office.page, 'office-case-messages-390');
    expect(problemsOf(office.page)).toEqual([]);
  });
});
