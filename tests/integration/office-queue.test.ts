import { beforeAll, describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { Client } from '../helpers/http';
import { db } from '../helpers/db';
import { newCustomer, newStaff } from '../helpers/people';
import { createCase, createUser } from '../../seeds/factories';
import { demoMpan } from '../../seeds/demo';

// A few hundred invented cases, tagged with a marker so searches see only this file's rows.
const marker = `Qtest${Date.now().toString(36)}`;
const COUNT = 300;
const today = new Date();
const isoIn = (days: number) => new Date(today.getTime() + days * 86_400_000).toISOString().slice(0, 10);

let admin: Client;
let surveyorId: string;
const mpans: string[] = [];

beforeAll(async () => {
  admin = (await newStaff('admin')).client;
  const surveyor = await createUser(db, { role: 'surveyor', name: `${marker} Surveyor` });
  surveyorId = surveyor.id;
  for (let i = 0; i < COUNT; i++) {
    const customer = await createUser(db, { role: 'customer', name: `${marker} Person ${String(i).padStart(3, '0')}`, email: `${marker.toLowerCase()}-${i}@example.org` });
    const mpan = demoMpan(String(10 + (i % 14)), String(1000000000 + i));
    mpans.push(mpan);
    // Every third case has no off-street parking, which the parking check rates red.
    const checklist =
      i % 3 === 0
        ? { parking: { kind: 'none' }, supply: { mpanCore: mpan } }
        : { supply: { mpanCore: mpan }, vehicle: { deliveryDate: isoIn(100 + (i % 60)) } };
    await createCase(db, {
      customerId: customer.id,
      stage: i % 5 === 0 ? 'sent_for_review' : 'filling_in',
      addressLine1: `${i + 1} Example Row`,
      town: 'Quillbury',
      postcode: `AB${(i % 9) + 1} ${i % 10}XY`,
      checklist,
      surveyorId: i % 4 === 0 ? surveyorId : null,
      invitedDaysAgo: i % 30,
    });
  }
}, 120_000);

const get = (query: string) => admin.json(`/api/cases?q=${marker}&${query}`);

describe('GET /api/cases for staff', () => {
  it('pages through the search with a total, 50 by default and at most 200', async () => {
    const first = await get('');
    expect(first.status).toBe(200);
    expect(first.body.total).toBe(COUNT);
    expect(first.body.items).toHaveLength(50);
    expect(first.body).toMatchObject({ page: 1, pageSize: 50 });
    const big = await get('pageSize=200&page=2');
    expect(big.body.items).toHaveLength(100);
    const tooBig = await get('pageSize=201');
    expect(tooBig.status).toBe(422);
    expect(tooBig.body.error.fields).toHaveProperty('pageSize');
  });

  it('filters by light: the no-parking cases are red', async () => {
    const red = await get('light=red&pageSize=200');
    expect(red.body.total).toBe(COUNT / 3);
    expect(red.body.items.every((i: { light: string; gaps: string[] }) => i.light === 'red' && i.gaps.length > 0)).toBe(true);
    const notRed = await get('light=amber,green');
    expect(notRed.body.total).toBe(COUNT - COUNT / 3);
  });

  it('filters by stage and by surveyor, and by "no surveyor"', async () => {
    expect((await get('stage=sent_for_review')).body.total).toBe(COUNT / 5);
    expect((await get(`surveyor=${surveyorId}`)).body.total).toBe(COUNT / 4);
    expect((await get('surveyor=none')).body.total).toBe(COUNT - COUNT / 4);
    const both = await get(`stage=sent_for_review&surveyor=${surveyorId}`);
    expect(both.body.total).toBe(COUNT / 20);
  });

  it('filters by delivery within N days', async () => {
    // Non-red cases (i % 3 != 0) are due in 100 + i % 60 days (far enough that timing is not red);
    // within 109 days means i % 60 <= 9.
    let expected = 0;
    for (let i = 0; i < COUNT; i++) if (i % 3 !== 0 && i % 60 <= 9) expected++;
    expect((await get("deliveryWithin=109")).body.total).toBe(expected);
  });

  it('searches by name, e-mail, postcode and MPAN', async () => {
    expect((await admin.json(`/api/cases?q=${marker} Person 007`)).body.total).toBe(1);
    expect((await admin.json(`/api/cases?q=${marker.toLowerCase()}-42@example.org`)).body.total).toBe(1);
    const byMpan = await admin.json(`/api/cases?q=${mpans[123]}`);
    expect(byMpan.body.items.map((i: { customerName: string }) => i.customerName)).toEqual([`${marker} Person 123`]);
    // Postcode search ignores the space: "AB3 2XY" and "ab32xy" find the same rows.
    const spaced = await get('q=' + encodeURIComponent('AB3 2XY'));
    expect(spaced.status).toBe(200);
    const withSpace = await admin.json(`/api/cases?q=${encodeURIComponent('AB3 2XY')}&pageSize=200`);
    const without = await admin.json(`/api/cases?q=ab32xy&pageSize=200`);
    expect(withSpace.body.total).toBeGreaterThan(0);
    expect(without.body.total).toBe(withSpace.body.total);
  });

  it('sorts by any column, both ways', async () => {
    const asc = await get('sort=customer&dir=asc&pageSize=5');
    expect(asc.body.items.map((i: { customerName: string }) => i.customerName)).toEqual([0, 1, 2, 3, 4].map((n) => `${marker} Person 00${n}`));
    const desc = await get('sort=customer&dir=desc&pageSize=1');
    expect(desc.body.items[0].customerName).toBe(`${marker} Person 299`);
    const invited = await get('sort=invited&dir=asc&pageSize=200');
    const times = invited.body.items.map((i: { invitedAt: string }) => Date.parse(i.invitedAt));
    expect([...times].sort((a, b) => a - b)).toEqual(times);
    const light = await get('sort=light&dir=asc&pageSize=200');
    expect(light.body.items[0].light).toBe('red');
    for (const key of ['address', 'gaps', 'stage', 'activity', 'delivery', 'surveyor', 'survey']) {
      expect((await get(`sort=${key}&dir=desc`)).status).toBe(200);
    }
    expect((await get('sort=shoe')).status).toBe(422);
  });

  it('exports the same filtered view as CSV', async () => {
    const res = await admin.fetch(`/api/cases.csv?q=${marker}&light=red&sort=customer`);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toContain('text/csv');
    expect(res.headers.get('content-disposition')).toMatch(/attachment; filename="groundwork-cases-\d{4}-\d{2}-\d{2}\.csv"/);
    const parsed = Papa.parse<string[]>((await res.text()).trim());
    expect(parsed.errors).toEqual([]);
    const [header, ...rows] = parsed.data;
    expect(header).toContain('Readiness');
    expect(rows).toHaveLength(COUNT / 3);
    expect(rows.every((r) => r[6] === 'red')).toBe(true);
    expect(rows[0]![1]).toBe(`${marker} Person 000`);
  });

  it('keeps customers out of the queue and the export, and scopes a surveyor to their cases', async () => {
    const { client: customer } = await newCustomer({});
    const own = await customer.json(`/api/cases?q=${marker}`);
    expect(own.body.total).toBe(1);
    expect((await customer.fetch('/api/cases.csv')).status).toBe(403);
    expect((await new Client().fetch('/api/cases.csv')).status).toBe(401);
    const { client: surveyor } = await newStaff('surveyor');
    expect((await surveyor.json(`/api/cases?q=${marker}`)).body.total).toBe(0);
  });
});
