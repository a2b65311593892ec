// Launches Debian's Chromium through playwright-core (never a downloaded browser).
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export const baseUrl = process.env.APP_URL ?? 'http://127.0.0.1:4321';
export const PHONE = { width: 390, height: 844 };
export const DESKTOP = { width: 1280, height: 900 };

let browser: Browser | undefined;
let profile: string | undefined;

export async function launch(): Promise<Browser> {
  profile = mkdtempSync(join(tmpdir(), 'groundwork-chromium-'));
  // A persistent context is the only way to pass --user-data-dir; we wrap its browser.
  browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
      `--disk-cache-dir=${join(profile, 'cache')}`,
    ],
  });
  return browser;
}

export async function close() {
  await browser?.close();
  if (profile) rmSync(profile, { recursive: true, force: true });
}

export async function newPage(viewport = PHONE): Promise<{ context: BrowserContext; page: Page }> {
  if (!browser) await launch();
  const context = await browser!.newContext({ viewport, baseURL: baseUrl, locale: 'en-GB' });
  const page = await context.newPage();
  // Fail on any page error or console error, like the unit tests do.
  const problems: string[] = [];
  page.on('pageerror', (e) => problems.push(`pageerror: ${e.message}`));
  page.on('console', (m) => {
    if (m.type() === 'error' && !/Failed to load resource: the server responded with a status of (401|404|409|422)/.test(m.text())) {
      problems.push(`console.error: ${m.text()}`);
    }
  });
  (page as Page & { problems: string[] }).problems = problems;
  return { context, page };
}

export function problemsOf(page: Page): string[] {
  return (page as Page & { problems?: string[] }).problems ?? [];
}

/** Saves a screenshot under screenshots/ for people to look at (the folder is git-ignored). */
export async function snap(page: Page, name: string) {
  const dir = join(process.cwd(), 'screenshots');
  mkdirSync(dir, { recursive: true });
  await page.screenshot({ path: join(dir, `${name}.png`), fullPage: true });
}

/** Screenshots at phone and desktop width from the top, then back to the phone. */
export async function snapBoth(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, 0));
  await snap(page, `${name}-390`);
  await page.setViewportSize(DESKTOP);
  await page.evaluate(() => window.scrollTo(0, 0));
  await snap(page, `${name}-1280`);
  await page.setViewportSize(PHONE);
}

/**
 * Signs a customer in the way a real one does: ask for a link, follow it from the inbox. Without
 * `nth`, the link is the first message that arrives after asking (the demo customers get mail
 * from earlier tests too).
 */
export async function signInByLink(page: Page, email: string, nth?: number) {
  const { linkIn, messagesTo, waitForMessage } = await import('../helpers/mail');
  const before = nth === undefined ? (await messagesTo(email)).length : 0;
  await page.goto('/signin');
  await page.locator('[data-ready="true"]').waitFor();
  await page.getByLabel('E-mail address').fill(email);
  await page.getByRole('button', { name: 'E-mail me a sign-in link' }).click();
  await page.getByTestId('check-email').waitFor();
  await page.goto(linkIn(await waitForMessage(email, nth ?? before + 1), baseUrl));
  await page.waitForURL('**/my');
}

/** Waits until every React island on the page has hydrated (Astro drops `ssr` from each then). */
export async function waitForIslands(page: Page) {
  await page.waitForFunction(() => document.querySelectorAll('astro-island[ssr]').length === 0, undefined, { timeout: 30_000 });
}

export const STAFF_PASSWORD = process.env.DEMO_PASSWORD ?? 'groundwork-demo';

/** Signs a member of staff in on the sign-in page's staff tab (demo password unless given). */
export async function signInStaff(page: Page, email: string, password = STAFF_PASSWORD) {
  await page.goto('/signin');
  await page.locator('[data-ready="true"]').waitFor();
  await page.getByRole('tab', { name: 'Installer staff' }).click();
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/**
 * The customer's photos page, once its slots have hydrated (Astro drops an island's `ssr`
 * attribute then). Each slot shows a light drop zone; Uppy's widget replaces it once used.
 */
export async function openPhotos(page: Page, caseId: string) {
  await page.goto(`/my/cases/${caseId}/photos`);
  await page.locator('astro-island:not([ssr]) [data-testid^="upload-slot-"] [data-testid="drop-zone"]').first().waitFor();
}

/** One upload slot on the photos page. */
export const uploadSlot = (page: Page, kind: string) => page.getByTestId(`upload-slot-${kind}`);
/** The drop zone's own picker, or Uppy's once the widget is open: both are named files[]. */
export const slotFileInput = (page: Page, kind: string) => uploadSlot(page, kind).locator('input[type="file"][name="files[]"]:not([webkitdirectory])');
