// The client's copies of the case API's shapes (the server's types live in server-only files).
import type { SiteMeasures } from '@/lib/readiness/types';
import type { Checklist, SectionProgress } from '@/lib/schemas/checklist';
import type { CheckResult, Light } from '@/lib/readiness/types';
import type { StageId } from '@/lib/stages';

/** GET /api/cases/:id, as staff use it. */
export type OfficeCaseView = {
  id: string;
  reference: string;
  stage: StageId;
  version: number;
  checklist: Checklist;
  progress: SectionProgress[];
  warnings: Record<string, string>;
  region: string | null;
  address: { addressLine1: string | null; addressLine2: string | null; town: string | null; postcode: string | null };
  readiness: { light: Light; gapCount: number; checks: CheckResult[]; at: string | null };
  /** What the office or surveyor recorded: measured maximum demand, earthing measure, RA, IΔn. */
  siteMeasures?: SiteMeasures;
  surveyDate: string | null;
  submittedAt: string | null;
  updatedAt: string;
  /** What the customer changed after the office marked the case ready; null when nothing. */
  changedSinceReady: { at: string; changes: { at: string; what: string; detail: string }[] } | null;
};

/** GET /api/cases/:id/readiness. */
export type Readiness = { light: Light; gapCount: number; checks: CheckResult[] };

/** What the page knows about the people on the case, from the server. */
export type CasePeople = {
  customer: { name: string | null; email: string; phone: string | null };
  surveyor: { id: string; name: string | null } | null;
  invitedAt: string;
  lastChasedAt: string | null;
  /** Text-message consent of the customer (texts may be switched off for the firm). */
  texts: { enabled: boolean; consented: boolean; mobile: string | null; consentedAt: string | null; withdrawnAt: string | null };
};

/** The last registration look-up on the case (null when there was none). */
export type VehicleLookupInfo = {
  registration: string;
  make: string | null;
  makeWords: string | null;
  colour: string | null;
  fuelType: string | null;
  yearOfManufacture: number | null;
  lookedUpAt: string;
} | null;

export type StaffMember = { id: string; name: string | null; email: string };

export type NoteItem = { id: string; body: string; createdAt: string; authorName: string | null };
export type AuditItem = {
  id: number;
  action: string;
  entity: string;
  entityId: string | null;
  before: Record<string, unknown> | null;
  after: Record<string, unknown> | null;
  at: string;
  actorId: string | null;
  actorName: string | null;
  actorRole: string | null;
};

/** GET /api/cases/:id/messages: e-mails and texts together. */
export type MessageItem = {
  id: string;
  channel: 'email' | 'text';
  direction: 'outbound' | 'inbound';
  kind: string;
  to: string;
  subject: string | null;
  text: string;
  status: string;
  statusDetail: string | null;
  statusAt: string | null;
  createdAt: string;
  sentByName: string | null;
};
