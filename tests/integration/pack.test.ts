// The surveyor's summary pack, on screen and as a PDF, over real HTTP against the built app.
// The PDF's text is read back with pdf-parse, so these checks see what a reader of the file sees.
import sharp from 'sharp';
import { PDFParse } from 'pdf-parse';
import { beforeAll, describe, expect, it } from 'vitest';
import { Client } from '../helpers/http';
import { db } from '../helpers/db';
import { newCustomer, newStaff } from '../helpers/people';

let admin: Client;
let surveyor: Client;
let otherSurveyor: Client;
let customer: Client;
let caseId: string;
let reference: string;

// A valid MPAN core: the trade reference's worked example. Weights 3,5,7,13,17,19,23,29,31,37,41,43
// over 131234567890 sum to 1349; 1349 mod 11 = 7, 7 mod 10 = 7: check digit 7 (MRA/Elexon MPAN definition).
const MPAN = '1312345678907';
const POSTCODE = 'AB12 3DE';

// Cable run 32 m buried, a 7.4 kW (32 A) charger on a 32 A device: Ib ≤ In ≤ Iz (BS 7671:2018+A2:2022
// Regulation 433.1.1), 70 °C terminals, so Table 4D4A method D capacities (from memory): 2.5 mm² 29 A,
// 4 mm² 37 A, 6 mm² 46 A. Drop from Table 4E4B (2-core, 90 °C) against 5% of 230 V = 11.5 V
// (Appendix 4, Table 4Ab); V = mV/A/m × I × L / 1000:
//   2.5 mm²: 29 A < In 32 A                        fails (Iz below In)
//   4 mm²:   12  × 32 × 32 / 1000 = 12.288 V        fails (drop)
//   6 mm²:   7.9 × 32 × 32 / 1000 =  8.0896 V, 46 A passes
// so the smallest size that passes is 6 mm².
const CABLE_RUN_METRES = 32;
const RECOMMENDED = '6 mm²';

const checklist = {
  about: { fullName: 'Pia Lindqvist', email: 'pia@example.org', phone: '+441134960111', addressLine1: '21 Weaver Street', town: 'Quillbury', postcode: POSTCODE, tenure: 'owner', propertyType: 'house' },
  // The connector is left out on purpose: it must show as an open gap.
  vehicle: { make: 'Example Motors', model: 'Volta 3', condition: 'used', registration: 'LM19 RTW', deliveryDate: '2099-06-01', chargePort: 'front-left' },
  supply: { mpanCore: MPAN, mainFuseAmps: 100, looped: 'no', consumerUnitLocation: 'Hall cupboard', earthing: 'pme', phases: 'single', loads: { showerKw: 0, cooker: false, immersion: false, heatPumpKw: 0, storageHeaters: 0, otherEvCharger: false, solarPv: false, socketCircuits: 2 } },
  parking: { kind: 'attached-drive', cars: 1, habit: 'nose-in' },
  charger: {
    location: 'Garage side wall', cableRunMetres: CABLE_RUN_METRES, route: 'buried', softGround: false, preference: 'tethered', tetherMetres: 5, ratingKw: 7.4,
    plan: { wall: { x0: 0, x1: 8 }, chargePoint: { x: 4, y: 0 }, bays: [{ x: 2.8, y: 0.5, width: 2.4, length: 4.8, angle: 0 }], car: { sizeClass: 'medium' }, chargePort: 'front-left' },
  },
};

