// Customers read customer words only. Signed in as each customer of the demo, in Chromium, this
// walks every page a customer can reach — their home, each checklist step, Check and send with
// its readiness view, photos and documents, and the driveway plan — and reads the page as the
// customer sees it: no staff text (the checks' trade wording and the firm's actions, the office's
// stage names, staff-only answer words), no raw option id such as `side-left`, and the stage
// shown once. Screenshots at 390 and 1280 px land in screenshots/customer-words-*.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { close, newPage, PHONE, problemsOf, signInByLink, snapBoth, waitForIslands } from './browser';
import { db, schema } from '../helpers/db';
import { messagesTo } from '../helpers/mail';
import { newStaff } from '../helpers/people';
import type { Client } from '../helpers/http';
import { createCase, createUser } from '../../seeds/factories';
import { eq } from 'drizzle-orm';
import { steps } from '@/components/checklist/progress';
import { fieldWords } from '@/lib/vocabulary/fields';
import { customerStage, stageLabels } from '@/lib/vocabulary/stages';
import { stages, type StageId } from '@/lib/stages';
import { uploadKinds } from '@/lib/schemas/uploads';

afterAll(close);

// The demo's customers (seeds/demo.ts); the first is the demo customer of the README.
const DEMO_CUSTOMERS = [
  'customer@example.com',
  'customer2@example.com',
  'delphine.achterberg@example.org',
  'owen.pellow@example.org',
  'sunita.marlowe@example.org',
  'gareth.quennell@example.org',
  'fen.ashdown@example.org',
];

type Option = { value: string; customer: string; staff: string; hint?: string };
const allOptions = Object.values(fieldWords).flatMap((w) => ('options' in w ? (w.options as readonly Option[]) : []));

// Every string a customer is meant to read from the vocabulary: staff words found among these
// are shared words ("Yes", "Type 2"), not staff-only ones.
const customerVocabulary = Object.values(fieldWords)
  .flatMap((w): string[] => [w.question, w.gap, w.blocks])
  .concat(allOptions.flatMap((o) => [o.customer, o.hint ?? '']))
  .join('\n')
  .toLowerCase();

/** Staff-only answer words: the staff word of an option where it differs from the customer's. */
const staffOnlyOptionWords = [...new Set(allOptions.filter((o) => o.staff !== o.customer && !customerVocabulary.includes(o.staff.toLowerCase())).map((o) => o.staff))];

/** Saved ids a page must never show: options with a hyphen, underscore or digit, stages, uploads. */
const rawIds = [
  ...new Set([
    ...allOptions.map((o) => o.value).filter((v) => /[-_]|[a-z]\d/.test(v)),
    ...stages.filter((s) => s.includes('_')),
    ...uploadKinds.filter((k) => k.includes('_')),
    'notify-after',
    'apply-before',
    'supply-headroom',
    'supply-identity',
    'network-operator',
    'cable-run',
    'cable-reach',
  ]),
];

function findRawIds(text: string): string[] {
  return rawIds.filter((id) => new RegExp(`(^|[^\\w-])${id.replace(/[-]/g, '\\-')}([^\\w-]|$)`).test(text));
}

function occurrences(text: string, word: string): number {
  return text.split(word).length - 1;
}

type Walked = { page: string; text: string };

async function signIn(page: Page, email: string) {
  const already = (await messagesTo(email)).length;
  await signInByLink(page, email, already + 1);
}

async function stepText(page: Page, caseId: string, stepId: string, title: string): Promise<string> {
  await page.evaluate((hash) => {
    window.location.hash = hash;
  }, `step=${stepId}`);
  await expect.poll(() => page.locator('#step-heading').textContent()).toBe(title);
  if (stepId === 'review') {
    await page.getByTestId('customer-readiness').or(page.getByText('We couldn’t load the checks just now')).first().waitFor();
    await expect(page.getByTestId('customer-readiness').count(), `readiness view for ${caseId}`).resolves.toBe(1);
  }
  return page.locator('body').innerText();
}

