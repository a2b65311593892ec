// The demo scenario, all invented: Fernbrook Home Energy, a small electrical contractor in the
// fictional Yorkshire market town of Quillbury, preparing seven homes for charge point surveys.
// How each postcode, supply number, VIN and plate was chosen: seeds/demo-checklists.ts.
import { createHash, randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import type { PostgresJsDatabase } from 'drizzle-orm/postgres-js';
import PDFDocument from 'pdfkit';
import sharp from 'sharp';
import { createCase, createUser, readinessColumns } from './factories';
import {
  chandlersChecklist,
  daysFromNow,
  demoHomes,
  demoMpan,
  demoPlates,
  forgeChecklist,
  heronChecklist,
  orchardChecklist,
  tannersChecklist,
  wheelwrightChecklist,
} from './demo-checklists';
import { caseNotes, cases, caseVehicleLookups, settings, uploads, type CaseRow, type UploadRow } from '@/db/schema';
import { uploadLimits } from '@/lib/schemas/uploads';
import { readSiteMeasures } from '@/lib/schemas/outcome';
import { uploadStorage } from '@/lib/server/storage/index.server';
import { assessPhoto, measurePhoto, type Measured, type OtherPhoto } from '@/lib/server/photo-quality.server';
import { defaultReadinessSettings } from '@/lib/readiness/settings';

type Db = PostgresJsDatabase<Record<string, unknown>>;

export { demoMpan };

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
    ...demoHomes.tanners,
    invitedDaysAgo: 4,
    checklist: tannersChecklist(),
  });
  await createCase(db, { customerId: tobias!.id, stage: 'invited', ...demoHomes.mill, invitedDaysAgo: 1, fromInvitation: true });
  await createCase(db, {
    customerId: delphine!.id,
    stage: 'sent_for_review',
    ...demoHomes.orchard,
    invitedDaysAgo: 12,
    checklist: orchardChecklist(),
  });
  await createCase(db, {
    customerId: owen!.id,
    stage: 'in_review',
    ...demoHomes.wheelwright,
    invitedDaysAgo: 20,
    checklist: wheelwrightChecklist(),
  });
  // Every answer in, every photo accepted, and a measured maximum demand from smart-meter data:
  // the one case that clears every check.
  const chandlers = await createCase(db, {
    customerId: sunita!.id,
    stage: 'ready_for_survey',
    ...demoHomes.chandlers,
    invitedDaysAgo: 26,
    checklist: chandlersChecklist(),
    siteMeasures: { measuredMaxDemandAmps: 24 },
  });
  // The two booked surveys carry full answers and evidence, so the surveyor's packs have content.
  const forge = await createCase(db, {
    customerId: gareth!.id,
    stage: 'survey_booked',
    ...demoHomes.forge,
    invitedDaysAgo: 33,
    surveyorId: surveyor.id,
    surveyDate: daysFromNow(3),
    checklist: forgeChecklist(),
  });
  const heron = await createCase(db, {
    customerId: fen!.id,
    stage: 'survey_booked',
    ...demoHomes.heron,
    invitedDaysAgo: 30,
    surveyorId: surveyor.id,
    surveyDate: daysFromNow(6),
    checklist: heronChecklist(),
    // The office read a maximum demand from the customer's smart-meter data and chose open-PEN
    // protection in the charge point for the PME supply.
    siteMeasures: { measuredMaxDemandAmps: 44, earthingMeasure: 'open-pen-device' },
  });
  await seedEvidence(db, { caseRow: heron, customerId: fen!.id, reviewerId: admin.id, items: heronEvidence() });
  await seedEvidence(db, { caseRow: forge, customerId: gareth!.id, reviewerId: admin.id, items: forgeEvidence() });
  await seedEvidence(db, { caseRow: chandlers, customerId: sunita!.id, reviewerId: admin.id, items: chandlersEvidence() });
  // The registered cars were looked up in the vehicle records from the vehicle step, as a
  // customer's look-up stores it: the office sees where the make came from, and no warning.
  await db.insert(caseVehicleLookups).values([
    { caseId: forge.id, ...demoPlates.forge },
    { caseId: chandlers.id, ...demoPlates.chandlers },
  ]);
  await db.insert(caseNotes).values([
    { caseId: heron.id, authorId: admin.id, body: 'Tenant; landlord’s letter accepted. Side gate is unlocked on survey days. Customer would like the unit left of the front door, away from the bins.' },
    { caseId: forge.id, authorId: admin.id, body: '60 A cut-out and a long buried run to the garage: expect a network operator application. Customer happy to discuss load limiting.' },
  ]);
  await db
    .insert(settings)
    .values({ key: 'firm', value: { name: 'Fernbrook Home Energy', email: 'office@example.com', phone: '0113 496 0000' }, updatedBy: admin.id })
    .onConflictDoNothing();
}

