// Who may do what, route by route. The list of routes comes from the files under src/pages (every
// API file with each method it exports, every page), so a new route without a row here fails.
// Each row says what each of six visitors gets; the requests are real, as each visitor.
// Writes carry a wrong body, so a visitor who is let in meets validation (409/415/422) and nothing
// changes (the office's chase, which sends an e-mail, aside); one who is not is stopped first (401/403/404).
// The policy is PRODUCT.md's: customers see only their own case (someone else's is 404, never 403),
// surveyors only the cases assigned to them, the office everything; staff pages send others home.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { Client } from '../helpers/http';
import { db } from '../helpers/db';
import { newCustomer, newStaff } from '../helpers/people';
import { createCase, createUser } from '../../seeds/factories';
import { smallImage } from '../fixtures/uploads';

type Who = 'anon' | 'owner' | 'other' | 'admin' | 'assigned' | 'unassigned';
const everyone: Who[] = ['anon', 'other', 'admin', 'assigned', 'unassigned', 'owner'];
type Row = Record<Who, number>;
/** Expected statuses in the order: anonymous, owner customer, other customer, admin, assigned surveyor, unassigned surveyor. */
const r = (anon: number, owner: number, other: number, admin: number, assigned: number, unassigned: number): Row => ({ anon, owner, other, admin, assigned, unassigned });
const all = (status: number) => r(status, status, status, status, status, status);

// Pages: anonymous visitors go to sign-in (302), the wrong role goes to its own home (302).
const customerPage = r(302, 200, 404, 302, 302, 302);
const adminPage = r(302, 302, 302, 200, 302, 302);
// The survey pack and its outcome form: the office and the assigned surveyor; anyone else gets the 404 of a case that does not exist.
const packPage = r(302, 404, 404, 200, 200, 404);

const matrix: Record<string, Record<string, Row>> = {
  'api/[...rest].ts': { ALL: all(404) },
  'api/health.ts': { GET: all(200) },
  'api/me.ts': { GET: r(401, 200, 200, 200, 200, 200) },
  // Ends the staff member's own sessions: run last (see below).
  'api/me/sign-out-everywhere.ts': { POST: r(401, 403, 403, 200, 200, 200) },
  'api/cases.csv.ts': { GET: r(401, 403, 403, 200, 200, 200) },
  'api/cases/index.ts': { GET: r(401, 200, 200, 200, 200, 200), POST: r(401, 403, 403, 422, 403, 403) },
  'api/cases/import.ts': { POST: r(401, 403, 403, 422, 403, 403) },
  'api/cases/chase.ts': { POST: r(401, 403, 403, 422, 403, 403) },
  'api/cases/[id]/index.ts': { GET: r(401, 200, 404, 200, 200, 404) },
  'api/cases/[id]/readiness.ts': { GET: r(401, 200, 404, 200, 200, 404) },
  'api/cases/[id]/checklist.ts': { PATCH: r(401, 422, 404, 422, 403, 403) },
  'api/cases/[id]/submit.ts': { POST: r(401, 422, 404, 403, 403, 403) },
  'api/cases/[id]/confirm-details.ts': { POST: r(401, 422, 404, 403, 403, 403) },
  'api/cases/[id]/uploads.ts': { GET: r(401, 200, 404, 200, 200, 404), POST: r(401, 415, 404, 415, 415, 404) },
  'api/cases/[id]/audit.ts': { GET: r(401, 403, 403, 200, 200, 404) },
  'api/cases/[id]/emails.ts': { GET: r(401, 403, 403, 200, 200, 404) },
  'api/cases/[id]/messages.ts': { GET: r(401, 403, 403, 200, 200, 404) },
  // Text opt-in: anyone who may see the case reads it; only its customer changes it.
  'api/cases/[id]/texts.ts': { GET: r(401, 200, 404, 200, 200, 404), PUT: r(401, 422, 404, 403, 403, 403), DELETE: r(401, 200, 404, 403, 403, 403) },
  'api/cases/[id]/vehicle-lookup.ts': { POST: r(401, 422, 404, 422, 403, 403) },
  // The SMS provider's signed webhooks: without a valid signature, nobody gets in.
  'api/sms/status.ts': { GET: all(401), POST: all(401) },
  'api/sms/inbound.ts': { GET: all(401), POST: all(401) },
  'api/cases/[id]/notes.ts': { GET: r(401, 403, 403, 200, 200, 404), POST: r(401, 403, 403, 422, 422, 404) },
  // The office's chase sends the customer an e-mail of what is missing (the one write let through).
  'api/cases/[id]/chase.ts': { POST: r(401, 403, 403, 200, 403, 403) },
  'api/cases/[id]/stage.ts': { POST: r(401, 403, 403, 422, 403, 403) },
  'api/cases/[id]/outcome.ts': { POST: r(401, 403, 403, 422, 422, 404) },
  // Measured demand and earthing figures: the office and the assigned surveyor.
  'api/cases/[id]/site-measures.ts': { PUT: r(401, 403, 403, 422, 422, 404) },
  'api/cases/[id]/pack.pdf.ts': { GET: r(401, 404, 404, 200, 200, 404) },
  'api/uploads/[id].ts': { GET: r(401, 200, 404, 200, 200, 404), DELETE: r(401, 200, 404, 403, 403, 404) },
  'api/uploads/[id]/review.ts': { POST: r(401, 403, 403, 422, 403, 403) },
  'api/settings.ts': { GET: r(401, 403, 403, 200, 403, 403), PUT: r(401, 403, 403, 422, 403, 403) },
  'api/staff/index.ts': { GET: r(401, 403, 403, 200, 403, 403), POST: r(401, 403, 403, 422, 403, 403) },
  'api/staff/[id].ts': { PATCH: r(401, 403, 403, 422, 403, 403) },
  // Anyone holding a staff invitation's one-time token; without a valid one, 422.
  'api/staff/password.ts': { POST: all(422) },

  '404.astro': { GET: all(404) },
  // The error page, opened by its own address, is the error page: nothing of a case on it.
  '500.astro': { GET: all(500) },
  // The public landing page, for everyone.
  'index.astro': { GET: all(200) },
  'home.astro': { GET: r(302, 302, 302, 302, 302, 302) },
  'signin/index.astro': { GET: r(200, 302, 302, 302, 302, 302) },
  'signin/check-email.astro': { GET: all(200) },
  'set-password.astro': { GET: all(200) },
  'my/index.astro': { GET: r(302, 200, 200, 302, 302, 302) },
  'my/cases/[id].astro': { GET: customerPage },
  'my/cases/[id]/photos.astro': { GET: customerPage },
  'my/cases/[id]/plan.astro': { GET: customerPage },
  'office/index.astro': { GET: adminPage },
  'office/invite.astro': { GET: adminPage },
  'office/staff.astro': { GET: adminPage },
  'office/settings.astro': { GET: adminPage },
  'office/cases/[id].astro': { GET: r(302, 302, 302, 200, 302, 302) },
  'surveys/index.astro': { GET: r(302, 302, 302, 302, 200, 200) },
  'surveys/cases/[id].astro': { GET: packPage },
  'surveys/cases/[id]/outcome.astro': { GET: packPage },
};

