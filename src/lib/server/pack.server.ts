// Server-only: everything the surveyor's summary pack shows, gathered once per request, so the
// pack page and the PDF are made from the same facts and cannot drift apart.
import { and, eq, inArray, sql } from 'drizzle-orm';
import { cases, surveyOutcomes, uploads, users, type CaseRow, type UploadRow } from '@/db/schema';
import { packCautions } from '@/lib/cautions';
import { customerGaps, type CustomerGap } from '@/lib/gaps';
import {
  readPlan,
  requiredUploadKinds,
  uploadKindStatus,
  type CableSizeRow,
  type CorrectionFactor,
  type ChecklistAnswers,
  type CheckId,
  type DemandItem,
  type Light,
  type NetworkReason,
  type ParkingWay,
  type ReachVerdict,
  type UploadKindStatus,
} from '@/lib/readiness';
import { loadFields, sectionIds, sectionPatchSchemas, type Checklist } from '@/lib/schemas/checklist';
import { earthingLabels, outcomeLabels, type ConfirmedEarthing, type Measurements, type SiteCheckResult, type SurveyOutcome } from '@/lib/schemas/outcome';
import { uploadKindInfo, type UploadKind } from '@/lib/schemas/uploads';
import { stageLabels, type StageId } from '@/lib/stages';
import { checkMpanCore } from '@/lib/validation/mpan';
import { planSketch, type PlanSketch } from '@/lib/plan/plan-sketch';
import { staffAnswer, staffLabel } from '@/lib/vocabulary';
import { listNotes } from './case-records.server';
import { findVisibleCase } from './cases.server';
import { db } from './db.server';
import { computeReadiness } from './readiness.server';
import { readinessSettings } from './settings.server';
import type { SessionUser } from './users.server';

export type PackAnswer = { path: string; label: string; value: string | null; confirmed?: string };
export type PackSection = { id: string; title: string; answers: PackAnswer[] };

export type PackUpload = {
  id: string;
  kind: UploadKind;
  kindTitle: string;
  status: UploadRow['status'];
  reason: string | null;
  mimeType: string;
  width: number | null;
  height: number | null;
  originalName: string | null;
  createdAt: Date;
  uploadedByRole: string | null;
  url: string;
  thumbUrl: string | null;
  /** Storage keys, for the PDF to read the bytes; never put into the page. */
  storageKey: string;
  thumbKey: string | null;
};

export type PackDocumentLine = { kind: UploadKind; title: string; state: UploadKindStatus['state']; reason: string | null; files: PackUpload[] };

export type PackOutcome = {
  outcome: SurveyOutcome;
  outcomeLabel: string;
  confirmedEarthing: string | null;
  confirmedFuseAmps: number | null;
  measurements: Measurements;
  notes: string | null;
  surveyorName: string | null;
  recordedAt: Date;
};

export interface Pack {
  caseId: string;
  reference: string;
  stage: StageId;
  stageLabel: string;
  surveyDate: string | null;
  surveyorName: string | null;
  generatedAt: Date;
  customer: { name: string | null; email: string; phone: string | null };
  address: { lines: string[]; postcode: string | null };
  mpan: { core: string | null; valid: boolean; region: string | null };
  readiness: { light: Light; gapCount: number; checks: SiteCheckResult[] };
  sections: PackSection[];
  figures: {
    demand: DemandFigures | null;
    network: NetworkFigures | null;
    cableRun: CableRunFigures | null;
    reach: ReachFigures | null;
    earthing: EarthingFigures | null;
  };
  photos: PackUpload[];
  documents: PackDocumentLine[];
  otherFiles: PackUpload[];
  gaps: { customer: CustomerGap[]; checks: { id: CheckId; title: string; light: Light; staffText: string; actions: string[] }[] };
  notes: { body: string; authorName: string | null; createdAt: Date }[];
  cautions: { text: string; source: string }[];
  outcome: PackOutcome | null;
}

