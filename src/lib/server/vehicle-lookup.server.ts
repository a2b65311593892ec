// Server-only: the checklist's registration look-up — rate-limited per customer, cached in
// PostgreSQL, never blocking (slow, failing or unknown answers leave the customer to type the
// make), and off when the enquiry service's key is unset.
import { and, eq, gt, lt, sql } from 'drizzle-orm';
import { caseVehicleLookups, lookupCounters, vehicleLookupCache, type CaseRow } from '@/db/schema';
import { fuelAdvice, makeWords } from '@/lib/vehicle-fuel';
import { checkRegistration } from '@/lib/validation/registration';
import { config } from './config.server';
import { db } from './db.server';
import { HttpError } from './http';
import type { SessionUser } from './users.server';
import type { EnquiryAnswer, VehicleEnquiry, VehicleRecord } from './vehicle/enquiry';
import { vehicleEnquiryService } from './vehicle/ves.server';

// Records change rarely (a respray, a new plate); an unknown plate may be registered soon.
const FOUND_FOR_MS = 30 * 86_400_000;
const NOT_FOUND_FOR_MS = 86_400_000;
const WINDOW_MS = 3_600_000;

let service: VehicleEnquiry | null | undefined;

function enquiry(): VehicleEnquiry | null {
  if (service === undefined) {
    const settings = config.vehicleEnquiry;
    service = settings ? vehicleEnquiryService(settings) : null;
  }
  return service;
}

export const vehicleLookupEnabled = () => enquiry() !== null;

export type LookupAnswer =
  | { status: 'found'; vehicle: VehicleRecord & { makeWords: string | null }; advice: string | null }
  | { status: 'not_found' | 'unavailable' | 'off' };

/**
 * Counts one look-up for a customer in this hour's window; true while within the limit.
 * One upsert, so two app processes share the count.
 */
export async function countLookup(userId: string, limit: number, now = new Date()): Promise<{ allowed: boolean; retryAfterSeconds: number }> {
  const windowStart = new Date(Math.floor(now.getTime() / WINDOW_MS) * WINDOW_MS);
  const [row] = await db()
    .insert(lookupCounters)
    .values({ userId, windowStart, count: 1 })
    .onConflictDoUpdate({ target: [lookupCounters.userId, lookupCounters.windowStart], set: { count: sql`${lookupCounters.count} + 1` } })
    .returning({ count: lookupCounters.count });
  await db().delete(lookupCounters).where(and(eq(lookupCounters.userId, userId), lt(lookupCounters.windowStart, new Date(windowStart.getTime() - WINDOW_MS))));
  return { allowed: row!.count <= limit, retryAfterSeconds: Math.ceil((windowStart.getTime() + WINDOW_MS - now.getTime()) / 1000) };
}

async function cached(registration: string, now: Date): Promise<EnquiryAnswer | null> {
  const [row] = await db().select().from(vehicleLookupCache).where(and(eq(vehicleLookupCache.registration, registration), gt(vehicleLookupCache.fetchedAt, new Date(now.getTime() - FOUND_FOR_MS))));
  if (!row) return null;
  if (!row.found) return now.getTime() - row.fetchedAt.getTime() < NOT_FOUND_FOR_MS ? { status: 'not_found' } : null;
  return { status: 'found', vehicle: { registration, make: row.make, colour: row.colour, fuelType: row.fuelType, yearOfManufacture: row.yearOfManufacture } };
}

async function remember(registration: string, answer: EnquiryAnswer) {
  if (answer.status === 'unavailable') return;
  const v = answer.status === 'found' ? answer.vehicle : null;
  const values = { found: Boolean(v), make: v?.make ?? null, colour: v?.colour ?? null, fuelType: v?.fuelType ?? null, yearOfManufacture: v?.yearOfManufacture ?? null, fetchedAt: new Date() };
  await db().insert(vehicleLookupCache).values({ registration, ...values }).onConflictDoUpdate({ target: vehicleLookupCache.registration, set: values });
}

/**
 * Looks a registration up for a case: 422 for a plate that is not one, 429 over the customer's
 * hourly limit; otherwise always an answer the form can act on.
 *
 * @example await lookupForCase(user, row, 'gw29eva') // { status: 'found', vehicle: { make: 'LARKSPUR', … }, advice: null }
 */
export async function lookupForCase(user: SessionUser, row: CaseRow, input: string, now = new Date()): Promise<LookupAnswer> {
  const checked = checkRegistration(input, now);
  if (!checked.ok) throw new HttpError(422, 'invalid', checked.message, { registration: checked.message });
  const settings = config.vehicleEnquiry;
  const svc = enquiry();
  if (!settings || !svc) return { status: 'off' };
  const limit = await countLookup(user.id, settings.perCustomerPerHour, now);
  if (!limit.allowed) {
    throw new HttpError(429, 'rate_limited', 'Too many registration look-ups for now. Please type the make yourself.', undefined, { retryAfterSeconds: limit.retryAfterSeconds });
  }
  const registration = checked.registration.replace(/ /g, '');
  let answer = await cached(registration, now);
  if (!answer) {
    answer = await svc.lookup(registration);
    await remember(registration, answer);
  }
  if (answer.status !== 'found') return { status: answer.status };
  const v = answer.vehicle;
  const record = { registration: checked.registration, make: v.make, colour: v.colour, fuelType: v.fuelType, yearOfManufacture: v.yearOfManufacture, lookedUpAt: now };
  await db().insert(caseVehicleLookups).values({ caseId: row.id, ...record }).onConflictDoUpdate({ target: caseVehicleLookups.caseId, set: record });
  return {
    status: 'found',
    vehicle: { ...v, registration: checked.registration, makeWords: v.make ? makeWords(v.make) : null },
    advice: fuelAdvice(v.fuelType, checked.registration),
  };
}

/** The last look-up on a case, for the office's "where this came from". */
export async function caseVehicleLookup(caseId: string) {
  const [row] = await db().select().from(caseVehicleLookups).where(eq(caseVehicleLookups.caseId, caseId));
  return row ? { ...row, makeWords: row.make ? makeWords(row.make) : null, lookedUpAt: row.lookedUpAt.toISOString() } : null;
}
