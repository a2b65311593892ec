// Uploading evidence in Chromium: a customer signs in by the e-mailed link, sends a photo from a
// slot with Uppy (progress bar visible), sees its thumbnail and status, and removes it.
import { afterAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import type { BrowserContext, Page } from 'playwright-core';
import { baseUrl, close, DESKTOP, newPage, openPhotos, PHONE, problemsOf, slotFileInput, snap, signInByLink, uploadSlot } from './browser';
import { db, schema } from '../helpers/db';
import { createCase, createUser } from '../../seeds/factories';
import { noisyJpeg, smallImage, tinyPdf } from '../fixtures/uploads';
import { sharpPhoto, spoil } from '../fixtures/photo-quality';

afterAll(close);


/** A tenant with a new car, so the landlord's permission and the order agreement are asked for too. */
async function tenantWithCase(name: string) {
  const user = await createUser(db, { role: 'customer', name });
  const row = await createCase(db, {
    customerId: user.id,
    addressLine1: '7 Sorrel Lane',
    town: 'Quillbury',
    postcode: 'AB1 3EF',
    checklist: { about: { tenure: 'tenant' }, vehicle: { condition: 'new' } },
  });
  return { user, row };
}

const slot = uploadSlot;
const fileInput = slotFileInput;
const dropZoneOrWidget = '[data-testid="drop-zone"], .uppy-Dashboard';
/** Scripts the page has fetched so far. */
const scriptsLoaded = (page: Page) =>
  page.evaluate(() => performance.getEntriesByType('resource').map((e) => e.name).filter((name) => name.endsWith('.js')));

/** Chromium's network emulation slows the upload so the progress bar is on screen long enough to see. */
async function throttleUploads(context: BrowserContext, page: Page, bytesPerSecond: number | -1) {
  const cdp = await context.newCDPSession(page);
  await cdp.send('Network.enable');
  await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: bytesPerSecond });
}

// The 415 in the last step is expected; Chromium reports every 4xx resource as a console error.
const unexpected = (page: Page) => problemsOf(page).filter((p) => !/status of 415/.test(p));