export type DemandFigures = {
  items: DemandItem[];
  existingDemandAmps: number;
  chargerAmps: number;
  assessedDemandAmps: number;
  fuseAmps: number | null;
  headroomAmps: number | null;
  marginAmps: number;
  loadsDeclared: boolean;
  headroomByRating: { rating: number; headroomAmps: number }[];
  confirmedOnSite: boolean;
  /** 'measured' when a maximum demand from smart-meter or logger data replaced the estimate. */
  basis: 'estimated' | 'measured';
  firm: boolean;
  lowerBoundDemandAmps: number | null;
  chargerKw: number | null;
  chargerPhases: number;
  supplyPhases: number;
  phaseDemandAmps: number[] | null;
  assumptions: string[];
};
export type EarthingFigures = {
  earthing: string;
  measureNeeded: boolean;
  measureLabel: string | null;
  electrodeTest: { raOhms: number | null; idnMilliamps: number | null; touchVolts: number | null; passes: boolean | null; possiblyUnstable: boolean | null } | null;
  confirmedOnSite: boolean;
};
export type NetworkFigures = {
  route: string;
  settled: boolean;
  reasons: NetworkReason[];
  leadTimeDays: number;
  notifyWithinDays: number;
  demandLimitAmps: number;
  assessedDemandAmps: number;
  fuseAmps: number | null;
  region: string | null;
  supplyPhases: number;
};
export type CableRunFigures = {
  currentAmps: number;
  deviceAmps: number | null;
  terminalTemperatureC: number | null;
  method: string | null;
  phases: number;
  factors: CorrectionFactor[];
  factor: number | null;
  routeAssumption: string | null;
  upstreamPercent: number;
  chargerChosen: boolean;
  lengthMetres: number | null;
  route: string | null;
  limitPercent: number;
  limitVolts: number;
  table: string;
  sizes: CableSizeRow[];
  recommendedCsaMm2: number | null;
};
export type ReachFigures = {
  cableMetres: number;
  cableSource: string;
  port: string | null;
  habit: string | null;
  slackMetres: number | null;
  verdicts: ReachVerdict[];
  sketches: PlanSketch[];
  problem: string | null;
};

/**
 * The case if this user may read its pack: the office, or the surveyor it is assigned to.
 * Customers (even for their own case) and other surveyors get undefined, which callers answer
 * with 404, never 403.
 *
 * @example const row = await findPackCase(user, id); if (!row) throw notFound('That case');
 */
export async function findPackCase(user: SessionUser, id: string): Promise<CaseRow | undefined> {
  if (user.role !== 'admin' && user.role !== 'surveyor') return undefined;
  return findVisibleCase(user, id);
}

/**
 * The whole pack for one case the caller may see (the caller has already checked that).
 *
 * @example const pack = await gatherPack(row); pack.figures.cableRun?.recommendedCsaMm2 // 6
 */
export async function gatherPack(row: CaseRow): Promise<Pack> {
  const checklist = (row.checklist ?? {}) as Checklist;
  const [readiness, people, uploadRows, notes, outcome] = await Promise.all([
    readinessSettings().then((settings) => computeReadiness(db(), row, settings)),
    peopleOf(row),
    uploadRowsOf(row.id),
    listNotes(row.id),
    outcomeOf(row.id),
  ]);
  const checks = readiness.checks as SiteCheckResult[];
  const items = uploadRows.map(toPackUpload);
  const summaries = uploadRows.map((u) => ({ kind: u.kind, status: u.status, reason: u.reason }));
  const mpanCore = checklist.supply?.mpanCore ?? null;
  const mpan = mpanCore ? checkMpanCore(mpanCore) : null;
  return {
    caseId: row.id,
    reference: row.reference,
    stage: row.stage as StageId,
    stageLabel: stageLabels[row.stage as StageId],
    surveyDate: row.surveyDate,
    surveyorName: people.surveyor?.name ?? null,
    generatedAt: new Date(),
    customer: { name: people.customer?.name ?? checklist.about?.fullName ?? null, email: people.customer?.email ?? '', phone: checklist.about?.phone ?? people.customer?.phone ?? null },
    address: addressOf(row, checklist),
    mpan: { core: mpanCore, valid: Boolean(mpan?.ok), region: mpan?.ok ? mpan.region : null },
    readiness: { light: readiness.light, gapCount: readiness.gapCount, checks },
    sections: answerSections(checklist, outcome),
    figures: figuresOf(checks, checklist),
    photos: items.filter((u) => u.mimeType.startsWith('image/')),
    documents: documentLines(checklist, summaries, items),
    otherFiles: items.filter((u) => !requiredUploadKinds(checklist as ChecklistAnswers).includes(u.kind)),
    gaps: {
      customer: customerGaps(checklist, summaries),
      checks: checks.filter((c) => c.light !== 'green').map((c) => ({ id: c.id, title: c.title, light: c.light, staffText: c.staffText, actions: c.actions })),
    },
    notes: notes.map((n) => ({ body: n.body, authorName: n.authorName, createdAt: n.createdAt })),
    cautions: packCautions.map((c) => ({ ...c })),
    outcome,
  };
}

