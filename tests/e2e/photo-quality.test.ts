// The photo check in Chromium: a customer on a 390 px phone sends a blurred cut-out photo, is
// told at once in plain words with a drawing of a good one, takes it again (the blurred one is
// replaced), then sends a dark meter photo and keeps it; the office sees the flag in the queue
// (filter "Photos flagged", kept in the URL) and on the case page. Photos drawn in the test.
import { afterAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { close, DESKTOP, newPage, openPhotos, PHONE, problemsOf, signInByLink, signInStaff, slotFileInput, snap, uploadSlot, waitForIslands } from './browser';
import { db, schema } from '../helpers/db';
import { createCase, createUser } from '../../seeds/factories';
import { sharpPhoto, spoil } from '../fixtures/photo-quality';

afterAll(close);

const marker = `Pqe${Date.now().toString(36)}`;
const waitLong = { timeout: 20_000 };

async function customer(name: string) {
  const user = await createUser(db, { role: 'customer', name: `${name} ${marker}`, email: `${marker.toLowerCase()}-${name.toLowerCase()}@example.org` });
  const row = await createCase(db, { customerId: user.id, addressLine1: '12 Larch Row', town: 'Quillbury', postcode: 'AB3 5EF' });
  return { user, row };
}

const slot = uploadSlot;
const fileInput = slotFileInput;
const rowsOf = (caseId: string) => db.select().from(schema.uploads).where(eq(schema.uploads.caseId, caseId));


describe('photo check at upload, in Chromium', () => {
  it('tells the customer at once, and lets them take it again or keep it; the office sees the flag', async () => {
    const { user, row } = await customer('Ivo');
    const sharp = await sharpPhoto(1);
    const { page, context } = await newPage(PHONE);
    await signInByLink(page, user.email);
    await openPhotos(page, row.id);

    // A blurred photo of the cut-out: flagged in the second after it is sent.
    const cutout = slot(page, 'cutout_photo');
    await fileInput(page, 'cutout_photo').setInputFiles({ name: 'fuse-blurred.jpg', mimeType: 'image/jpeg', buffer: await spoil.blurred(sharp) });
    const check = cutout.getByTestId('photo-check');
    await check.waitFor(waitLong);
    await expect(check.getByTestId('photo-problems').locator('li').evaluateAll((lis) => lis.map((li) => li.getAttribute('data-code')))).resolves.toEqual(['blurry']);
    await expect(check.textContent()).resolves.toContain('This photo looks blurred, so the small print on it may not be readable.');
    await expect(check.textContent()).resolves.toContain('The fuse rating (60, 80 or 100 A) is usually printed on the fuse carrier');
    await expect(check.getByTestId('good-photo-picture').isVisible()).resolves.toBe(true);
    await expect(check.getByRole('button', { name: 'Keep this one' }).isVisible()).resolves.toBe(true);
    await check.scrollIntoViewIfNeeded();
    await snap(page, 'photo-check-flagged-390');
    const [blurred] = await rowsOf(row.id);
    expect(blurred).toMatchObject({ kind: 'cutout_photo', qualityOk: false });

    // Take again: the sharp one replaces the blurred one, and the prompt goes.
    await check.getByTestId('retake-input').setInputFiles({ name: 'fuse.jpg', mimeType: 'image/jpeg', buffer: sharp });
    await check.waitFor({ state: 'detached', ...waitLong });
    await expect.poll(async () => (await rowsOf(row.id)).map((r) => [r.originalName, r.qualityOk]), waitLong).toEqual([['fuse.jpg', true]]);
    await expect.poll(() => cutout.getByTestId('uploaded-file').count(), waitLong).toBe(1);
    await expect(cutout.getByTestId('kept-flag').count()).resolves.toBe(0);

    // A dark meter photo, kept as it is: the prompt folds into a note beside the file; the office decides.
    const meter = slot(page, 'meter_photo');
    await fileInput(page, 'meter_photo').setInputFiles({ name: 'meter-dark.jpg', mimeType: 'image/jpeg', buffer: await spoil.darkened(await sharpPhoto(2)) });
    await meter.getByTestId('photo-check').waitFor(waitLong);
    await expect(meter.getByTestId('photo-check').textContent()).resolves.toContain('This photo is too dark to read.');
    await meter.getByRole('button', { name: 'Keep this one' }).click();
    await meter.getByTestId('photo-check').waitFor({ state: 'detached' });
    await expect(meter.getByTestId('kept-flag').textContent()).resolves.toContain('This photo is too dark to read. Your installer will decide.');
    await meter.scrollIntoViewIfNeeded();
    await snap(page, 'photo-check-kept-390');
    expect((await rowsOf(row.id)).map((r) => [r.kind, r.qualityOk]).sort()).toEqual([
      ['cutout_photo', true],
      ['meter_photo', false],
    ]);
    // After a reload the kept photo still says what was found, without asking again.
    await openPhotos(page, row.id);
    await expect(meter.getByTestId('kept-flag').isVisible()).resolves.toBe(true);
    await expect(page.getByTestId('photo-check').count()).resolves.toBe(0);
    expect(problemsOf(page)).toEqual([]);
    await context.close();

    // The office: the queue's "Photos flagged" filter, kept in the URL, and the flag on the case page.
    const office = await newPage(DESKTOP);
    await signInStaff(office.page, 'admin@example.com');
    await office.page.waitForURL('**/office');
    await office.page.goto(`/office?q=${marker}`);
    await waitForIslands(office.page);
    const queueRows = office.page.locator('[data-testid="queue-table"] [data-testid="queue-row"]');
    await queueRows.first().waitFor(waitLong);
    await office.page.getByTestId('filter-photos-flagged').check();
    await expect.poll(() => new URL(office.page.url()).searchParams.get('photos'), waitLong).toBe('flagged');
    await expect.poll(() => queueRows.count(), waitLong).toBe(1);
    await expect(queueRows.first().getByTestId('photos-flagged').textContent()).resolves.toBe('1 photo flagged');
    await snap(office.page, 'office-queue-photos-flagged-1280');
    await office.page.setViewportSize(PHONE);
    await snap(office.page, 'office-queue-photos-flagged-390');
    await office.page.setViewportSize(DESKTOP);

    // The thresholds are settings, each with its meaning, default and where it comes from.
    await office.page.goto('/office/settings');
    const photoSettings = office.page.locator('fieldset', { hasText: 'Photo checks at upload' });
    await photoSettings.waitFor(waitLong);
    const sharpness = office.page.getByTestId('setting-photoSharpnessMin');
    await expect(sharpness.textContent()).resolves.toContain('variance of the Laplacian');
    await expect(sharpness.textContent()).resolves.toContain('Common practice — no published source');
    await expect(office.page.getByLabel('Photo sharpness, at least').inputValue()).resolves.toBe('100');
    await photoSettings.screenshot({ path: 'screenshots/settings-photo-checks-1280.png' });
    await office.page.setViewportSize(PHONE);
    await photoSettings.screenshot({ path: 'screenshots/settings-photo-checks-390.png' });
    await office.page.setViewportSize(DESKTOP);

    await office.page.goto(`/office/cases/${row.id}`);
    await waitForIslands(office.page);
    const flags = office.page.getByTestId('upload-group-meter_photo').getByTestId('photo-flags');
    await flags.waitFor(waitLong);
    await expect(flags.textContent()).resolves.toContain('Photo check: Too dark');
    await expect(office.page.getByTestId('upload-group-cutout_photo').getByTestId('photo-flags').count()).resolves.toBe(0);
    // Reject with the check's words: the reason box fills with what the customer was told.
    await office.page.getByTestId('upload-group-meter_photo').getByRole('button', { name: 'Reject…' }).click();
    await office.page.getByRole('button', { name: 'Use the photo check’s words' }).click();
    await expect(office.page.getByLabel('Reason the customer will read').inputValue()).resolves.toMatch(/^This photo is too dark to read\. Get the whole meter in/);
    await flags.scrollIntoViewIfNeeded();
    await snap(office.page, 'office-photo-flags-1280');
    await office.page.setViewportSize(PHONE);
    await flags.scrollIntoViewIfNeeded();
    await snap(office.page, 'office-photo-flags-390');
    expect(problemsOf(office.page)).toEqual([]);
    await office.context.close();
  });

  it('shows the prompt at 1280 px too', async () => {
    const { user, row } = await customer('Wynn');
    const { page, context } = await newPage(DESKTOP);
    await signInByLink(page, user.email);
    await openPhotos(page, row.id);
    await fileInput(page, 'consumer_unit_photo').setInputFiles({ name: 'unit.jpg', mimeType: 'image/jpeg', buffer: await spoil.overExposed(await sharpPhoto(3)) });
    const check = slot(page, 'consumer_unit_photo').getByTestId('photo-check');
    await check.waitFor(waitLong);
    await expect(check.textContent()).resolves.toContain('This photo is too bright: parts of it have turned white.');
    await check.scrollIntoViewIfNeeded();
    await snap(page, 'photo-check-flagged-1280');
    await slot(page, 'consumer_unit_photo').getByRole('button', { name: 'Keep this one' }).click();
    await check.waitFor({ state: 'detached' });
    await expect(slot(page, 'consumer_unit_photo').getByTestId('kept-flag').textContent()).resolves.toContain('parts of it have turned white');
    await snap(page, 'photo-check-kept-1280');
    expect(problemsOf(page)).toEqual([]);
    await context.close();
  });
});
