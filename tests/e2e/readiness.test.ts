// Readiness in Chromium: a customer's answers produce the checks they see in plain words.
import { afterAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { close, DESKTOP, newPage, PHONE, problemsOf, snap, signInByLink } from './browser';
import { db } from '../helpers/db';
import { createCase, createUser } from '../../seeds/factories';

afterAll(close);

const noLoads = { cooker: false, immersion: false, heatPumpKw: 0, storageHeaters: 0, otherEvCharger: false, solarPv: false };


const headroom = (page: Page) => page.getByTestId('check-supply-headroom');

describe('readiness on the Check and send step', () => {
  it('shows headroom red for a 60 A fuse with a 10.5 kW shower, and clear once the fuse is 100 A', async () => {
    // Worked by hand: shower 10.5 kW / 230 V = 45.65 A at 100 % (IET On-Site Guide Table A2,
    // largest instantaneous water heater), + 10 A lighting and sockets baseline (common practice),
    // + 32 A charger with no diversity (BS 7671 722.311) = 87.65 A.
    // 87.65 A > 60 A → red; 100 A − 87.65 A = 12.35 A spare ≥ the 10 A margin → green.
    const user = await createUser(db, { role: 'customer', name: 'Soren Hale' });
    const theCase = await createCase(db, {
      customerId: user.id,
      stage: 'filling_in',
      checklist: {
        vehicle: { chargePort: 'front-left' },
        supply: { mainFuseAmps: 60, looped: 'no', loads: { showerKw: 10.5, ...noLoads } },
        charger: { preference: 'tethered', tetherMetres: 5 },
        parking: { kind: 'attached-drive', cars: 1, habit: 'nose-in' },
      },
    });
    const { page, context } = await newPage(PHONE);
    await signInByLink(page, user.email);
    await page.goto(`/my/cases/${theCase.id}#step=review`);
    await expect.poll(() => headroom(page).getAttribute('data-light'), { timeout: 15_000 }).toBe('red');
    await expect(headroom(page).textContent()).resolves.toContain('more than your 60 A main fuse');
    await expect(headroom(page).textContent()).resolves.toContain('about 87.7 A'); // 87.65 A to one decimal place
    await snap(page, 'readiness-red-390');

    await page.goto(`/my/cases/${theCase.id}#step=supply`);
    await page.getByRole('radio', { name: '100 A' }).check();
    await expect.poll(() => page.getByTestId('save-status').textContent(), { timeout: 10_000 }).toBe('Saved');
    await page.goto(`/my/cases/${theCase.id}#step=review`);
    await page.reload();
    await expect.poll(() => headroom(page).getAttribute('data-light'), { timeout: 15_000 }).toBe('green');
    await expect(headroom(page).textContent()).resolves.toContain('comfortably within your 100 A main fuse');
    await page.evaluate(() => window.scrollTo(0, 0));
    await snap(page, 'check-and-send-390');
    await page.setViewportSize(DESKTOP);
    await snap(page, 'check-and-send-1280');
    await page.setViewportSize(PHONE);

    // The charge point step leads to the driveway plan, which gives a reach verdict.
    await page.goto(`/my/cases/${theCase.id}#step=charger`);
    await page.getByRole('link', { name: 'Draw my driveway' }).click();
    await page.waitForURL(`**/my/cases/${theCase.id}/plan`);
    await expect.poll(() => page.getByTestId('plan-verdict-nose-in').textContent(), { timeout: 15_000 }).toMatch(/reach/i);
    expect(problemsOf(page)).toEqual([]);
    await context.close();
  });
});