async function peopleOf(row: CaseRow) {
  const ids = [row.customerId, row.surveyorId].filter((id): id is string => Boolean(id));
  const found = await db().select({ id: users.id, name: users.name, email: users.email, phone: users.phone }).from(users).where(inArray(users.id, ids));
  return { customer: found.find((u) => u.id === row.customerId), surveyor: row.surveyorId ? found.find((u) => u.id === row.surveyorId) : undefined };
}

async function uploadRowsOf(caseId: string) {
  return db()
    .select({ upload: uploads, uploaderRole: users.role })
    .from(uploads)
    .leftJoin(users, eq(users.id, uploads.uploadedBy))
    .where(eq(uploads.caseId, caseId))
    .orderBy(uploads.createdAt, uploads.id)
    .then((rows) => rows.map((r) => ({ ...r.upload, uploaderRole: r.uploaderRole })));
}

/** The recorded survey outcome, if there is one. */
export async function outcomeOf(caseId: string): Promise<PackOutcome | null> {
  const [found] = await db()
    .select({ o: surveyOutcomes, surveyorName: users.name })
    .from(surveyOutcomes)
    .leftJoin(users, eq(users.id, surveyOutcomes.surveyorId))
    .where(eq(surveyOutcomes.caseId, caseId));
  if (!found) return null;
  const o = found.o;
  return {
    outcome: o.outcome,
    outcomeLabel: outcomeLabels[o.outcome],
    confirmedEarthing: o.confirmedEarthing ? earthingLabels[o.confirmedEarthing as ConfirmedEarthing] ?? o.confirmedEarthing : null,
    confirmedFuseAmps: o.confirmedFuseAmps,
    measurements: (o.measurements ?? {}) as Measurements,
    notes: o.notes,
    surveyorName: found.surveyorName,
    recordedAt: o.recordedAt,
  };
}

function toPackUpload(row: UploadRow & { uploaderRole: string | null }): PackUpload {
  return {
    id: row.id,
    kind: row.kind,
    kindTitle: row.kind === 'other' ? 'Other photo or document' : (uploadKindInfo[row.kind]?.title ?? row.kind),
    status: row.status,
    reason: row.reason,
    mimeType: row.mimeType,
    width: row.width,
    height: row.height,
    originalName: row.originalName,
    createdAt: row.createdAt,
    uploadedByRole: row.uploaderRole,
    url: `/api/uploads/${row.id}`,
    thumbUrl: row.thumbKey ? `/api/uploads/${row.id}?size=thumb` : null,
    storageKey: row.storageKey,
    thumbKey: row.thumbKey,
  };
}

function addressOf(row: CaseRow, checklist: Checklist) {
  const about = checklist.about ?? {};
  const lines = [row.addressLine1 ?? about.addressLine1, row.addressLine2 ?? about.addressLine2, row.town ?? about.town].filter((l): l is string => Boolean(l));
  return { lines, postcode: row.postcode ?? about.postcode ?? null };
}

/** Every answer, section by section in the checklist's order, with what the survey confirmed. */
function answerSections(checklist: Checklist, outcome: PackOutcome | null): PackSection[] {
  return sectionIds.map(([id, title]) => {
    const saved = (checklist[id] ?? {}) as Record<string, unknown>;
    const fields = Object.keys(sectionPatchSchemas[id].shape);
    const answers = fields.flatMap((field): PackAnswer[] => {
      if (id === 'supply' && field === 'loads') {
        const loads = (saved.loads ?? {}) as Record<string, unknown>;
        return loadFields.map((load) => answer(`supply.loads.${load}`, loads, load));
      }
      return [answer(`${id}.${field}`, saved, field)];
    });
    if (id === 'vehicle') explainRegistration(answers, saved);
    if (outcome) confirmAnswers(answers, outcome);
    return { id, title, answers };
  });
}

function answer(path: string, owner: Record<string, unknown>, key: string): PackAnswer {
  return { path, label: staffLabel(path), value: staffAnswer(path, owner[key], key in owner) };
}