const pagesDir = join(process.cwd(), 'src', 'pages');

function routeFiles(dir = pagesDir): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return routeFiles(path);
    return /\.(ts|astro)$/.test(name) ? [relative(pagesDir, path)] : [];
  });
}

/** The methods a route file answers: what an endpoint exports, GET for a page. */
function methodsOf(file: string): string[] {
  if (file.endsWith('.astro')) return ['GET'];
  const source = readFileSync(join(pagesDir, file), 'utf8');
  return [...source.matchAll(/export (?:const|async function|function) (GET|POST|PUT|PATCH|DELETE|ALL)\b/g)].map((m) => m[1]!).sort();
}

describe('the access matrix covers every route', () => {
  it('has a row for every route file and method, and none for routes that are gone', () => {
    const found = Object.fromEntries(routeFiles().map((f) => [f, methodsOf(f)]));
    const listed = Object.fromEntries(Object.entries(matrix).map(([f, m]) => [f, Object.keys(m).sort()]));
    expect(listed).toEqual(found);
  });
});

describe('each visitor gets what the matrix says', () => {
  const clients = {} as Record<Who, Client>;
  let caseId: string;
  let uploadId: string;
  let deletableId: string;
  let staffId: string;

  beforeAll(async () => {
    const [owner, other, admin, assigned, unassigned] = await Promise.all([
      newCustomer(null),
      newCustomer(),
      newStaff('admin'),
      newStaff('surveyor'),
      newStaff('surveyor'),
    ]);
    Object.assign(clients, { anon: new Client(), owner: owner.client, other: other.client, admin: admin.client, assigned: assigned.client, unassigned: unassigned.client });
    // Assigned to one surveyor and still being filled in, so the customer can still send files.
    const c = await createCase(db, { customerId: owner.user.id, stage: 'filling_in', surveyorId: assigned.user.id, surveyDate: '2099-06-01' });
    caseId = c.id;
    const upload = async () => {
      const f = new FormData();
      f.set('kind', 'meter_photo');
      f.set('file', new Blob([new Uint8Array(await smallImage('jpeg'))], { type: 'image/jpeg' }), 'meter.jpg');
      const res = await owner.client.json(`/api/cases/${caseId}/uploads`, { method: 'POST', body: f });
      expect(res.status).toBe(201);
      return res.body.id as string;
    };
    uploadId = await upload();
    deletableId = await upload();
    staffId = (await createUser(db, { role: 'surveyor' })).id;
  });

  function pathOf(file: string, method: string): string {
    let path = `/${file.replace(/\.(ts|astro)$/, '').replace(/(^|\/)index$/, '')}`;
    const id = file.startsWith('api/uploads/') ? (method === 'DELETE' ? deletableId : uploadId) : file.startsWith('api/staff/') ? staffId : caseId;
    path = path.replace('[id]', id).replace('[...rest]', 'no-such-route');
    return path === '/404' ? '/no-such-page' : path || '/';
  }

  const rows = Object.entries(matrix).flatMap(([file, methods]) => Object.entries(methods).map(([method, row]) => ({ file, method, row })));
  // The DELETE row removes the owner's file, and signing out everywhere ends the staff's sessions: run them last.
  const late = (x: { file: string; method: string }) => (x.file.includes('sign-out-everywhere') ? 2 : x.method === 'DELETE' ? 1 : 0);
  rows.sort((a, b) => late(a) - late(b));

  it.each(rows)('$method $file', async ({ file, method, row }) => {
    const path = pathOf(file, method);
    for (const who of everyone) {
      const expected = row[who];
      const verb = method === 'ALL' ? 'GET' : method;
      const init: RequestInit = verb === 'GET' ? {} : { method: verb, headers: { 'content-type': 'application/json' }, body: verb === 'DELETE' ? undefined : '{"unexpected":true}' };
      const res = await clients[who].fetch(path, init);
      expect(res.status, `${who} ${verb} ${path}`).toBe(expected);
      // A refusal is the one JSON error shape on the API; never a 500 anywhere.
      if (path.startsWith('/api/') && res.status >= 400) expect((await res.json()).error.code, `${who} ${verb} ${path}`).toEqual(expect.any(String));
    }
  });
});