/** Every page state a customer can reach for their cases, as text. */
async function walk(page: Page, email: string, shots: string | null): Promise<{ walked: Walked[]; caseIds: string[] }> {
  const walked: Walked[] = [];
  await signIn(page, email);
  await page.goto('/my');
  walked.push({ page: `${email} /my`, text: await page.locator('body').innerText() });
  if (shots) await snapBoth(page, `${shots}-home`);
  // Links go to a case, a step of it (#step=…) or its photos: the case id is the path segment.
  const caseIds = await page
    .locator('a[href^="/my/cases/"]')
    .evaluateAll((links) => [...new Set(links.map((a) => new URL(a.getAttribute('href')!, window.location.origin).pathname.split('/')[3]!))]);
  for (const id of caseIds) {
    await page.goto(`/my/cases/${id}`);
    await waitForIslands(page);
    await page.locator('#step-heading').waitFor();
    for (const step of steps) {
      walked.push({ page: `${email} checklist ${step.id}`, text: await stepText(page, id, step.id, step.title) });
      if (shots && (step.id === 'review' || step.id === 'vehicle' || step.id === 'supply')) await snapBoth(page, `${shots}-step-${step.id}`);
    }
    await page.goto(`/my/cases/${id}/photos`);
    await waitForIslands(page);
    walked.push({ page: `${email} photos`, text: await page.locator('body').innerText() });
    await page.goto(`/my/cases/${id}/plan`);
    await waitForIslands(page);
    await page.getByTestId('plan-heading').waitFor();
    walked.push({ page: `${email} plan`, text: await page.locator('body').innerText() });
    if (shots) await snapBoth(page, `${shots}-plan`);
  }
  return { walked, caseIds };
}

/** What staff read about a case and a customer must not: the checks' trade words and every action. */
async function staffTextOf(admin: Client, caseId: string): Promise<string[]> {
  const r = await admin.json(`/api/cases/${caseId}/readiness`);
  expect(r.status).toBe(200);
  const checks = r.body.checks as { staffText: string; actions: string[] }[];
  return [...new Set(checks.flatMap((c) => [c.staffText, ...c.actions]))];
}

function expectCustomerWordsOnly(walked: Walked[], staffText: string[], stage: StageId) {
  const own = customerStage[stage].label;
  for (const { page, text } of walked) {
    for (const s of staffText) expect(text, `${page}: shows the staff text “${s}”`).not.toContain(s);
    for (const w of staffOnlyOptionWords) expect(text, `${page}: shows the staff-only word “${w}”`).not.toContain(w);
    expect(findRawIds(text), `${page}: shows raw ids`).toEqual([]);
    // The office's name for the stage never shows, unless it is the customer's word too.
    if (stageLabels[stage] !== own) expect(text, `${page}: shows the office's stage “${stageLabels[stage]}”`).not.toContain(stageLabels[stage]);
    expect(text, `${page}: “Withdrawn”`).not.toContain('Withdrawn');
    // The stage is said once: on the home page once per case, on a checklist page once.
    expect(occurrences(text, own), `${page}: the stage “${own}” is shown more than once`).toBeLessThanOrEqual(1);
  }
}

let admin: Client;
beforeAll(async () => {
  admin = (await newStaff('admin')).client;
});

describe('every customer page of the demo, read as the customer', () => {
  it('has a walk that can find staff words, raw ids and doubled stages (checked on made-up text)', () => {
    expect(staffOnlyOptionWords).toContain('Left side, rear');
    expect(staffOnlyOptionWords).not.toContain('Yes');
    expect(findRawIds('Where: side-left.')).toEqual(['side-left']);
    expect(findRawIds('Left side, towards the back')).toEqual([]);
    expect(occurrences('Survey booked · Survey booked', 'Survey booked')).toBe(2);
  });

  for (const [i, email] of DEMO_CUSTOMERS.entries()) {
    it(`shows ${email} customer words only`, async () => {
      const [user] = await db.select().from(schema.users).where(eq(schema.users.email, email));
      if (!user) {
        // Only the demo customer of the README is required; the rest follow the demo seed.
        expect(i, `${email} is the demo customer and must be seeded`).toBeGreaterThan(0);
        return;
      }
      const rows = await db.select().from(schema.cases).where(eq(schema.cases.customerId, user.id));
      const { page, context } = await newPage(PHONE);
      const { walked, caseIds } = await walk(page, email, i === 0 ? 'customer-words-demo' : null);
      expect(caseIds.sort()).toEqual(rows.map((r) => r.id).sort());
      for (const row of rows) {
        const staffText = await staffTextOf(admin, row.id);
        expect(staffText.length).toBeGreaterThan(0);
        expectCustomerWordsOnly(walked, staffText, row.stage as StageId);
      }
      expect(problemsOf(page)).toEqual([]);
      await context.close();
    });
  }

  it('reads a withdrawn case as “Closed”, never “Withdrawn” beside it', async () => {
    const user = await createUser(db, { role: 'customer', name: 'Wren Halloway' });
    const withdrawn = await createCase(db, { customerId: user.id, stage: 'withdrawn', addressLine1: '2 Weir Lane', town: 'Quillbury', postcode: 'AB12 9XY' });
    const { page, context } = await newPage(PHONE);
    const { walked } = await walk(page, user.email, 'customer-words-closed');
    expectCustomerWordsOnly(walked, await staffTextOf(admin, withdrawn.id), 'withdrawn');
    expect(walked.find((w) => w.page.endsWith('/my'))!.text).toContain('Closed');
    await context.close();
  });
});