// A car not registered yet is identified by its VIN: say so rather than "not answered".
function explainRegistration(answers: PackAnswer[], vehicle: Record<string, unknown>) {
  const registration = answers.find((a) => a.path === 'vehicle.registration');
  if (registration && registration.value === null && vehicle.vin) registration.value = 'Not registered yet (VIN given)';
}

function confirmAnswers(answers: PackAnswer[], outcome: PackOutcome) {
  for (const a of answers) {
    if (a.path === 'supply.earthing' && outcome.confirmedEarthing) a.confirmed = outcome.confirmedEarthing;
    if (a.path === 'supply.mainFuseAmps' && outcome.confirmedFuseAmps) a.confirmed = `${outcome.confirmedFuseAmps} A`;
  }
}

function documentLines(checklist: Checklist, summaries: { kind: UploadKind; status: UploadRow['status']; reason: string | null }[], items: PackUpload[]): PackDocumentLine[] {
  return requiredUploadKinds(checklist as ChecklistAnswers).map((kind) => {
    const status = uploadKindStatus(kind, summaries);
    return { kind, title: uploadKindInfo[kind].title, state: status.state, reason: status.reason, files: items.filter((u) => u.kind === kind) };
  });
}

// ---- computed figures, read from the checks' results -------------------------------------------

const num = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);
const str = (v: unknown): string | null => (typeof v === 'string' ? v : null);

function figuresOf(checks: SiteCheckResult[], checklist: Checklist): Pack['figures'] {
  const byId = (id: CheckId) => checks.find((c) => c.id === id);
  return {
    demand: demandFigures(byId('supply-headroom')),
    network: networkFigures(byId('network-operator')),
    cableRun: cableRunFigures(byId('cable-run')),
    reach: reachFigures(byId('cable-reach'), checklist),
    earthing: earthingFigures(byId('earthing')),
  };
}

function demandFigures(check: SiteCheckResult | undefined): DemandFigures | null {
  if (!check) return null;
  const f = check.figures;
  const byRating = f.headroomByRating && typeof f.headroomByRating === 'object' ? (f.headroomByRating as Record<string, number>) : {};
  return {
    items: (Array.isArray(f.items) ? f.items : []) as DemandItem[],
    existingDemandAmps: num(f.existingDemandAmps) ?? 0,
    chargerAmps: num(f.chargerAmps) ?? 0,
    assessedDemandAmps: num(f.assessedDemandAmps) ?? 0,
    fuseAmps: num(f.fuseAmps),
    headroomAmps: num(f.headroomAmps),
    marginAmps: num(f.marginAmps) ?? 0,
    loadsDeclared: Boolean(f.loadsDeclared),
    headroomByRating: Object.entries(byRating).map(([rating, headroomAmps]) => ({ rating: Number(rating), headroomAmps })),
    confirmedOnSite: Boolean(check.confirmedOnSite),
    basis: f.basis === 'measured' ? 'measured' : 'estimated',
    firm: Boolean(f.firm),
    lowerBoundDemandAmps: num(f.lowerBoundDemandAmps),
    chargerKw: num(f.chargerKw),
    chargerPhases: num(f.chargerPhases) ?? 1,
    supplyPhases: num(f.supplyPhases) ?? 1,
    phaseDemandAmps: Array.isArray(f.phaseDemandAmps) ? (f.phaseDemandAmps as number[]) : null,
    assumptions: (Array.isArray(f.assumptions) ? f.assumptions : []).filter((a): a is string => typeof a === 'string'),
  };
}

function earthingFigures(check: SiteCheckResult | undefined): EarthingFigures | null {
  if (!check) return null;
  const f = check.figures;
  return {
    earthing: str(f.earthing) ?? 'unknown',
    measureNeeded: Boolean(f.measureNeeded),
    measureLabel: str(f.earthingMeasureLabel),
    electrodeTest: f.electrodeTest && typeof f.electrodeTest === 'object' ? (f.electrodeTest as EarthingFigures['electrodeTest']) : null,
    confirmedOnSite: Boolean(check.confirmedOnSite),
  };
}

