// The demo scenario, all invented: Fernbrook Home Energy, a small electrical contractor in the
// fictional market town of Quillbury, preparing seven homes for charge point surveys.
import type { PostgresJsDatabase } from 'drizzle-orm/postgres-js';
import { mpanCheckDigit } from '../src/lib/validation/mpan';
import { createCase, createUser } from './factories';
import { settings } from '../src/db/schema';

type Db = PostgresJsDatabase<Record<string, unknown>>;

/** A valid 13-digit MPAN core from a distributor ID and ten digits of our choosing. */
export function demoMpan(distributorId: string, ten: string): string {
  const first12 = distributorId + ten;
  return first12 + String(mpanCheckDigit(first12));
}

const daysFromNow = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

export async function seedDemo(db: Db, password: string) {
  const admin = await createUser(db, { role: 'admin', email: 'admin@example.com', name: 'Rhiannon Vale', password });
  const surveyor = await createUser(db, { role: 'surveyor', email: 'surveyor@example.com', name: 'Callum Dunmore', password });
  await createUser(db, { role: 'surveyor', email: 'surveyor2@example.com', name: 'Ines Halloway', password });

  const customers = [
    { email: 'customer@example.com', name: 'Maren Oakes', phone: '+441134960123' },
    { email: 'customer2@example.com', name: 'Tobias Wren', phone: '+441134960456' },
    { email: 'delphine.achterberg@example.org', name: 'Delphine Achterberg' },
    { email: 'owen.pellow@example.org', name: 'Owen Pellow' },
    { email: 'sunita.marlowe@example.org', name: 'Sunita Marlowe' },
    { email: 'gareth.quennell@example.org', name: 'Gareth Quennell' },
    { email: 'fen.ashdown@example.org', name: 'Fen Ashdown' },
  ];
  const people = [];
  for (const c of customers) people.push(await createUser(db, { role: 'customer', ...c }));
  const [maren, tobias, delphine, owen, sunita, gareth, fen] = people;

  await createCase(db, {
    customerId: maren!.id,
    stage: 'filling_in',
    addressLine1: '14 Tanners Row',
    town: 'Quillbury',
    postcode: 'AB12 3DE',
    invitedDaysAgo: 4,
    checklist: {
      about: {
        fullName: 'Maren Oakes', email: 'customer@example.com', phone: '+441134960123', addressLine1: '14 Tanners Row',
        town: 'Quillbury', postcode: 'AB12 3DE', tenure: 'owner', propertyType: 'house',
      },
      vehicle: { make: 'Example Motors', model: 'Volta 5', condition: 'new', deliveryDate: daysFromNow(40), connector: 'type2' },
    },
  });
  await createCase(db, { customerId: tobias!.id, stage: 'invited', addressLine1: '3 Mill Lane', town: 'Quillbury', postcode: 'AB12 7EF', invitedDaysAgo: 1 });
  await createCase(db, {
    customerId: delphine!.id,
    stage: 'sent_for_review',
    addressLine1: 'Flat 2, 9 Orchard Court',
    town: 'Quillbury',
    postcode: 'AB13 1GH',
    invitedDaysAgo: 12,
    checklist: {
      about: { fullName: 'Delphine Achterberg', email: 'delphine.achterberg@example.org', addressLine1: 'Flat 2, 9 Orchard Court', town: 'Quillbury', postcode: 'AB13 1GH', tenure: 'tenant', propertyType: 'flat' },
      supply: { mpanCore: demoMpan('19', '4455667788'), mainFuseAmps: 60, looped: 'unsure', earthing: 'unknown' },
      parking: { kind: 'detached-bay', cars: 1, habit: 'nose-in' },
    },
  });
  await createCase(db, {
    customerId: owen!.id,
    stage: 'in_review',
    addressLine1: 'Wheelwright Cottage, Long Street',
    town: 'Quillbury',
    postcode: 'AB12 9JL',
    invitedDaysAgo: 20,
    checklist: {
      supply: { mpanCore: demoMpan('20', '1029384756'), mainFuseAmps: 80, looped: 'no', earthing: 'pme', loads: { showerKw: 9.5, cooker: true } },
      charger: { location: 'Side wall by the drive', cableRunMetres: 12, route: 'along-wall', softGround: true, softGroundMetres: 3, preference: 'tethered', tetherMetres: 5 },
    },
  });
  await createCase(db, {
    customerId: sunita!.id,
    stage: 'ready_for_survey',
    addressLine1: '27 Chandlers Way',
    town: 'Quillbury',
    postcode: 'AB14 2LN',
    invitedDaysAgo: 26,
  });
  await createCase(db, {
    customerId: gareth!.id,
    stage: 'survey_booked',
    addressLine1: 'The Old Forge, Church Hill',
    town: 'Quillbury',
    postcode: 'AB15 6NP',
    invitedDaysAgo: 33,
    surveyorId: surveyor.id,
    surveyDate: daysFromNow(3),
  });
  await createCase(db, {
    customerId: fen!.id,
    stage: 'survey_booked',
    addressLine1: '8 Heron Close',
    town: 'Quillbury',
    postcode: 'AB14 8QR',
    invitedDaysAgo: 30,
    surveyorId: surveyor.id,
    surveyDate: daysFromNow(6),
  });
  await db
    .insert(settings)
    .values({ key: 'firm', value: { name: 'Fernbrook Home Energy', email: 'office@example.com', phone: '0113 496 0000' }, updatedBy: admin.id })
    .onConflictDoNothing();
}
