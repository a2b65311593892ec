import { afterAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { close, DESKTOP, newPage, PHONE, problemsOf, snap, signInByLink } from './browser';
import { db, schema } from '../helpers/db';
import { createCase, createUser } from '../../seeds/factories';
import { drivewayPlanSchema } from '@/lib/readiness/plan';
import type { Page } from 'playwright-core';

afterAll(close);

// Reach geometry worked by hand, from the starting plan: wall 6 m; one bay 2.4 × 4.8 m, 0.5 m out,
// its left edge 1.8 m from the wall's left corner; charge point on the wall; a medium car
// (4.5 × 1.85 m, from memory); front-left port 0.8 m back from the bumper; 1 m slack (both
// common practice, no published source); the 5 m tethered cable from the checklist.
// Plan coordinates (src/lib/readiness/plan.ts) run x from the wall's right end as seen from the
// street, so a charge point d m from the left corner is at x = 6 − d; the bay is x 1.8..4.2,
// y 0.5..5.3, centre (3, 2.9); the car body x 2.075..3.925, y 0.65..5.15.
// Nose in (facing the house) the driver's left is +x: port (3 + 0.925, 2.9 − 1.45) = (3.925, 1.45).
// Reversed in the driver's left is −x: port (3 − 0.925, 2.9 + 1.45) = (2.075, 4.35).
//  - Charge point 3 m along, at (3, 0). Nose in: the straight line crosses the bonnet, so the
//    cable goes round the front corner (3.925, 0.65): √(0.925² + 0.65²) = √1.278125 = 1.1305,
//    + 0.8 down the side = 1.9305, + 1 slack = 2.93 m → "2.9 m of 5 m".
//    Reversed: round (2.075, 0.65): 1.1305 + 3.7 = 4.8305, + 1 = 5.83 m → "needs 5.8 m".
//  - 5 m along, at (1, 0). Nose in: the line to (3.925, 0.65) passes between wall and bonnet,
//    √(2.925² + 0.65²) = √8.978125 = 2.9964, + 0.8 + 1 = 4.796 m → reaches, "4.8 m of 5 m".
//  - 5.3 m along, at (0.7, 0): √(3.225² + 0.65²) = √10.823125 = 3.2899, + 0.8 + 1 = 5.09 m
//    → doesn't reach, "needs 5.1 m".


// Astro drops the island's `ssr` attribute once React has hydrated it: only then do keys count.
async function openPlan(page: Page, caseId: string) {
  await page.goto(`/my/cases/${caseId}/plan`);
  await page.locator('astro-island:not([ssr]) [data-testid="driveway-plan"]').waitFor();
}

const verdictLocator = (page: Page, way: string) => page.getByTestId(`plan-verdict-${way}`);
// The verdicts keep each figure and its unit together with a no-break space; compare as plain text.
const verdictText = async (page: Page, way: string) => (await verdictLocator(page, way).textContent())?.replace(/\u00a0/g, ' ');

describe('the driveway plan, in Chromium', () => {
  it('moves the charge point by keyboard and button, shows the reach change, and keeps the plan', async () => {
    const user = await createUser(db, { role: 'customer', name: 'Ines Calloway' });
    const row = await createCase(db, {
      customerId: user.id,
      addressLine1: '12 Larkspur Row',
      town: 'Quillbury',
      postcode: 'AB1 2DE',
      checklist: { vehicle: { chargePort: 'front-left' }, charger: { preference: 'tethered', tetherMetres: 5 }, parking: { habit: 'varies' } },
    });
    const { page, context } = await newPage(PHONE);
    await signInByLink(page, user.email);
    await openPlan(page, row.id);
    await expect(page.getByTestId('plan-heading').textContent()).resolves.toBe('Draw your driveway');
    const from = page.getByRole('textbox', { name: /^From the left corner of the wall/ });
    await expect(from.inputValue()).resolves.toBe('3');
    await expect(page.getByTestId('plan-cable-length').textContent()).resolves.toBe('Your tethered cable: 5 m.');
    await expect(verdictText(page, 'nose-in')).resolves.toContain('Reaches when you park nose in — 2.9 m of 5 m');
    await expect(verdictText(page, 'reverse-in')).resolves.toContain('Doesn’t reach when you reverse in — needs 5.8 m');
    await expect(page.getByTestId('plan-caution').textContent()).resolves.toContain('BS 7671');
    await expect(page.getByTestId('plan-save-status').getAttribute('data-status')).resolves.toBe('unsaved');

    // Keyboard: Shift+→ moves the picked item 0.5 m; four presses take it from 3 m to 5 m.
    for (let i = 1; i <= 4; i += 1) {
      // One press at a time, waiting for the move to land, so a re-render cannot swallow a key.
      await page.getByRole('button', { name: /^Charge point, [\d.]+ metres from the left corner/ }).focus();
      await page.keyboard.press('Shift+ArrowRight');
      await expect.poll(() => from.inputValue()).toBe(String(3 + 0.5 * i));
    }
    await expect(from.inputValue()).resolves.toBe('5');
    await expect(verdictText(page, 'nose-in')).resolves.toContain('Reaches when you park nose in — 4.8 m of 5 m');
    await expect(verdictLocator(page, 'nose-in').getAttribute('data-reaches')).resolves.toBe('true');

    // Button: three 10 cm steps to 5.3 m, where the nose-in cable no longer reaches.
    const right = page.getByRole('button', { name: 'Move the charge point right by 10 cm' });
    for (let i = 0; i < 3; i += 1) await right.click();
    await expect(from.inputValue()).resolves.toBe('5.3');
    await expect(verdictText(page, 'nose-in')).resolves.toContain('Doesn’t reach when you park nose in — needs 5.1 m');
    await expect(verdictLocator(page, 'nose-in').getAttribute('data-reaches')).resolves.toBe('false');
    await expect(page.getByTestId('plan-charge-point-dimension').textContent()).resolves.toBe('5.3 m');

    await page.locator('[data-testid="plan-save-status"][data-status="saved"]').waitFor({ timeout: 10_000 });
    await page.evaluate(() => window.scrollTo(0, 0));
    await snap(page, 'plan-390');

    // Saved through the API: the row holds a plan the readiness schema reads, charge point at
    // x = 6 − 5.3 = 0.7 m.
    const [saved] = await db.select().from(schema.cases).where(eq(schema.cases.id, row.id));
    const plan = (saved?.checklist as { charger?: { plan?: unknown; tetherMetres?: number } }).charger?.plan;
    const parsed = drivewayPlanSchema.safeParse(plan);
    expect(parsed.success).toBe(true);
    expect(parsed.data?.chargePoint.x).toBeCloseTo(0.7, 6);
    expect(parsed.data?.wall).toEqual({ x0: 0, x1: 6 });
    expect(parsed.data?.bays).toHaveLength(1);
    // The rest of the charger section is untouched by the plan's PATCH.
    expect((saved?.checklist as { charger?: { tetherMetres?: number } }).charger?.tetherMetres).toBe(5);

    await page.reload();
    await page.locator('astro-island:not([ssr]) [data-testid="driveway-plan"]').waitFor();
    await expect(page.getByRole('textbox', { name: /^From the left corner of the wall/ }).inputValue()).resolves.toBe('5.3');
    await expect(verdictText(page, 'nose-in')).resolves.toContain('needs 5.1 m');
    await expect(page.getByTestId('plan-save-status').getAttribute('data-status')).resolves.toBe('saved');

    await page.setViewportSize(DESKTOP);
    await page.evaluate(() => window.scrollTo(0, 0));
    await snap(page, 'plan-1280');
    expect(problemsOf(page)).toEqual([]);
    await context.close();
  });

  it('adds a garage and a bay behind it, and measures only the bay the electric car uses', async () => {
    // Bay 2 goes behind bay 1: y 5.3..10.1, centre (3, 7.7), car body y 5.45..9.95; charge point
    // at (3, 0). The car in bay 1 (x 2.075..3.925, y 0.65..5.15) is an obstacle too, since the
    // customer has not said there is only one car. Nose in: front-left port (3.925, 6.25): round bay
    // 1's near corner (3.925, 0.65), √(0.925² + 0.65²) = √1.278125 = 1.1305, then along its side and
    // through the gap to the port, 6.25 − 0.65 = 5.6: 6.7305 + 1 slack = 7.731 m → "needs 7.7 m".
    // Reversed: port (2.075, 9.15), round (2.075, 0.65): 1.1305 + 8.5 + 1 = 10.631 → "needs 10.6 m".
    const user = await createUser(db, { role: 'customer', name: 'Tomasz Ferrant' });
    const row = await createCase(db, {
      customerId: user.id,
      checklist: { vehicle: { chargePort: 'front-left' }, charger: { preference: 'tethered', tetherMetres: 5 }, parking: { habit: 'varies' } },
    });
    const { page, context } = await newPage(PHONE);
    await signInByLink(page, user.email);
    await openPlan(page, row.id);
    await page.getByRole('button', { name: 'Add one behind it' }).click();
    // No bay marked: both are measured, each way (bay 1 as before: 2.9 m and 5.8 m).
    await expect(verdictText(page, 'nose-in-1')).resolves.toContain('2.9 m of 5 m');
    await expect(verdictText(page, 'nose-in-2')).resolves.toContain('needs 7.7 m');
    await page.getByTestId('plan-section-bay-1').getByLabel('Garage').check();
    await expect(page.getByTestId('plan-bay-1').getAttribute('aria-label')).resolves.toMatch(/^Garage 1,/);
    await page.getByTestId('plan-section-ev-bay').getByLabel('Bay 2').check();
    await expect(verdictText(page, 'nose-in')).resolves.toContain('Doesn’t reach when you park nose in — needs 7.7 m');
    await expect(verdictText(page, 'reverse-in')).resolves.toContain('Doesn’t reach when you reverse in — needs 10.6 m');
    await expect(page.getByTestId('plan-verdict-nose-in-1').count()).resolves.toBe(0);
    await page.getByTestId('plan-way-toggle').getByText('Reversing in').click();
    await expect(page.getByTestId('plan-cable').count()).resolves.toBe(1);
    await page.locator('[data-testid="plan-save-status"][data-status="saved"]').waitFor({ timeout: 10_000 });
    await snap(page, 'plan-two-bays-390');

    const [saved] = await db.select().from(schema.cases).where(eq(schema.cases.id, row.id));
    const parsed = drivewayPlanSchema.safeParse((saved?.checklist as { charger?: { plan?: unknown } }).charger?.plan);
    expect(parsed.success).toBe(true);
    expect(parsed.data?.bays.map((b) => [b.y, b.forEv ?? null])).toEqual([
      [0.5, null],
      [5.3, true],
    ]);

    // Dragging works too: pull the charge point about 80 px to the left along the wall.
    const point = page.getByTestId('plan-charge-point');
    await point.scrollIntoViewIfNeeded();
    const box = (await point.boundingBox())!;
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width / 2 - 40, box.y + box.height / 2 + 30, { steps: 4 });
    await page.mouse.move(box.x + box.width / 2 - 80, box.y + box.height / 2 + 60, { steps: 4 });
    await page.mouse.up();
    const along = Number(await page.getByRole('textbox', { name: /^From the left corner of the wall/ }).inputValue());
    expect(along).toBeLessThan(2.5);
    expect(along).toBeGreaterThan(0);
    expect(problemsOf(page)).toEqual([]);
    await context.close();
  });

  it('with one car in the household, the other bay is empty and the cable goes straight', async () => {
    // The same driveway as above, but the parking step says one car: bay 1 holds nothing. Nose
    // in: from the charge point (3, 0) straight to the port (3.925, 6.25) — the car's own body is
    // not in its own way — √(0.925² + 6.25²) = √39.918125 = 6.318, + 1 slack = 7.318 → "needs
    // 7.3 m". Reversed: to (2.075, 9.15), √(0.925² + 9.15²) = √84.578125 = 9.197, + 1 = 10.197 →
    // "needs 10.2 m". (Worked by hand from the geometry above.)
    const user = await createUser(db, { role: 'customer', name: 'Odile Marchbank' });
    const row = await createCase(db, {
      customerId: user.id,
      checklist: { vehicle: { chargePort: 'front-left' }, charger: { preference: 'tethered', tetherMetres: 5 }, parking: { habit: 'varies', cars: 1 } },
    });
    const { page, context } = await newPage(PHONE);
    await signInByLink(page, user.email);
    await openPlan(page, row.id);
    await page.getByRole('button', { name: 'Add one behind it' }).click();
    await expect(verdictText(page, 'nose-in-2')).resolves.toContain('needs 7.3 m');
    await expect(verdictText(page, 'reverse-in-2')).resolves.toContain('needs 10.2 m');
    expect(problemsOf(page)).toEqual([]);
    await context.close();
  });

  it('answers 404 for a case that is not the customer’s', async () => {
    const owner = await createUser(db, { role: 'customer' });
    const other = await createUser(db, { role: 'customer' });
    const row = await createCase(db, { customerId: owner.id });
    const { page, context } = await newPage(PHONE);
    await signInByLink(page, other.email);
    const response = await page.goto(`/my/cases/${row.id}/plan`);
    expect(response?.status()).toBe(404);
    await expect(page.getByTestId('driveway-plan').count()).resolves.toBe(0);
    await context.close();
  });
});