describe('photos and documents, in Chromium', () => {
  it('sends a photo with a progress bar, shows its thumbnail and status, and removes it', async () => {
    const { user, row } = await tenantWithCase('Orla Fenwick');
    const { page, context } = await newPage(PHONE);
    await signInByLink(page, user.email);
    await openPhotos(page, row.id);
    await expect(page.getByTestId('photos-heading').textContent()).resolves.toBe('Photos and documents');
    // The answers call for these: four photos always, the order agreement (new car), the landlord's permission (tenant).
    for (const kind of ['meter_photo', 'cutout_photo', 'consumer_unit_photo', 'charger_location_photo', 'order_agreement', 'landlord_permission']) {
      await expect(slot(page, kind).getByTestId('slot-status').textContent()).resolves.toBe('Still needed');
    }
    await expect(slot(page, 'parking_evidence').getByTestId('slot-status').textContent()).resolves.toBe('Optional');
    await expect(slot(page, 'cutout_photo').textContent()).resolves.toContain('The fuse carrier with its rating (60, 80 or 100 A) readable');
    const photoCaution = await page.getByTestId('photo-caution').textContent();
    // The cautions from src/lib/cautions.ts: photos only, cover closed, meter cupboard, appliance rating, 105.
    expect(photoCaution).toContain('remove covers: photos only');
    expect(photoCaution).toContain('with its cover closed');
    expect(photoCaution).toContain('meter cupboard door to look');
    expect(photoCaution).toContain('read its rating');
    expect(photoCaution).toContain('call 105');
    await snap(page, 'uploads-empty-390');

    // Uppy (about 65 KB compressed) is not fetched until a slot is used.
    expect((await scriptsLoaded(page)).filter((name) => /upload-widget/.test(name))).toEqual([]);

    // A noisy 3000 × 3000 photo: resized in the browser to 2560 × 2560 (the long edge chosen in
    // upload-widget.tsx), still several MB, so at 2 MB/s the progress bar is on screen for a while.
    const photo = await noisyJpeg(3000, 3000);
    await throttleUploads(context, page, 2 * 1024 * 1024);
    await fileInput(page, 'cutout_photo').setInputFiles({ name: 'fuse.jpg', mimeType: 'image/jpeg', buffer: photo });
    const progress = slot(page, 'cutout_photo').locator('.uppy-StatusBar.is-uploading .uppy-StatusBar-progress');
    await progress.waitFor({ state: 'visible', timeout: 10_000 });
    await expect(slot(page, 'cutout_photo').locator('.uppy-Dashboard-Item').count()).resolves.toBe(1);
    await snap(page, 'uploads-sending-390');
    await throttleUploads(context, page, -1);
    expect((await scriptsLoaded(page)).filter((name) => /upload-widget/.test(name))).toHaveLength(1);

    const sent = slot(page, 'cutout_photo').getByTestId('uploaded-file');
    await sent.waitFor({ timeout: 30_000 });
    const thumb = sent.locator('img');
    await page.waitForFunction((img) => (img as HTMLImageElement).complete && (img as HTMLImageElement).naturalWidth > 0, await thumb.elementHandle());
    // The photo, resized to 2560 px in the browser, is previewed 480 px wide on the server, shown at 80 px here.
    await expect(thumb.evaluate((img) => (img as HTMLImageElement).naturalWidth)).resolves.toBe(480);
    await expect(sent.textContent()).resolves.toContain('Waiting for review');
    await expect(slot(page, 'cutout_photo').getByTestId('slot-status').textContent()).resolves.toBe('Waiting for review');
    const [stored] = await db.select().from(schema.uploads).where(eq(schema.uploads.caseId, row.id));
    // Resized before it left the browser: the server keeps the size it received.
    expect(stored).toMatchObject({ kind: 'cutout_photo', originalName: 'fuse.jpg', mimeType: 'image/jpeg', width: 2560, height: 2560 });

    // A document in another slot, and two files the office has reviewed, for the "with files" screenshots.
    await fileInput(page, 'order_agreement').setInputFiles({ name: 'order-agreement.pdf', mimeType: 'application/pdf', buffer: tinyPdf() });
    await slot(page, 'order_agreement').getByTestId('uploaded-file').waitFor();
    await fileInput(page, 'meter_photo').setInputFiles({ name: 'meter.png', mimeType: 'image/png', buffer: await smallImage('png', 900, 1200) });
    await slot(page, 'meter_photo').getByTestId('uploaded-file').waitFor();
    await fileInput(page, 'consumer_unit_photo').setInputFiles({ name: 'fuse-box.jpg', mimeType: 'image/jpeg', buffer: await smallImage('jpeg', 1200, 900) });
    await slot(page, 'consumer_unit_photo').getByTestId('uploaded-file').waitFor();
    const rows = await db.select().from(schema.uploads).where(eq(schema.uploads.caseId, row.id));
    const byKind = Object.fromEntries(rows.map((r) => [r.kind, r]));
    await db.update(schema.uploads).set({ status: 'accepted', reviewedAt: new Date() }).where(eq(schema.uploads.id, byKind.meter_photo!.id));
    await db
      .update(schema.uploads)
      .set({ status: 'rejected', reason: 'The switch labels are not readable; please stand a little closer.', reviewedAt: new Date() })
      .where(eq(schema.uploads.id, byKind.consumer_unit_photo!.id));
    await openPhotos(page, row.id);
    await expect(slot(page, 'meter_photo').getByTestId('uploaded-file').textContent()).resolves.toContain('Accepted');
    await expect(slot(page, 'meter_photo').getByRole('button', { name: /Remove/ }).count()).resolves.toBe(0);
    // Accepted: the drop zone is folded away. Not accepted: it stays open for the next photo.
    await expect(slot(page, 'meter_photo').locator(dropZoneOrWidget).count()).resolves.toBe(0);
    await expect(slot(page, 'consumer_unit_photo').locator(dropZoneOrWidget).count()).resolves.toBe(1);
    await expect(slot(page, 'consumer_unit_photo').getByTestId('reject-reason').textContent()).resolves.toContain(
      'The office says: The switch labels are not readable',
    );
    await expect(slot(page, 'consumer_unit_photo').getByTestId('slot-status').textContent()).resolves.toContain('Not accepted');
    await snap(page, 'uploads-with-files-390');

    // Remove the photo that is still waiting: two steps, then it is gone here and on the server.
    const cutout = slot(page, 'cutout_photo');
    await cutout.getByRole('button', { name: 'Remove fuse.jpg' }).click();
    await cutout.getByRole('button', { name: 'Yes, remove' }).click();
    await cutout.getByTestId('uploaded-file').waitFor({ state: 'detached' });
    await expect(cutout.getByTestId('slot-status').textContent()).resolves.toBe('Still needed');
    expect(await db.select().from(schema.uploads).where(eq(schema.uploads.id, stored!.id))).toEqual([]);

    // The server decides the type from the content: words in a .jpg are refused, with a message to act on.
    await fileInput(page, 'cutout_photo').setInputFiles({ name: 'not-a-photo.jpg', mimeType: 'image/jpeg', buffer: Buffer.from('just words '.repeat(600)) });
    await expect(cutout.getByTestId('upload-error').textContent()).resolves.toContain('JPEG, PNG or WebP');
    expect(unexpected(page)).toEqual([]);
    await context.close();
  });

  it('looks right at 1280 px, empty and with files', async () => {
    const { user, row } = await tenantWithCase('Tobias Wren');
    const { page, context } = await newPage(DESKTOP);
    await signInByLink(page, user.email);
    await openPhotos(page, row.id);
    await snap(page, 'uploads-empty-1280');
    await fileInput(page, 'cutout_photo').setInputFiles({ name: 'cut-out.jpg', mimeType: 'image/jpeg', buffer: await smallImage('jpeg', 1600, 1200) });
    await fileInput(page, 'landlord_permission').setInputFiles({ name: 'landlord-letter.pdf', mimeType: 'application/pdf', buffer: tinyPdf() });
    await slot(page, 'cutout_photo').getByTestId('uploaded-file').waitFor();
    await slot(page, 'landlord_permission').getByTestId('uploaded-file').waitFor();
    // With a file waiting for review the drop zone folds away; "Add another photo" brings it back.
    await slot(page, 'cutout_photo').getByRole('button', { name: 'Add another photo' }).click();
    await fileInput(page, 'cutout_photo').setInputFiles({ name: 'cut-out-closer.jpg', mimeType: 'image/jpeg', buffer: await smallImage('webp', 1200, 1600) });
    await expect.poll(() => slot(page, 'cutout_photo').getByTestId('uploaded-file').count(), { timeout: 10_000 }).toBe(2);
    await snap(page, 'uploads-with-files-1280');
    expect(unexpected(page)).toEqual([]);
    await context.close();
  });

  it('offers the phone’s camera on a touch screen', async () => {
    const { user, row } = await tenantWithCase('Priya Halloran');
    const { context: plain } = await newPage(PHONE);
    // A touch phone: Chromium's mobile emulation makes `(pointer: coarse)` match.
    const context = await plain.browser()!.newContext({ viewport: PHONE, baseURL: baseUrl, locale: 'en-GB', hasTouch: true, isMobile: true });
    await plain.close();
    const page = await context.newPage();
    await signInByLink(page, user.email);
    await openPhotos(page, row.id);
    const camera = slot(page, 'cutout_photo').getByText('Take a photo', { exact: true });
    // The slot learns it is on a touch screen once its script has run: wait for that.
    await camera.waitFor({ state: 'visible', timeout: 10_000 });
    // The camera input asks for the rear camera (HTML Media Capture, capture="environment").
    await expect(slot(page, 'cutout_photo').locator('input[name="camera-photo"]').getAttribute('capture')).resolves.toBe('environment');
    await snap(page, 'uploads-touch-390');
    // A slot for a document (the landlord's letter, often a PDF) opens the file picker, not the camera.
    await expect(slot(page, 'landlord_permission').getByText('Take a photo', { exact: true }).count()).resolves.toBe(0);
    await expect(slot(page, 'landlord_permission').locator('input[name="camera-photo"]').count()).resolves.toBe(0);
    await slot(page, 'landlord_permission').getByText('Choose a file', { exact: true }).waitFor({ state: 'visible', timeout: 10_000 });
    // Opening the slot brings Uppy's own widget, which offers the camera too.
    await slot(page, 'cutout_photo').getByTestId('drop-zone').click({ position: { x: 8, y: 8 } });
    await slot(page, 'cutout_photo').getByRole('tab', { name: 'Take a photo' }).waitFor();
    await expect(slot(page, 'cutout_photo').locator('input[name="camera-photo"]').getAttribute('capture')).resolves.toBe('environment');
    // A flagged photo's "Take again" opens the rear camera too.
    await fileInput(page, 'cutout_photo').setInputFiles({ name: 'fuse.jpg', mimeType: 'image/jpeg', buffer: await spoil.blurred(await sharpPhoto()) });
    await expect(slot(page, 'cutout_photo').getByTestId('retake-input').getAttribute('capture', { timeout: 20_000 })).resolves.toBe('environment');
    await context.close();
  });

  it('answers 404 for another customer’s case', async () => {
    const { user } = await tenantWithCase('Mabel Quint');
    const { row: theirs } = await tenantWithCase('Someone Else');
    const { page, context } = await newPage(PHONE);
    await signInByLink(page, user.email);
    const res = await page.goto(`/my/cases/${theirs.id}/photos`);
    expect(res?.status()).toBe(404);
    await context.close();
  });
});