// ---- the two booked surveys: full answers and invented, clearly synthetic evidence --------------

function chandlersEvidence(): Evidence[] {
  return [
    { kind: 'meter_photo', name: 'meter.jpg', status: 'accepted', svg: meterSvg },
    { kind: 'cutout_photo', name: 'cut-out.jpg', status: 'accepted', svg: cutoutSvg },
    { kind: 'consumer_unit_photo', name: 'consumer-unit.jpg', status: 'accepted', svg: consumerUnitSvg },
    { kind: 'charger_location_photo', name: 'front-wall.jpg', status: 'accepted', svg: chargerSpotSvg },
  ];
}

type Evidence = { kind: UploadRow['kind']; name: string; status: UploadRow['status']; reason?: string; svg?: string; pdf?: () => Promise<Buffer> };

/** A demo "photo": an invented drawing with a banner that says it is synthetic. */
function demoPhoto(title: string, drawing: string, background = '#d9dedc'): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" width="1200" height="900" font-family="DejaVu Sans, Liberation Sans, sans-serif">
<rect width="1200" height="900" fill="${background}"/>${drawing}
<rect y="820" width="1200" height="80" fill="#1c302e"/>
<text x="30" y="872" font-size="34" fill="#ffffff" font-weight="700">SYNTHETIC DEMO IMAGE</text>
<text x="1170" y="872" font-size="30" fill="#dcebe8" text-anchor="end">${title}</text></svg>`;
}

const meterSvg = demoPhoto('Electricity meter', `
<rect x="380" y="120" width="440" height="620" rx="24" fill="#f4f4f0" stroke="#444" stroke-width="6"/>
<rect x="440" y="200" width="320" height="110" rx="8" fill="#9fb8a4" stroke="#333" stroke-width="4"/>
<text x="600" y="280" font-size="72" font-family="DejaVu Sans Mono, monospace" text-anchor="middle" fill="#14241b">04712.6</text>
<text x="600" y="360" font-size="32" text-anchor="middle" fill="#333">kWh</text>
<text x="600" y="450" font-size="28" text-anchor="middle" fill="#333">Serial DEMO-00042</text>
<circle cx="600" cy="560" r="18" fill="#b3261e"/><text x="600" y="640" font-size="26" text-anchor="middle" fill="#555">1000 imp/kWh</text>`);

const cutoutSvg = demoPhoto('Main fuse (cut-out)', `
<rect x="400" y="90" width="400" height="680" rx="16" fill="#5b5f5e" stroke="#222" stroke-width="8"/>
<rect x="470" y="250" width="260" height="300" rx="14" fill="#8a8f8d" stroke="#222" stroke-width="6"/>
<text x="600" y="430" font-size="110" font-weight="700" text-anchor="middle" fill="#111">100 A</text>
<text x="600" y="200" font-size="34" text-anchor="middle" fill="#eee">SERVICE CUT-OUT</text>
<text x="600" y="650" font-size="30" text-anchor="middle" fill="#eee">SEALED · DO NOT OPEN</text>`);

const consumerUnitSvg = demoPhoto('Consumer unit', `
<rect x="160" y="200" width="880" height="420" rx="18" fill="#fafaf8" stroke="#444" stroke-width="6"/>
${[0, 1, 2, 3, 4, 5, 6, 7].map((i) => `<rect x="${220 + i * 100}" y="300" width="70" height="180" rx="6" fill="#e9ecea" stroke="#333" stroke-width="3"/><rect x="${240 + i * 100}" y="340" width="30" height="60" fill="#2b504c"/>`).join('')}
${['MAIN', 'RCD', 'B32', 'B16', 'B6', 'B40', 'B20', 'SPARE'].map((l, i) => `<text x="${255 + i * 100}" y="530" font-size="26" text-anchor="middle" fill="#222">${l}</text>`).join('')}
<text x="600" y="270" font-size="30" text-anchor="middle" fill="#333">Cover closed · labels readable</text>`);

const chargerSpotSvg = demoPhoto('Wanted charge point spot', `
<rect x="0" y="0" width="1200" height="520" fill="#c98b63"/>
${Array.from({ length: 13 }, (_, r) => `<line x1="0" y1="${r * 40}" x2="1200" y2="${r * 40}" stroke="#a8714f" stroke-width="4"/>`).join('')}
<rect x="760" y="120" width="200" height="400" fill="#3b5e58"/><text x="860" y="330" font-size="30" text-anchor="middle" fill="#fff">DOOR</text>
<rect x="430" y="190" width="200" height="170" fill="none" stroke="#ffffff" stroke-width="8" stroke-dasharray="24 14"/>
<text x="530" y="290" font-size="28" font-weight="700" text-anchor="middle" fill="#fff">CHARGE POINT</text>
<rect x="0" y="520" width="1200" height="300" fill="#8e8f8a"/><text x="600" y="700" font-size="34" text-anchor="middle" fill="#222">Driveway</text>`);

const letterSvg = demoPhoto('Landlord’s permission', `
<rect x="260" y="60" width="680" height="740" fill="#ffffff" stroke="#999" stroke-width="3"/>
<text x="310" y="150" font-size="30" font-weight="700" fill="#222">Quillbury Lettings (demo)</text>
<text x="310" y="230" font-size="24" fill="#333">To whom it may concern,</text>
<text x="310" y="290" font-size="24" fill="#333">I agree to a charge point being fitted</text>
<text x="310" y="330" font-size="24" fill="#333">at ${demoHomes.heron.addressLine1}, ${demoHomes.heron.town}, ${demoHomes.heron.postcode}.</text>
<text x="310" y="420" font-size="24" fill="#333">Signed: A. Landlord (invented)</text>
<text x="310" y="720" font-size="22" fill="#777">This letter is invented for the demo.</text>`, '#cfd4d2');

const earthSvg = demoPhoto('Earth cable at the meter', `
<rect x="300" y="120" width="300" height="500" rx="14" fill="#5b5f5e" stroke="#222" stroke-width="6"/>
<path d="M600 420 C 760 430, 800 560, 940 600" stroke="#2f8f3a" stroke-width="26" fill="none"/>
<path d="M600 420 C 760 430, 800 560, 940 600" stroke="#e2c542" stroke-width="10" stroke-dasharray="30 30" fill="none"/>
<text x="760" y="700" font-size="30" text-anchor="middle" fill="#222">Green/yellow earth to the cut-out</text>`);

const routeSvg = demoPhoto('Cable route along the side wall', `
<rect x="0" y="0" width="1200" height="820" fill="#c98b63"/>
${Array.from({ length: 21 }, (_, r) => `<line x1="0" y1="${r * 40}" x2="1200" y2="${r * 40}" stroke="#a8714f" stroke-width="4"/>`).join('')}
<path d="M120 640 H 900 V 260" stroke="#ffffff" stroke-width="14" stroke-dasharray="36 20" fill="none"/>
<text x="500" y="600" font-size="32" font-weight="700" text-anchor="middle" fill="#fff">about 24 m, clipped to the wall</text>`);

const lawnSvg = demoPhoto('Soft ground by the drive', `
<rect x="0" y="0" width="1200" height="820" fill="#5f9a4e"/>
${Array.from({ length: 60 }, (_, i) => `<line x1="${(i * 97) % 1200}" y1="${(i * 53) % 800}" x2="${((i * 97) % 1200) + 8}" y2="${((i * 53) % 800) - 24}" stroke="#3f7a33" stroke-width="4"/>`).join('')}
<rect x="0" y="0" width="380" height="820" fill="#8e8f8a"/><circle cx="640" cy="420" r="24" fill="#c26d33"/>
<text x="640" y="500" font-size="30" font-weight="700" text-anchor="middle" fill="#fff">lawn, about 3 m from the charge point</text>`);

const dimCutoutSvg = demoPhoto('Main fuse (cut-out)', `
<rect x="420" y="110" width="360" height="640" rx="16" fill="#3d403f" stroke="#111" stroke-width="8"/>
<rect x="480" y="260" width="240" height="280" rx="14" fill="#575b59"/>
<text x="600" y="430" font-size="96" font-weight="700" text-anchor="middle" fill="#1a1a1a">60 A</text>`, '#8f9593');

const darkUnitSvg = demoPhoto('Consumer unit (too dark)', `
<rect x="200" y="240" width="800" height="380" rx="18" fill="#4a4d4c"/>
${[0, 1, 2, 3, 4, 5].map((i) => `<rect x="${270 + i * 115}" y="330" width="70" height="170" rx="6" fill="#3a3d3c"/>`).join('')}`, '#2a2c2b');

/** A one-page order agreement PDF, invented, made with pdfkit like the pack itself. */
function orderAgreementPdf(): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({ size: 'A4', margin: 56, info: { Title: 'Order agreement (demo)' } });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.fontSize(18).text('Vehicle order agreement (SYNTHETIC DEMO DOCUMENT)');
    doc.moveDown().fontSize(12).text(`Customer: Fen Ashdown, ${demoHomes.heron.addressLine1}, ${demoHomes.heron.town}, ${demoHomes.heron.postcode}`);
    doc.text(`Vehicle: ${heronChecklist().vehicle.make} ${heronChecklist().vehicle.model}, new`);
    doc.text(`Expected delivery: ${daysFromNow(70)}`);
    doc.moveDown().text('Every name, address and figure in this document is invented for the Groundwork demo.');
    doc.end();
  });
}

function heronEvidence(): Evidence[] {
  return [
    { kind: 'meter_photo', name: 'meter.jpg', status: 'accepted', svg: meterSvg },
    { kind: 'cutout_photo', name: 'cut-out.jpg', status: 'accepted', svg: cutoutSvg },
    { kind: 'consumer_unit_photo', name: 'fuse-box.jpg', status: 'accepted', svg: consumerUnitSvg },
    { kind: 'charger_location_photo', name: 'front-wall.jpg', status: 'accepted', svg: chargerSpotSvg },
    { kind: 'order_agreement', name: 'order-agreement.pdf', status: 'accepted', pdf: orderAgreementPdf },
    { kind: 'landlord_permission', name: 'landlord-letter.jpg', status: 'accepted', svg: letterSvg },
    { kind: 'other', name: 'earth-at-meter.jpg', status: 'accepted', svg: earthSvg },
    { kind: 'other', name: 'cable-route.jpg', status: 'waiting', svg: routeSvg },
    { kind: 'other', name: 'lawn.jpg', status: 'waiting', svg: lawnSvg },
  ];
}

function forgeEvidence(): Evidence[] {
  return [
    { kind: 'meter_photo', name: 'meter.jpg', status: 'accepted', svg: meterSvg },
    { kind: 'cutout_photo', name: 'cutout.jpg', status: 'waiting', svg: dimCutoutSvg },
    { kind: 'consumer_unit_photo', name: 'consumer-unit.jpg', status: 'rejected', reason: 'Too dark: the switch labels cannot be read.', svg: darkUnitSvg },
  ];
}

type Prepared = { evidence: Evidence; main: Buffer; thumb: Buffer | null; mimeType: string; width: number | null; height: number | null; measured: Measured | null };

// Images go through sharp as an upload would (JPEG plus a WebP thumbnail of the same width).
async function prepareEvidence(evidence: Evidence): Promise<Prepared> {
  if (evidence.pdf) return { evidence, main: await evidence.pdf(), thumb: null, mimeType: 'application/pdf', width: null, height: null, measured: null };
  const { data: main, info } = await sharp(Buffer.from(evidence.svg!)).jpeg({ quality: 85 }).toBuffer({ resolveWithObject: true });
  const thumb = await sharp(main).resize({ width: uploadLimits.thumbWidth, withoutEnlargement: true }).webp({ quality: 75 }).toBuffer();
  // The photo check, as at upload (the dim cut-out and the dark consumer unit are flagged).
  const measured = await measurePhoto(main, info.width, info.height);
  return { evidence, main, thumb, mimeType: 'image/jpeg', width: info.width, height: info.height, measured };
}

/** Stores each file through the storage interface, adds its uploads row, then restores the case's readiness. */
async function seedEvidence(db: Db, input: { caseRow: CaseRow; customerId: string; reviewerId: string; items: Evidence[] }) {
  const storage = uploadStorage();
  const prepared = await Promise.all(input.items.map(prepareEvidence));
  const start = Date.now() - prepared.length * 60_000 - 86_400_000;
  const rows = [];
  const seen: OtherPhoto[] = [];
  for (const [i, p] of prepared.entries()) {
    const quality = p.measured ? assessPhoto(p.measured, p.evidence.kind, defaultReadinessSettings, seen) : null;
    if (p.measured) seen.push({ kind: p.evidence.kind, hash: p.measured.hash });
    const id = randomUUID();
    const shard = id.slice(0, 2);
    const storageKey = `${shard}/${id}.${p.mimeType === 'application/pdf' ? 'pdf' : 'jpg'}`;
    const thumbKey = p.thumb ? `${shard}/${id}-thumb.webp` : null;
    await storage.put(storageKey, p.main);
    if (thumbKey && p.thumb) await storage.put(thumbKey, p.thumb);
    const reviewed = p.evidence.status !== 'waiting';
    rows.push({
      id,
      caseId: input.caseRow.id,
      kind: p.evidence.kind,
      mimeType: p.mimeType,
      sizeBytes: p.main.length,
      sha256: createHash('sha256').update(p.main).digest('hex'),
      width: p.width,
      height: p.height,
      originalName: p.evidence.name,
      uploadedBy: input.customerId,
      status: p.evidence.status,
      reason: p.evidence.reason ?? null,
      reviewedBy: reviewed ? input.reviewerId : null,
      reviewedAt: reviewed ? new Date(start + (i + 30) * 60_000) : null,
      createdAt: new Date(start + i * 60_000),
      storageKey,
      thumbKey,
      qualityOk: quality ? quality.ok : null,
      quality,
      perceptualHash: p.measured?.hash ?? null,
    });
  }
  await db.insert(uploads).values(rows);
  const readiness = readinessColumns(
    input.caseRow.checklist as Record<string, unknown>,
    rows.map((r) => ({ kind: r.kind, status: r.status, reason: r.reason })),
    readSiteMeasures(input.caseRow.siteMeasures),
  );
  await db
    .update(cases)
    .set({ ...readiness, lastCustomerActivityAt: new Date(start + prepared.length * 60_000) })
    .where(eq(cases.id, input.caseRow.id));
}

/**
 * Every demo photo (drawn, invented) with its slot, the office's decision and whether it was drawn
 * hard to read on purpose, for
 * `npm run bench:photo-quality`, which reports the photo check's false-positive rate on them.
 */
export function demoPhotos(): { case: string; kind: UploadRow['kind']; name: string; status: UploadRow['status']; svg: string; poor: boolean }[] {
  const sets = { Chandler: chandlersEvidence(), Heron: heronEvidence(), Forge: forgeEvidence() };
  // Two drawings are made hard to read on purpose: the dim cut-out and the dark consumer unit.
  const poor = new Set([dimCutoutSvg, darkUnitSvg]);
  return Object.entries(sets).flatMap(([name, items]) =>
    items.filter((e) => e.svg).map((e) => ({ case: name, kind: e.kind, name: e.name, status: e.status, svg: e.svg!, poor: poor.has(e.svg!) })),
  );
}
