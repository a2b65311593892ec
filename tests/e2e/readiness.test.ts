// Readiness in Chromium: a customer's answers produce the checks they see in plain words.
import { afterAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { close, DESKTOP, newPage, PHONE, problemsOf, snap, signInByLink } from './browser';
import { db } from '../helpers/db';
import { createCase, createUser } from '../../seeds/factories';
import { newStaff } from '../helpers/people';

afterAll(close);

const noLoads = { cooker: false, immersion: false, heatPumpKw: 0, storageHeaters: 0, otherEvCharger: false, solarPv: false, socketCircuits: 1 };


const headroom = (page: Page) => page.getByTestId('check-supply-headroom');

describe('readiness on the Check and send step', () => {
  it('shows headroom red for a 60 A fuse with a 10.5 kW shower, still red at 100 A by Table A2, and clear once a measured demand is recorded', async () => {
    // Worked by hand (IET On-Site Guide Table A2, second-hand via The Electrician's Guide Table 6.2):
    // one 32 A socket circuit at 100 % = 32 A, lighting 66 % × 2000 W / 230 V = 5.74 A (load assumed,
    // common practice), shower 10.5 kW / 230 V = 45.65 A at 100 % (largest instantaneous water
    // heater), + 32 A for a 7.4 kW charger with no diversity (BS 7671 722.311) = 115.39 A.
    // 115.39 A > 60 A → red; > 100 A too → still red: Table A2 is conservative, as published.
    // With two socket circuits (chosen in the form): 32 + 12.8 = 44.8 A → 128.19 A, red on 100 A.
    // A measured maximum demand of 40 A (logger data, recorded by the office) + 32 A = 72 A →
    // 28 A spare on 100 A ≥ the 10 A margin → green.
    const user = await createUser(db, { role: 'customer', name: 'Soren Hale' });
    const theCase = await createCase(db, {
      customerId: user.id,
      stage: 'filling_in',
      checklist: {
        vehicle: { chargePort: 'front-left' },
        supply: { mainFuseAmps: 60, looped: 'no', loads: { showerKw: 10.5, ...noLoads } },
        charger: { preference: 'tethered', tetherMetres: 5, ratingKw: 7.4 },
        parking: { kind: 'attached-drive', cars: 1, habit: 'nose-in' },
      },
    });
    const { page, context } = await newPage(PHONE);
    await signInByLink(page, user.email);
    await page.goto(`/my/cases/${theCase.id}#step=review`);
    await expect.poll(() => headroom(page).getAttribute('data-light'), { timeout: 15_000 }).toBe('red');
    await expect(headroom(page).textContent()).resolves.toContain('more than your 60 A main fuse');
    await expect(headroom(page).textContent()).resolves.toContain('about 115.4 A'); // 115.39 A to one decimal place
    await snap(page, 'readiness-red-390');

    await page.goto(`/my/cases/${theCase.id}#step=supply`);
    await page.getByRole('radio', { name: '100 A' }).check();
    await expect.poll(() => page.getByTestId('save-status').textContent(), { timeout: 10_000 }).toBe('Saved');
    // Phases sit with the fuse box and earthing, the socket circuits with the big loads.
    await page.goto(`/my/cases/${theCase.id}#step=fusebox`);
    await page.getByRole('radio', { name: 'Single phase' }).check();
    await expect.poll(() => page.getByTestId('save-status').textContent(), { timeout: 10_000 }).toBe('Saved');
    await page.getByText('Is your supply single phase or three phase?').scrollIntoViewIfNeeded();
    await snap(page, 'supply-phases-390');
    await page.setViewportSize(DESKTOP);
    await snap(page, 'supply-phases-1280');
    await page.setViewportSize(PHONE);
    await page.goto(`/my/cases/${theCase.id}#step=loads`);
    await page.getByRole('radio', { name: '2', exact: true }).check();
    await expect.poll(() => page.getByTestId('save-status').textContent(), { timeout: 10_000 }).toBe('Saved');
    await page.setViewportSize(DESKTOP);
    await page.getByText('How many socket circuits does your consumer unit have?').scrollIntoViewIfNeeded();
    await snap(page, 'supply-socket-circuits-1280');
    await page.setViewportSize(PHONE);
    await page.goto(`/my/cases/${theCase.id}#step=review`);
    await page.reload();
    await expect.poll(() => headroom(page).getAttribute('data-light'), { timeout: 15_000 }).toBe('red');
    await expect(headroom(page).textContent()).resolves.toContain('more than your 100 A main fuse');
    await expect(headroom(page).textContent()).resolves.toContain('about 128.2 A');

    // The office records a measured maximum demand from logger data: it replaces the estimate.
    const { client: office } = await newStaff('admin');
    expect((await office.send('PUT', `/api/cases/${theCase.id}/site-measures`, { measuredMaxDemandAmps: 40 })).status).toBe(200);
    await page.reload();
    await expect.poll(() => headroom(page).getAttribute('data-light'), { timeout: 15_000 }).toBe('green');
    await expect(headroom(page).textContent()).resolves.toContain('comfortably within your 100 A main fuse');
    await expect(headroom(page).textContent()).resolves.toContain('readings taken');
    await page.evaluate(() => window.scrollTo(0, 0));
    await snap(page, 'check-and-send-390');
    await page.setViewportSize(DESKTOP);
    await snap(page, 'check-and-send-1280');
    await page.setViewportSize(PHONE);

    // The "Which charge point" step leads to the driveway plan, which gives a reach verdict.
    await page.goto(`/my/cases/${theCase.id}#step=chargepoint`);
    await page.getByRole('link', { name: 'Draw my driveway' }).click();
    await page.waitForURL(`**/my/cases/${theCase.id}/plan`);
    await expect.poll(() => page.getByTestId('plan-verdict-nose-in').textContent(), { timeout: 15_000 }).toMatch(/reach/i);
    expect(problemsOf(page)).toEqual([]);
    await context.close();
  });
});
