// Many requests at one case at once — two tabs and a flaky phone retrying produce exactly this.
// The app's pool has 10 connections (src/lib/server/db.server.ts); we send more than that many
// saves, uploads and stage moves together. Each must answer (200/201 or 409) within seconds, and
// the stored version must count exactly the saves that were acknowledged: optimistic locking
// (If-Match) means no acknowledged save is lost and no refused one is applied.
import { describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { db, schema } from '../helpers/db';
import { newCustomer, newStaff } from '../helpers/people';
import { smallImage } from '../fixtures/uploads';

const POOL_SIZE = 10;
const ANSWER_WITHIN_MS = 20_000;

type Answer = { status: number; body: any; ms: number };

/** One request with a hard deadline, so a hung server fails the test instead of hanging it. */
async function timed(run: (signal: AbortSignal) => Promise<{ status: number; body: any }>): Promise<Answer> {
  const start = Date.now();
  try {
    const r = await run(AbortSignal.timeout(ANSWER_WITHIN_MS));
    return { ...r, ms: Date.now() - start };
  } catch (err) {
    return { status: 0, body: String(err), ms: Date.now() - start };
  }
}

describe('concurrent saves, uploads and stage moves at one case', () => {
  it('all answer within seconds, and the stored version equals the acknowledged saves', async () => {
    const c = await newCustomer({});
    const admin = await newStaff('admin');
    const caseId = c.case!.id;
    const photo = await smallImage('jpeg');

    // Every tab starts from version 1 and retries a 409 with the version the conflict hands back,
    // as the autosave queue does.
    const save = async (tab: number): Promise<Answer[]> => {
      const answers: Answer[] = [];
      let version = 1;
      for (let attempt = 0; attempt < 4; attempt++) {
        const a = await timed((signal) =>
          c.client.json(`/api/cases/${caseId}/checklist`, {
            method: 'PATCH',
            headers: { 'content-type': 'application/json', 'if-match': String(version) },
            // Each tab edits its own field, so every acknowledged save really changes something.
            body: JSON.stringify({ charger: { location: `tab ${tab} attempt ${attempt}` }, about: { addressLine2: `Flat ${tab}-${attempt}` } }),
            signal,
          }),
        );
        answers.push(a);
        if (a.status !== 409) break;
        version = a.body?.error?.current?.version ?? version;
      }
      return answers;
    };
    const upload = () =>
      timed((signal) => {
        const f = new FormData();
        f.append('kind', 'meter_photo');
        f.append('file', new Blob([new Uint8Array(photo)], { type: 'image/jpeg' }), 'meter.jpg');
        return c.client.json(`/api/cases/${caseId}/uploads`, { method: 'POST', body: f, signal });
      });
    const move = () =>
      timed((signal) =>
        admin.client.json(`/api/cases/${caseId}/stage`, {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({ to: 'filling_in' }),
          signal,
        }),
      );

    const tabs = 2 * POOL_SIZE;
    const [saves, uploads, moves] = await Promise.all([
      Promise.all(Array.from({ length: tabs }, (_, i) => save(i))).then((a) => a.flat()),
      Promise.all(Array.from({ length: 6 }, upload)),
      Promise.all(Array.from({ length: 4 }, move)),
    ]);

    const everything = [...saves, ...uploads, ...moves];
    const unanswered = everything.filter((a) => a.status === 0);
    expect(unanswered, `requests with no answer within ${ANSWER_WITHIN_MS} ms`).toEqual([]);
    expect(new Set(saves.map((a) => a.status))).toSatisfy((s: Set<number>) => [...s].every((x) => x === 200 || x === 409));
    expect(uploads.map((a) => a.status)).toEqual(uploads.map(() => 201));
    // The case starts Invited; the first save or move takes it to Filling in, so a move may win or find it already moved.
    expect(moves.every((a) => a.status === 200 || a.status === 409)).toBe(true);

    const acknowledged = saves.filter((a) => a.status === 200);
    expect(acknowledged.length).toBeGreaterThanOrEqual(1);
    const [row] = await db.select().from(schema.cases).where(eq(schema.cases.id, caseId));
    // Version 1 at creation, +1 for each acknowledged save and for nothing else.
    expect(row!.version).toBe(1 + acknowledged.length);
    // The last acknowledged save is what is stored.
    const last = acknowledged.reduce((a, b) => ((a.body.version ?? 0) > (b.body.version ?? 0) ? a : b));
    expect((row!.checklist as any).charger.location).toBe(last.body.checklist.charger.location);
    const [{ n }] = (await db.select({ n: sql<number>`count(*)::int` }).from(schema.uploads).where(eq(schema.uploads.caseId, caseId))) as [{ n: number }];
    expect(n).toBe(6);
    // The app is still healthy afterwards: no connection was left idle in a transaction.
    const health = await timed((signal) => c.client.json('/api/health', { signal }));
    expect(health.status).toBe(200);
  }, 90_000);
});