/** A labelled grey box, drawn with sharp: a stand-in photo. */
const photo = (label: string) =>
  sharp(Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg" width="640" height="480"><rect width="640" height="480" fill="#888"/><text x="320" y="260" font-size="60" text-anchor="middle">${label}</text></svg>`))
    .jpeg()
    .toBuffer();

async function upload(client: Client, kind: string, bytes: Buffer, name: string) {
  const form = new FormData();
  form.append('kind', kind);
  form.append('file', new Blob([new Uint8Array(bytes)], { type: 'image/jpeg' }), name);
  const r = await client.json(`/api/cases/${caseId}/uploads`, { method: 'POST', body: form });
  expect(r.status).toBe(201);
}

const words = (text: string) => text.replace(/\s+/g, ' ');

// The saved ids of this case's choices and of the figures' codes, which must read as words.
const RAW_IDS = ['front-left', 'attached-drive', 'nose-in', 'reverse-in', 'notify-after', 'apply-before', 'tether-assumed', 'customer-cable-assumed'];
const rawIdsIn = (text: string) => RAW_IDS.filter((id) => new RegExp(`(^|[^\\w-])${id}([^\\w-]|$)`).test(text));

async function pdfText(bytes: Buffer): Promise<{ text: string; pages: number }> {
  const parser = new PDFParse({ data: new Uint8Array(bytes) });
  try {
    const result = await parser.getText();
    return { text: result.text, pages: result.total };
  } finally {
    await parser.destroy();
  }
}

beforeAll(async () => {
  const [a, s, o] = await Promise.all([newStaff('admin'), newStaff('surveyor'), newStaff('surveyor')]);
  admin = a.client;
  surveyor = s.client;
  otherSurveyor = o.client;
  const c = await newCustomer({ stage: 'survey_booked', checklist, surveyorId: s.user.id, surveyDate: '2099-05-20', addressLine1: '21 Weaver Street', town: 'Quillbury', postcode: POSTCODE });
  customer = c.client;
  caseId = c.case!.id;
  reference = c.case!.reference;
  // The office adds two photos; the consumer unit photo stays missing, another open gap.
  await upload(admin, 'meter_photo', await photo('METER'), 'meter.jpg');
  await upload(admin, 'cutout_photo', await photo('100 A'), 'cutout.jpg');
});

describe('GET /api/cases/:id/pack.pdf', () => {
  it('is a valid PDF with the MPAN, postcode, recommended cable size, open gaps, cautions and page footers', async () => {
    const res = await surveyor.fetch(`/api/cases/${caseId}/pack.pdf`);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    expect(res.headers.get('content-disposition')).toBe(`attachment; filename="groundwork-pack-${reference}.pdf"`);
    const bytes = Buffer.from(await res.arrayBuffer());
    // ISO 32000-1 §7.5.2 and §7.5.5: a PDF starts with "%PDF-" and ends with "%%EOF".
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(bytes.subarray(-32).toString('latin1')).toContain('%%EOF');
    const raw = bytes.toString('latin1');
    // The font is embedded (a TrueType/OpenType font file), not a standard PDF font by name.
    expect(raw).toMatch(/\/BaseFont \/[A-Z]{6}\+SourceSans3/);
    expect(raw).toMatch(/\/FontFile[23]?/);
    // Both photos went in as images.
    expect(raw.match(/\/Subtype \/Image/g)?.length ?? 0).toBeGreaterThanOrEqual(2);

    const { text, pages } = await pdfText(bytes);
    const all = words(text);
    expect(all).toContain(MPAN);
    expect(all).toContain(POSTCODE);
    expect(all).toContain(`Recommended: ${RECOMMENDED}`);
    expect(all).toContain('Passes: recommended');
    // The sizing basis and the rejected 2.5 mm² row, the demand basis and the earthing measure still to record.
    // (The embedded font has no ≤, so the PDF writes "<=".)
    expect(all).toContain('Ib 32 A <= In 32 A <= Iz; 70 °C terminals; method D');
    expect(all).not.toContain('I?n');
    expect(all).toContain('Iz below In');
    expect(all).toContain('Estimated by IET On-Site Guide Table A2, every load answered');
    expect(all).toContain('Not recorded yet: amber until it is');
    // Open gaps: the missing connector answer and the missing consumer unit photo, in the customer's words,
    // and the cable-run check, amber because a buried 32 m run is long and costly (common practice).
    expect(all).toContain('the car’s charging plug type');
    expect(all).toContain('Upload a photo of your consumer unit.');
    expect(all).toContain('Cable from your consumer unit to the charge point');
    // The cautions, word for word as the trade reference gives them ("Cautions to show").
    expect(all).toContain('Never open the cut-out, the meter or the consumer unit, or remove covers: photos only.');
    expect(all).toContain('Only the network operator (or its agent) may change the main fuse or the cut-out.');
    expect(all).toContain('designed, installed and certified by a qualified electrician under BS 7671');
    // Saved ids never reach the PDF: the port, the parking and the habit read in staff words.
    expect(rawIdsIn(all)).toEqual([]);
    expect(all).toContain('Front left');
    expect(all).toContain('Driveway at the home');
    // Every page carries the reference and "page N of M".
    expect(pages).toBeGreaterThanOrEqual(2);
    for (let n = 1; n <= pages; n += 1) expect(all).toContain(`${reference} · page ${n} of ${pages}`);
  });

  it('is for the office and the assigned surveyor only: other surveyors and customers 404, anonymous 401', async () => {
    expect((await admin.fetch(`/api/cases/${caseId}/pack.pdf`)).status).toBe(200);
    expect((await surveyor.fetch(`/api/cases/${caseId}/pack.pdf`)).status).toBe(200);
    const other = await otherSurveyor.json(`/api/cases/${caseId}/pack.pdf`);
    expect(other.status).toBe(404);
    expect(other.body.error.code).toBe('not_found');
    // Even the case's own customer: the pack is a staff document.
    expect((await customer.fetch(`/api/cases/${caseId}/pack.pdf`)).status).toBe(404);
    const anonymous = await new Client().json(`/api/cases/${caseId}/pack.pdf`);
    expect(anonymous.status).toBe(401);
    expect(anonymous.body.error.code).toBe('unauthenticated');
    expect((await admin.fetch('/api/cases/00000000-0000-0000-0000-000000000000/pack.pdf')).status).toBe(404);
  });
});

describe('the pack page /surveys/cases/:id', () => {
  it('shows the answers, figures, photos, gaps and cautions to the assigned surveyor, print-ready', async () => {
    const res = await surveyor.fetch(`/surveys/cases/${caseId}`);
    expect(res.status).toBe(200);
    const html = words(await res.text());
    expect(html).toContain(MPAN);
    expect(html).toContain(POSTCODE);
    expect(html).toContain(`<strong data-testid="recommended-size">${RECOMMENDED}</strong>`);
    expect(html).toMatch(/data-testid="cable-basis">Ib 32 A ≤ In 32 A ≤ Iz; 70 °C terminals; method D/);
    expect(html).toMatch(/data-testid="earthing-measure">Not recorded yet/);
    expect(html).toContain('Upload a photo of your consumer unit.');
    expect(html).toContain('Never open the cut-out, the meter or the consumer unit, or remove covers: photos only.');
    expect(html).toMatch(/@page\s*\{\s*size:\s*A4;\s*margin:\s*15mm;?\s*\}/);
    // Saved ids never reach the page's text (attributes such as data-testid are not read).
    expect(rawIdsIn(html.replace(/<style[\s\S]*?<\/style>|<script[\s\S]*?<\/script>|<[^>]+>/g, ' '))).toEqual([]);
    // Photos as thumbnails at least 300 px wide (the stored thumbnails are 480 px).
    const images = [...html.matchAll(/<img[^>]*src="\/api\/uploads\/[0-9a-f-]{36}\?size=thumb"[^>]*>/g)];
    expect(images).toHaveLength(2);
    for (const [img] of images) expect(img).toContain('min-w-[300px]');
    expect(html).toContain(`href="/api/cases/${caseId}/pack.pdf"`);
    // A light is never colour alone: each carries its word.
    expect(html).toMatch(/data-light="amber"[^>]*>.*?Needs attention/);
  });

  it('is the admin’s too, and a 404 for other surveyors and customers; anonymous visitors are sent to sign in', async () => {
    expect((await admin.fetch(`/surveys/cases/${caseId}`)).status).toBe(200);
    expect((await otherSurveyor.fetch(`/surveys/cases/${caseId}`)).status).toBe(404);
    expect((await customer.fetch(`/surveys/cases/${caseId}`)).status).toBe(404);
    const anonymous = await new Client().fetch(`/surveys/cases/${caseId}`);
    expect(anonymous.status).toBe(302);
    expect(anonymous.headers.get('location')).toContain('/signin');
  });

  it('lists the visit on the surveyor’s home with its light and open gaps, and not on another surveyor’s', async () => {
    const mine = words(await (await surveyor.fetch('/surveys')).text());
    expect(mine).toContain(`data-reference="${reference}"`);
    expect(mine).toContain('21 Weaver Street');
    expect(mine).toContain('Cable from your consumer unit to the charge point');
    const theirs = await (await otherSurveyor.fetch('/surveys')).text();
    expect(theirs).not.toContain(reference);
  });
});
