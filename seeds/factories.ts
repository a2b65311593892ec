// Test-data factories shared by the demo seed and the tests. Every value is invented.
import bcrypt from 'bcryptjs';
import { eq } from 'drizzle-orm';
import type { PostgresJsDatabase } from 'drizzle-orm/postgres-js';
import { auditLog, cases, users, type Role, type Stage } from '@/db/schema';
import { newCaseReference } from '@/lib/case-reference';
import { refreshSearchTextSql } from '@/db/search-text';
import { runChecks, type ChecklistAnswers, type SiteMeasures, type UploadSummary } from '@/lib/readiness';
import { lightRank } from '@/lib/readiness/lights';

const today = () => new Date().toISOString().slice(0, 10);

/** The readiness columns for a checklist, its uploads (none by default) and site measures, with default settings. */
export function readinessColumns(checklist: Record<string, unknown>, uploads: UploadSummary[] = [], site: SiteMeasures = {}) {
  const r = runChecks({ answers: checklist as ChecklistAnswers, uploads, site, today: today() });
  return { readinessLight: r.light, readinessRank: lightRank[r.light], readinessGaps: r.gapCount, readinessChecks: r.checks, readinessAt: new Date() };
}

type Db = PostgresJsDatabase<Record<string, unknown>>;

let counter = 0;
const unique = () => `${Date.now().toString(36)}${(counter++).toString(36)}${Math.floor(Math.random() * 1e6).toString(36)}`;

export type UserInput = { role?: Role; email?: string; name?: string; password?: string; active?: boolean; phone?: string };

/** Inserts a user; staff get a bcrypt-hashed password. */
export async function createUser(db: Db, input: UserInput = {}) {
  const role = input.role ?? 'customer';
  const email = (input.email ?? `${role}-${unique()}@example.com`).toLowerCase();
  const passwordHash = input.password ? await bcrypt.hash(input.password, role === 'customer' ? 4 : 10) : null;
  const [row] = await db
    .insert(users)
    .values({ role, email, name: input.name ?? `Test ${role}`, passwordHash, active: input.active ?? true, phone: input.phone })
    .returning();
  return row!;
}

export type CaseInput = {
  customerId: string;
  stage?: Stage;
  addressLine1?: string;
  town?: string;
  postcode?: string;
  checklist?: Record<string, unknown>;
  surveyorId?: string | null;
  surveyDate?: string | null;
  invitedDaysAgo?: number;
  /** What the office or surveyor recorded (measured maximum demand, earthing measure, RA, IΔn). */
  siteMeasures?: SiteMeasures;
  /** As an invitation does: the customer's name, e-mail, phone and the address go into "About you", waiting to be confirmed. */
  fromInvitation?: boolean;
};

/** The "About you" answers an invitation fills in, from the customer and the case's address. */
async function invitationAbout(db: Db, input: CaseInput): Promise<Record<string, string>> {
  const [customer] = await db.select().from(users).where(eq(users.id, input.customerId));
  const about = { fullName: customer?.name, email: customer?.email, phone: customer?.phone, addressLine1: input.addressLine1, town: input.town, postcode: input.postcode };
  return Object.fromEntries(Object.entries(about).filter((entry): entry is [string, string] => typeof entry[1] === 'string' && entry[1] !== ''));
}

/** Inserts a case with a fresh reference, and the audit row an invitation makes. */
export async function createCase(db: Db, input: CaseInput) {
  const invitedAt = new Date(Date.now() - (input.invitedDaysAgo ?? 0) * 86_400_000);
  let checklist = input.checklist ?? {};
  let prefilled: string[] = [];
  if (input.fromInvitation) {
    const given = (checklist.about ?? {}) as Record<string, unknown>;
    const invited = await invitationAbout(db, input);
    checklist = { ...checklist, about: { ...invited, ...given } };
    prefilled = Object.keys(invited).filter((field) => !(field in given)).map((field) => `about.${field}`);
  }
  for (let attempt = 0; ; attempt++) {
    try {
      const [row] = await db
        .insert(cases)
        .values({
          reference: newCaseReference(),
          customerId: input.customerId,
          stage: input.stage ?? 'invited',
          addressLine1: input.addressLine1,
          town: input.town,
          postcode: input.postcode,
          checklist,
          prefilled,
          surveyorId: input.surveyorId ?? null,
          surveyDate: input.surveyDate ?? null,
          invitedAt,
          siteMeasures: input.siteMeasures ?? {},
          ...readinessColumns(checklist, [], input.siteMeasures ?? {}),
        })
        .returning();
      await db.execute(refreshSearchTextSql(row!.id));
      await db.insert(auditLog).values({ caseId: row!.id, action: 'case.created', entity: 'case', entityId: row!.id, after: { stage: row!.stage } });
      return row!;
    } catch (err) {
      // A reference collision is vanishingly rare; try a new one.
      if (attempt < 3 && String(err).includes('cases_reference_unique')) continue;
      throw err;
    }
  }
}
