// A node has ten database connections (DATABASE_POOL_SIZE). A save holds one for its
// transaction; if anything inside it asked the pool for a second, ten saves at once would each
// wait for an eleventh that never comes. Found by `npm run bench`'s save measurement.
import { describe, expect, it } from 'vitest';
import { db } from '../helpers/db';
import { newStaff } from '../helpers/people';
import { createCase, createUser } from '../../seeds/factories';

describe('the database pool under concurrent saves', () => {
  it('answers sixteen checklist saves sent at once, more than the pool has connections', async () => {
    const { client: admin } = await newStaff('admin');
    const cases = await Promise.all(
      Array.from({ length: 16 }, async () => createCase(db, { customerId: (await createUser(db, { role: 'customer' })).id })),
    );
    const answers = await Promise.all(
      cases.map((c, i) =>
        admin.json(`/api/cases/${c.id}/checklist`, {
          method: 'PATCH',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({ vehicle: { model: `Pool ${i}` } }),
          signal: AbortSignal.timeout(15_000),
        }),
      ),
    );
    expect(answers.map((a) => a.status)).toEqual(cases.map(() => 200));
  });
});