function networkFigures(check: SiteCheckResult | undefined): NetworkFigures | null {
  if (!check) return null;
  const f = check.figures;
  return {
    route: str(f.route) ?? 'apply-before',
    settled: Boolean(f.settled),
    reasons: (Array.isArray(f.reasons) ? f.reasons : []) as NetworkReason[],
    leadTimeDays: num(f.leadTimeDays) ?? 0,
    notifyWithinDays: num(f.notifyWithinDays) ?? 0,
    demandLimitAmps: num(f.demandLimitAmps) ?? 0,
    assessedDemandAmps: num(f.assessedDemandAmps) ?? 0,
    fuseAmps: num(f.fuseAmps),
    region: str(f.region),
    supplyPhases: num(f.supplyPhases) ?? 1,
  };
}

function cableRunFigures(check: SiteCheckResult | undefined): CableRunFigures | null {
  if (!check) return null;
  const f = check.figures;
  return {
    currentAmps: num(f.currentAmps) ?? 0,
    deviceAmps: num(f.deviceAmps),
    terminalTemperatureC: num(f.terminalTemperatureC),
    method: str(f.method),
    phases: num(f.phases) ?? 1,
    factors: (Array.isArray(f.factors) ? f.factors : []) as CorrectionFactor[],
    factor: num(f.factor),
    routeAssumption: str(f.routeAssumption),
    upstreamPercent: num(f.upstreamPercent) ?? 0,
    chargerChosen: f.chargerChosen !== false,
    lengthMetres: num(f.lengthMetres),
    route: str(f.route),
    limitPercent: num(f.limitPercent) ?? 0,
    limitVolts: num(f.limitVolts) ?? 0,
    table: str(f.table) ?? 'BS 7671 Table 4E4B (voltage drop) and Tables 4D4A / 4E4A (capacity)',
    sizes: (Array.isArray(f.sizes) ? f.sizes : []) as CableSizeRow[],
    recommendedCsaMm2: num(f.recommendedCsaMm2),
  };
}

function reachFigures(check: SiteCheckResult | undefined, checklist: Checklist): ReachFigures | null {
  if (!check) return null;
  const f = check.figures;
  const verdicts = (Array.isArray(f.verdicts) ? f.verdicts : []) as ReachVerdict[];
  const { plan, problems } = readPlan(checklist.charger?.plan);
  const ways = [...new Set(verdicts.map((v) => v.way))] as ParkingWay[];
  return {
    cableMetres: num(f.cableMetres) ?? 0,
    cableSource: str(f.cableSource) ?? '',
    port: str(f.port),
    habit: str(f.habit),
    slackMetres: num(f.slackMetres),
    verdicts,
    sketches: plan ? (ways.length ? ways : (['nose-in'] as ParkingWay[])).map((way) => planSketch(plan, verdicts, way)) : [],
    problem: plan ? (verdicts.length ? null : check.staffText) : (problems[0] ?? 'No driveway plan yet.'),
  };
}

// ---- the surveyor's list of visits ----------------------------------------------------------------

export type Visit = {
  id: string;
  reference: string;
  stage: StageId;
  surveyDate: string | null;
  address: string;
  postcode: string | null;
  customerName: string | null;
  light: Light;
  openChecks: { title: string; light: Light }[];
};

/**
 * The cases assigned to a surveyor, by survey date (soonest first, undated last), with the
 * stored readiness light and the checks still open.
 *
 * @example (await listVisits(surveyor))[0].light // 'amber'
 */
export async function listVisits(user: SessionUser): Promise<Visit[]> {
  const rows = await db()
    .select({
      id: cases.id,
      reference: cases.reference,
      stage: cases.stage,
      surveyDate: cases.surveyDate,
      addressLine1: cases.addressLine1,
      town: cases.town,
      postcode: cases.postcode,
      customerName: users.name,
      light: cases.readinessLight,
      checks: cases.readinessChecks,
    })
    .from(cases)
    .innerJoin(users, eq(users.id, cases.customerId))
    .where(and(eq(cases.surveyorId, user.id), inArray(cases.stage, ['survey_booked', 'surveyed'])))
    .orderBy(sql`${cases.surveyDate} asc nulls last`, cases.reference);
  return rows.map((r) => ({
    id: r.id,
    reference: r.reference,
    stage: r.stage as StageId,
    surveyDate: r.surveyDate,
    address: [r.addressLine1, r.town].filter(Boolean).join(', '),
    postcode: r.postcode,
    customerName: r.customerName,
    light: r.light,
    openChecks: ((r.checks ?? []) as SiteCheckResult[]).filter((c) => c.light !== 'green').map((c) => ({ title: c.title, light: c.light })),
  }));
}
