import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { db, schema } from '../helpers/db';
import { newCustomer, newStaff } from '../helpers/people';
import { vehicleRequests } from '../helpers/services';

// Against the fake vehicle enquiry service (fake-services/vehicle-enquiry-server.mjs), which
// answers in the government service's REST shape as remembered from its public API docs. Its
// fleet is invented: GW29 EVA (electric), GW29 PET (petrol), GW29 SLO (answers after 5 s),
// GW29 ERR (answers 500); any other plate is not found.

const lookup = (client: Awaited<ReturnType<typeof newCustomer>>['client'], caseId: string, registration: unknown) =>
  client.send('POST', `/api/cases/${caseId}/vehicle-lookup`, { registration });

describe('registration look-up', () => {
  it('finds an electric car: make, colour, fuel and year, no advice; the case remembers what was found', async () => {
    const { client, case: c } = await newCustomer();
    const r = await lookup(client, c!.id, 'gw29eva');
    expect(r.status).toBe(200);
    expect(r.body).toEqual({
      status: 'found',
      vehicle: { registration: 'GW29 EVA', make: 'LARKSPUR', makeWords: 'Larkspur', colour: 'BLUE', fuelType: 'ELECTRICITY', yearOfManufacture: 2025 },
      advice: null,
    });
    const [stored] = await db.select().from(schema.caseVehicleLookups).where(eq(schema.caseVehicleLookups.caseId, c!.id));
    expect(stored).toMatchObject({ registration: 'GW29 EVA', make: 'LARKSPUR', fuelType: 'ELECTRICITY' });
  });

  it('tells the customer in plain words when the car on record is petrol', async () => {
    const { client, case: c } = await newCustomer();
    const r = await lookup(client, c!.id, 'GW29 PET');
    expect(r.body.status).toBe('found');
    expect(r.body.advice).toMatch(/^Is this the right car\? The records for GW29 PET say it runs on petrol/);
  });

  it('answers not_found for a plate the register does not hold, and remembers that', async () => {
    const { client, case: c } = await newCustomer();
    expect((await lookup(client, c!.id, 'GW29 ZZZ')).body).toEqual({ status: 'not_found' });
    const [cached] = await db.select().from(schema.vehicleLookupCache).where(eq(schema.vehicleLookupCache.registration, 'GW29ZZZ'));
    expect(cached!.found).toBe(false);
  });

  it('gives up on a slow service after about 2 s, and on a failing one at once: the customer types the make', async () => {
    const { client, case: c } = await newCustomer();
    const started = Date.now();
    expect((await lookup(client, c!.id, 'GW29 SLO')).body).toEqual({ status: 'unavailable' });
    const took = Date.now() - started;
    expect(took).toBeGreaterThanOrEqual(1900);
    expect(took).toBeLessThan(4500);
    expect((await lookup(client, c!.id, 'GW29 ERR')).body).toEqual({ status: 'unavailable' });
    // Neither is cached, so the next try asks again.
    expect(await db.select().from(schema.vehicleLookupCache).where(eq(schema.vehicleLookupCache.registration, 'GW29ERR'))).toHaveLength(0);
  });

  it('asks the service once for a plate looked up twice (cached in PostgreSQL)', async () => {
    const { client, case: c } = await newCustomer();
    const asked = async () => (await vehicleRequests()).filter((q) => q.registrationNumber === 'GW29EVB').length;
    const before = await asked();
    expect((await lookup(client, c!.id, 'GW29 EVB')).body.status).toBe('found');
    expect((await lookup(client, c!.id, 'gw29 evb')).body.status).toBe('found');
    expect((await asked()) - before).toBe(1);
  });

  it('limits look-ups per customer (20 an hour by default), then 429 with a plain message', async () => {
    const { client, case: c } = await newCustomer();
    // The count is per clock hour: never start the 21 requests just before the hour turns.
    const toNextHour = 3_600_000 - (Date.now() % 3_600_000);
    if (toNextHour < 10_000) await new Promise((r) => setTimeout(r, toNextHour + 100));
    for (let i = 0; i < 20; i++) expect((await lookup(client, c!.id, 'GW29 EVA')).status).toBe(200);
    const over = await lookup(client, c!.id, 'GW29 EVA');
    expect(over.status).toBe(429);
    expect(over.body.error.message).toMatch(/type the make yourself/);
    // Another customer is not held back by the first one's count.
    const other = await newCustomer();
    expect((await lookup(other.client, other.case!.id, 'GW29 EVA')).status).toBe(200);
  });

  it('refuses bad input with a clear error and never answers for someone else’s case', async () => {
    const { client, case: c } = await newCustomer();
    expect((await lookup(client, c!.id, 'AB-12')).status).toBe(422);
    expect((await lookup(client, c!.id, 12)).status).toBe(422);
    expect((await client.send('POST', `/api/cases/${c!.id}/vehicle-lookup`, { registration: 'GW29 EVA', extra: 1 })).status).toBe(422);
    const other = await newCustomer();
    expect((await lookup(other.client, c!.id, 'GW29 EVA')).status).toBe(404);
    const { client: surveyor } = await newStaff('surveyor');
    expect((await lookup(surveyor, c!.id, 'GW29 EVA')).status).toBe(403);
  });
});
