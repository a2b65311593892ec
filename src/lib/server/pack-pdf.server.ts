// Server-only: the survey pack as an A4 PDF, drawn with pdfkit from the same gathered pack as
// the page. Source Sans 3 is embedded (WOFF, which pdfkit reads), photos go in as JPEG thumbnails
// made with sharp, and every page carries the case reference and "page N of M".
import { readFile } from 'node:fs/promises';
import { createRequire } from 'node:module';
import { inflateSync } from 'node:zlib';
import PDFDocument from 'pdfkit';
import sharp from 'sharp';
import type { Light } from '@/lib/readiness';
import { measurementFields, measurementIds } from '@/lib/schemas/outcome';
import {
  cableSourceWords,
  fmt,
  headroomWords,
  formatDay,
  formatMoment,
  lightWords,
  cableBasisWords,
  demandBasisWords,
  electrodeTestWords,
  uploadStateWords,
  wayWord,
  portWord,
  gapWords,
  networkRouteWord,
} from '@/lib/vocabulary';
import { countOf } from '@/lib/grammar';
import type { PlanSketch, SketchShape } from '@/lib/plan/plan-sketch';
import type { Pack, PackUpload } from './pack.server';
import { uploadStorage } from './storage/index.server';

type Doc = PDFKit.PDFDocument;

// ---- fonts ------------------------------------------------------------------------------------

const requireHere = createRequire(import.meta.url);
const fontFile = (name: string) => requireHere.resolve(`@fontsource/source-sans-3/files/${name}`);

type Fonts = { regular: Buffer; bold: Buffer; covers: (codePoint: number) => boolean };
let fontsLoading: Promise<Fonts> | undefined;

/** The WOFF files and the code points their "latin" subset holds (from the package's unicode.json). */
function fonts(): Promise<Fonts> {
  fontsLoading ??= Promise.all([
    readFile(fontFile('source-sans-3-latin-400-normal.woff')),
    readFile(fontFile('source-sans-3-latin-700-normal.woff')),
    readFile(requireHere.resolve('@fontsource/source-sans-3/unicode.json'), 'utf8'),
  ]).then(([regular, bold, unicode]) => ({
    regular: woffToSfnt(regular),
    bold: woffToSfnt(bold),
    covers: rangesCheck((JSON.parse(unicode) as Record<string, string>).latin ?? 'U+0000-00FF'),
  }));
  return fontsLoading;
}

/**
 * Unpacks a WOFF 1.0 file into the plain OpenType font it wraps (W3C WOFF 1.0, sections 4-5).
 * Done once per process: fontkit would otherwise inflate every table in JavaScript for each PDF.
 * @example woffToSfnt(await readFile('font.woff')).readUInt32BE(0) // 0x00010000 or 'OTTO'
 */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.toString('latin1', 0, 4) !== 'wOFF') return woff;
  const numTables = woff.readUInt16BE(12);
  const tables = Array.from({ length: numTables }, (_, i) => {
    const at = 44 + i * 20;
    const offset = woff.readUInt32BE(at + 4);
    const compLength = woff.readUInt32BE(at + 8);
    const origLength = woff.readUInt32BE(at + 12);
    const raw = woff.subarray(offset, offset + compLength);
    return { tag: woff.subarray(at, at + 4), checksum: woff.readUInt32BE(at + 16), data: compLength < origLength ? inflateSync(raw) : raw };
  });
  const entrySelector = Math.floor(Math.log2(numTables));
  const searchRange = 2 ** entrySelector * 16;
  const head = Buffer.alloc(12 + numTables * 16);
  woff.copy(head, 0, 4, 8);
  head.writeUInt16BE(numTables, 4);
  head.writeUInt16BE(searchRange, 6);
  head.writeUInt16BE(entrySelector, 8);
  head.writeUInt16BE(numTables * 16 - searchRange, 10);
  const parts: Buffer[] = [head];
  let offset = head.length;
  tables.forEach((table, i) => {
    const at = 12 + i * 16;
    table.tag.copy(head, at);
    head.writeUInt32BE(table.checksum, at + 4);
    head.writeUInt32BE(offset, at + 8);
    head.writeUInt32BE(table.data.length, at + 12);
    const padded = Buffer.alloc((table.data.length + 3) & ~3);
    table.data.copy(padded);
    parts.push(padded);
    offset += padded.length;
  });
  return Buffer.concat(parts);
}

function rangesCheck(spec: string): (codePoint: number) => boolean {
  const ranges = spec.split(',').map((part) => {
    const [from, to] = part.replace(/U\+/g, '').split('-');
    return [parseInt(from!, 16), parseInt(to ?? from!, 16)] as const;
  });
  return (cp) => ranges.some(([from, to]) => cp >= from && cp <= to);
}

// Characters the pack's own texts use that the latin subset lacks, in words the font has.
// Δ is written out so "IΔn" (the RCD's rated residual current) never turns into "I?n".
const stand_ins: Record<string, string> = { '≤': '<=', '≥': '>=', 'Ω': ' ohm', '→': '->', '≈': '~', '✓': '', 'Δ': 'Delta ', '√': 'sqrt' };

/**
 * Text the embedded font can draw: known stand-ins first, then accents dropped, then "?".
 * @example safeText('RA ≤ 1667 Ω', covers) // 'RA <= 1667  ohm'
 */
export function safeText(text: string, covers: (codePoint: number) => boolean): string {
  let out = '';
  for (const ch of text) {
    const cp = ch.codePointAt(0)!;
    if (covers(cp)) out += ch;
    else if (ch in stand_ins) out += stand_ins[ch];
    else {
      const plain = ch.normalize('NFKD').replace(/\p{M}/gu, '');
      out += [...plain].every((c) => covers(c.codePointAt(0)!)) && plain ? plain : '?';
    }
  }
  return out;
}

// ---- photos -----------------------------------------------------------------------------------

/** Longest side of an embedded photo, in pixels: plenty to read a fuse carrier's rating. */
const PHOTO_PIXELS = 720;

async function readStored(key: string): Promise<Buffer | null> {
  const stored = await uploadStorage().get(key);
  if (!stored) return null;
  return Buffer.concat(await stored.stream.toArray());
}

/** Each photo resized and re-encoded as JPEG (pdfkit embeds JPEG as is, so this is the cheap path). */
async function photoJpegs(photos: readonly PackUpload[]): Promise<Map<string, Buffer>> {
  const done = await Promise.all(
    photos.map(async (photo) => {
      try {
        const bytes = await readStored(photo.storageKey);
        if (!bytes) return null;
        const jpeg = await sharp(bytes, { failOn: 'none' })
          .resize({ width: PHOTO_PIXELS, height: PHOTO_PIXELS, fit: 'inside', withoutEnlargement: true })
          .flatten({ background: '#ffffff' })
          .jpeg({ quality: 78 })
          .toBuffer();
        return [photo.id, jpeg] as const;
      } catch {
        // One unreadable file should not stop the pack: the page says it is missing.
        return null;
      }
    }),
  );
  return new Map(done.filter((d): d is readonly [string, Buffer] => d !== null));
}

// ---- layout -----------------------------------------------------------------------------------

const MM = 72 / 25.4;
const MARGIN = 15 * MM;
const colours = {
  ink: '#1d2524',
  ground: '#25413e',
  muted: '#4a5a58',
  rule: '#b9d6d0',
  soft: '#f2f7f6',
  clay: '#a65629',
  green: '#1f7a4d',
  amber: '#9a6100',
  red: '#b3261e',
  greenSoft: '#e3f3ea',
  amberSoft: '#fbf0d9',
  redSoft: '#fbe4e2',
};
const lightColour: Record<Light, string> = { green: colours.green, amber: colours.amber, red: colours.red };
const lightSoft: Record<Light, string> = { green: colours.greenSoft, amber: colours.amberSoft, red: colours.redSoft };

type Cell = string | { text: string; bold?: boolean; colour?: string } | { light: Light };
type Column = { header: string; width: number };

/** Writes the pack top to bottom, breaking pages itself so tables keep their headers. */
class PackWriter {
  readonly left = MARGIN;
  readonly width: number;
  readonly bottom: number;

  constructor(
    readonly doc: Doc,
    readonly t: (text: string) => string,
  ) {
    this.width = doc.page.width - 2 * MARGIN;
    this.bottom = doc.page.height - MARGIN - 6;
  }

  get y() {
    return this.doc.y;
  }

  /** Starts a new page unless `height` points still fit. */
  room(height: number) {
    if (this.doc.y + height > this.bottom) this.doc.addPage();
  }

  font(bold: boolean, size: number, colour = colours.ink) {
    this.doc.font(bold ? 'bold' : 'regular').fontSize(size).fillColor(colour);
    return this;
  }

  heading(text: string) {
    this.room(60);
    this.doc.moveDown(0.6);
    this.font(true, 13, colours.ground).doc.text(this.t(text), this.left, this.doc.y, { width: this.width });
    const y = this.doc.y + 1;
    this.doc.moveTo(this.left, y).lineTo(this.left + this.width, y).lineWidth(0.75).strokeColor(colours.rule).stroke();
    this.doc.y = y + 5;
  }

  subheading(text: string) {
    this.room(40);
    this.doc.moveDown(0.3);
    this.font(true, 10.5, colours.ground).doc.text(this.t(text), this.left, this.doc.y, { width: this.width });
    this.doc.moveDown(0.15);
  }

  para(text: string, options: { size?: number; colour?: string; bold?: boolean; indent?: number } = {}) {
    const size = options.size ?? 9.5;
    this.font(Boolean(options.bold), size, options.colour ?? colours.ink);
    const x = this.left + (options.indent ?? 0);
    const w = this.width - (options.indent ?? 0);
    this.room(Math.min(this.doc.heightOfString(this.t(text), { width: w }), 60));
    this.doc.text(this.t(text), x, this.doc.y, { width: w });
  }

  bullets(items: string[], options: { size?: number } = {}) {
    for (const item of items) {
      const size = options.size ?? 9.5;
      this.font(false, size);
      const h = this.doc.heightOfString(this.t(item), { width: this.width - 12 });
      this.room(h + 2);
      const y = this.doc.y;
      this.doc.circle(this.left + 3.5, y + size * 0.55, 1.4).fillColor(colours.ground).fill();
      this.font(false, size).doc.text(this.t(item), this.left + 12, y, { width: this.width - 12 });
      this.doc.y += 1.5;
    }
  }

  /** Label/value pairs in two columns. */
  pairs(rows: [string, string][], columns = 2) {
    const gap = 14;
    const colWidth = (this.width - gap * (columns - 1)) / columns;
    const labelWidth = colWidth * 0.46;
    for (let i = 0; i < rows.length; i += columns) {
      const chunk = rows.slice(i, i + columns);
      this.font(false, 9);
      const h = Math.max(
        ...chunk.map(([label, value]) => Math.max(this.doc.font('regular').heightOfString(this.t(label), { width: labelWidth - 4 }), this.doc.font('bold').heightOfString(this.t(value), { width: colWidth - labelWidth }))),
      );
      this.room(h + 3);
      const y = this.doc.y;
      chunk.forEach(([label, value], c) => {
        const x = this.left + c * (colWidth + gap);
        this.font(false, 9, colours.muted).doc.text(this.t(label), x, y, { width: labelWidth - 4 });
        this.font(true, 9).doc.text(this.t(value), x + labelWidth, y, { width: colWidth - labelWidth });
      });
      this.doc.y = y + h + 3;
    }
  }

  /** A table with a header row repeated on each page; `highlight` shades one row. */
  table(columns: Column[], rows: Cell[][], options: { highlight?: number; size?: number } = {}) {
    const size = options.size ?? 8.5;
    const pad = 3;
    const header = () => {
      this.font(true, size, colours.ground);
      const h = Math.max(...columns.map((c) => this.doc.heightOfString(this.t(c.header), { width: c.width - 2 * pad }))) + 2 * pad;
      const y = this.doc.y;
      this.doc.rect(this.left, y, this.width, h).fillColor(colours.soft).fill();
      let x = this.left;
      for (const c of columns) {
        this.font(true, size, colours.ground).doc.text(this.t(c.header), x + pad, y + pad, { width: c.width - 2 * pad });
        x += c.width;
      }
      this.doc.y = y + h;
    };
    this.room(40);
    header();
    rows.forEach((row, index) => {
      const h = Math.max(...row.map((cell, i) => this.cellHeight(cell, columns[i]!.width - 2 * pad, size))) + 2 * pad;
      if (this.doc.y + h > this.bottom) {
        this.doc.addPage();
        header();
      }
      const y = this.doc.y;
      if (index === options.highlight) this.doc.rect(this.left, y, this.width, h).fillColor(colours.greenSoft).fill();
      let x = this.left;
      row.forEach((cell, i) => {
        this.drawCell(cell, x + pad, y + pad, columns[i]!.width - 2 * pad, size, index === options.highlight);
        x += columns[i]!.width;
      });
      this.doc.moveTo(this.left, y + h).lineTo(this.left + this.width, y + h).lineWidth(0.4).strokeColor(colours.rule).stroke();
      this.doc.y = y + h;
    });
    this.doc.y += 4;
  }

  private cellHeight(cell: Cell, width: number, size: number): number {
    if (typeof cell === 'object' && 'light' in cell) return size + 3;
    const text = typeof cell === 'string' ? cell : cell.text;
    this.font(typeof cell === 'object' && Boolean(cell.bold), size);
    return this.doc.heightOfString(this.t(text), { width });
  }

  private drawCell(cell: Cell, x: number, y: number, width: number, size: number, bold: boolean) {
    if (typeof cell === 'object' && 'light' in cell) {
      this.lightTag(cell.light, x, y, size);
      return;
    }
    const text = typeof cell === 'string' ? cell : cell.text;
    const isBold = bold || (typeof cell === 'object' && Boolean(cell.bold));
    const colour = typeof cell === 'object' && cell.colour ? cell.colour : colours.ink;
    this.font(isBold, size, colour).doc.text(this.t(text), x, y, { width });
  }

  /** The light's icon and word, in its colour: never colour alone. */
  lightTag(light: Light, x: number, y: number, size = 9) {
    lightIcon(this.doc, light, x, y - 0.5, size + 2);
    this.font(true, size, lightColour[light]).doc.text(lightWords[light], x + size + 5, y, { lineBreak: false });
  }

  /** A shaded box with a bold title and lines of text, kept on one page. */
  box(title: string, lines: string[], tone: Light | 'note' = 'note') {
    const pad = 7;
    const inner = this.width - 2 * pad;
    this.font(true, 10);
    let h = this.doc.heightOfString(this.t(title), { width: inner - 16 }) + 4;
    this.font(false, 9);
    for (const line of lines) h += this.doc.heightOfString(this.t(line), { width: inner - 10 }) + 2;
    h += 2 * pad;
    this.room(h);
    const y = this.doc.y;
    const fill = tone === 'note' ? colours.soft : lightSoft[tone];
    const edge = tone === 'note' ? colours.rule : lightColour[tone];
    this.doc.roundedRect(this.left, y, this.width, h, 4).fillColor(fill).fill();
    this.doc.roundedRect(this.left, y, this.width, h, 4).lineWidth(0.8).strokeColor(edge).stroke();
    if (tone !== 'note') lightIcon(this.doc, tone, this.left + pad, y + pad, 11);
    this.font(true, 10, tone === 'note' ? colours.ground : lightColour[tone]).doc.text(this.t(title), this.left + pad + (tone === 'note' ? 0 : 16), y + pad, { width: inner - 16 });
    this.doc.y += 2;
    for (const line of lines) {
      const ly = this.doc.y;
      this.doc.circle(this.left + pad + 3, ly + 5, 1.3).fillColor(colours.ink).fill();
      this.font(false, 9).doc.text(this.t(line), this.left + pad + 10, ly, { width: inner - 10 });
      this.doc.y += 2;
    }
    this.doc.y = y + h + 6;
  }
}

/** The icons of src/components/icons.tsx, drawn from the same 24-unit paths. */
function lightIcon(doc: Doc, light: Light, x: number, y: number, size: number) {
  const paths: Record<Light, string[]> = {
    green: ['M 21.5 12 A 9.5 9.5 0 1 1 2.5 12 A 9.5 9.5 0 1 1 21.5 12 Z', 'm7.5 12.5 3 3 6-6.5'],
    amber: ['M10.3 3.9 2.4 18a2 2 0 0 0 1.7 3h15.8a2 2 0 0 0 1.7-3L13.7 3.9a2 2 0 0 0-3.4 0Z', 'M12 9v4.5', 'M12 17.2h.01'],
    red: ['M8.2 2.5h7.6l5.7 5.7v7.6l-5.7 5.7H8.2l-5.7-5.7V8.2Z', 'M8 12h8'],
  };
  doc.save();
  doc.translate(x, y).scale(size / 24);
  doc.lineWidth(2.2).lineCap('round').lineJoin('round').strokeColor(lightColour[light]);
  for (const p of paths[light]) doc.path(p).stroke();
  doc.restore();
}

/** The plan sketch, drawn with vectors at `width` points wide. */
function drawSketch(doc: Doc, sketch: PlanSketch, x: number, y: number, width: number, t: (s: string) => string) {
  const s = width / sketch.width;
  const height = sketch.height * s;
  const px = (mx: number) => x + (mx - sketch.minX) * s;
  const py = (my: number) => y + (my - sketch.minY) * s;
  doc.save();
  doc.rect(x, y, width, height).clip();
  for (const shape of sketch.shapes) drawShape(doc, shape, px, py, s, t);
  doc.restore();
  doc.rect(x, y, width, height).lineWidth(0.5).strokeColor(colours.rule).stroke();
  return height;
}

function drawShape(doc: Doc, shape: SketchShape, px: (m: number) => number, py: (m: number) => number, s: number, t: (text: string) => string) {
  const stroked = (width: number | undefined, dash?: [number, number]) => {
    doc.lineWidth((width ?? 0.03) * s);
    if (dash) doc.dash(dash[0] * s, { space: dash[1] * s });
  };
  switch (shape.kind) {
    case 'rect': {
      const draw = () => (shape.rx ? doc.roundedRect(px(shape.x), py(shape.y), shape.w * s, shape.h * s, shape.rx * s) : doc.rect(px(shape.x), py(shape.y), shape.w * s, shape.h * s));
      if (shape.fill) draw().fillColor(shape.fill).fill();
      if (shape.stroke) {
        stroked(shape.strokeWidth, shape.dash);
        draw().strokeColor(shape.stroke).stroke();
        doc.undash();
      }
      return;
    }
    case 'line':
      stroked(shape.strokeWidth);
      doc.moveTo(px(shape.x1), py(shape.y1)).lineTo(px(shape.x2), py(shape.y2)).strokeColor(shape.stroke).stroke();
      return;
    case 'polyline': {
      const [first, ...rest] = shape.points;
      if (!first) return;
      stroked(shape.strokeWidth, shape.dash);
      doc.lineCap('round').lineJoin('round');
      doc.moveTo(px(first.x), py(first.y));
      for (const p of rest) doc.lineTo(px(p.x), py(p.y));
      doc.strokeColor(shape.stroke).stroke();
      doc.undash().lineCap('butt');
      return;
    }
    case 'circle':
      doc.circle(px(shape.cx), py(shape.cy), shape.r * s).fillColor(shape.fill).fill();
      if (shape.stroke) {
        stroked(shape.strokeWidth);
        doc.circle(px(shape.cx), py(shape.cy), shape.r * s).strokeColor(shape.stroke).stroke();
      }
      return;
    case 'text': {
      const size = shape.size * s;
      const text = t(shape.text);
      doc.font(shape.bold ? 'bold' : 'regular').fontSize(size).fillColor(shape.fill);
      const w = doc.widthOfString(text);
      const left = shape.anchor === 'middle' ? px(shape.x) - w / 2 : shape.anchor === 'end' ? px(shape.x) - w : px(shape.x);
      doc.text(text, left, py(shape.y), { lineBreak: false, baseline: 'alphabetic' });
    }
  }
}

// ---- the sections -----------------------------------------------------------------------------

function titleBlock(w: PackWriter, pack: Pack) {
  const { doc } = w;
  w.font(true, 9, colours.clay).doc.text('GROUNDWORK · SURVEY PACK', w.left, doc.y, { characterSpacing: 0.6 });
  w.font(true, 20, colours.ground).doc.text(w.t(`${pack.address.lines[0] ?? 'Address not given'}`), w.left, doc.y + 2, { width: w.width });
  w.font(false, 11, colours.ink).doc.text(w.t([...pack.address.lines.slice(1), pack.address.postcode].filter(Boolean).join(', ')), { width: w.width });
  doc.moveDown(0.5);
  const y = doc.y;
  w.lightTag(pack.readiness.light, w.left, y, 10.5);
  w.font(false, 10, colours.muted).doc.text(
    w.t(gapWords.staffOpen(pack.readiness.gapCount, pack.readiness.checks.length)),
    w.left + 140,
    y,
    { lineBreak: false },
  );
  doc.y = y + 18;
  w.pairs([
    ['Case', pack.reference],
    ['Stage', pack.stageLabel],
    ['Survey date', formatDay(pack.surveyDate)],
    ['Surveyor', pack.surveyorName ?? 'Not assigned'],
    ['Customer', pack.customer.name ?? 'Not given'],
    ['Phone', pack.customer.phone ?? 'Not given'],
    ['E-mail', pack.customer.email || 'Not given'],
    ['Postcode', pack.address.postcode ?? 'Not given'],
    ['MPAN core', pack.mpan.core ? `${pack.mpan.core}${pack.mpan.valid ? '' : ' (fails check digit)'}` : 'Not given'],
    ['Distribution region', pack.mpan.region ?? 'Not known'],
  ]);
  w.para(`Pack made ${formatMoment(pack.generatedAt)}. Figures are computed from the customer's answers before the visit; confirm on site.`, { size: 8, colour: colours.muted });
}

function cautionsBlock(w: PackWriter, pack: Pack) {
  w.doc.moveDown(0.5);
  w.box('Cautions', pack.cautions.map((c) => `${c.text} (${c.source})`), 'amber');
}

function readinessBlock(w: PackWriter, pack: Pack) {
  w.heading('Readiness summary');
  w.table(
    [
      { header: 'Light', width: 92 },
      { header: 'Check', width: 96 },
      { header: 'Reading (trade terms)', width: w.width - 92 - 96 - 120 },
      { header: 'Source', width: 120 },
    ],
    pack.readiness.checks.map((c) => [
      { light: c.light },
      { text: c.confirmedOnSite ? `${c.title} (confirmed on site)` : c.title, bold: true },
      c.staffText,
      { text: c.source, colour: colours.muted },
    ]),
    { size: 8 },
  );
}

function gapsBlock(w: PackWriter, pack: Pack) {
  w.heading('Open gaps');
  if (pack.gaps.customer.length === 0 && pack.gaps.checks.length === 0) {
    w.para('None: every answer is in and every check is clear.');
    return;
  }
  if (pack.gaps.customer.length) {
    w.subheading('Still to come from the customer');
    w.bullets(pack.gaps.customer.map((g) => g.text));
  }
  if (pack.gaps.checks.length) {
    w.subheading('Checks not yet clear');
    w.table(
      [
        { header: 'Light', width: 92 },
        { header: 'Check', width: 110 },
        { header: 'What would clear it', width: w.width - 202 },
      ],
      pack.gaps.checks.map((c) => [{ light: c.light }, { text: c.title, bold: true }, c.actions.length ? c.actions.join(' ') : c.staffText]),
    );
  }
}

function demandBlock(w: PackWriter, pack: Pack) {
  const d = pack.figures.demand;
  if (!d) return;
  w.subheading(`Maximum demand${d.confirmedOnSite ? ' (cut-out confirmed on site)' : ''}`);
  w.table(
    [
      { header: 'Load', width: 120 },
      { header: 'Declared', width: 110 },
      { header: 'Allowance', width: 60 },
      { header: 'Rule', width: w.width - 290 },
    ],
    [
      ...d.items.map((i) => [i.load, i.declared, `${fmt(i.allowanceAmps)} A`, { text: i.rule, colour: colours.muted }] as Cell[]),
      [{ text: `Assessed maximum demand${d.supplyPhases === 3 ? ' (busiest phase)' : ''}`, bold: true }, '', { text: `${fmt(d.assessedDemandAmps)} A`, bold: true }, d.basis === 'measured' ? 'Existing as measured + charger at full load' : 'Existing after diversity + charger at full load'],
    ],
  );
  const rows: [string, string][] = [
    ['Main fuse (cut-out)', d.fuseAmps === null ? 'Not known' : `${d.fuseAmps} A`],
    ['Headroom', headroomWords(d)],
    ['Basis', demandBasisWords(d)],
    ...(d.phaseDemandAmps ? [['Per phase', d.phaseDemandAmps.map((a, i) => `L${i + 1} ${fmt(a)} A`).join(', ')] as [string, string]] : []),
  ];
  w.pairs(rows);
  if (d.assumptions.length) w.bullets(d.assumptions, { size: 8 });
}

function networkBlock(w: PackWriter, pack: Pack) {
  const n = pack.figures.network;
  if (!n) return;
  w.subheading('Network operator');
  w.pairs([
    ['Route', networkRouteWord(n.route, true)],
    ['Settled', n.settled ? 'Yes' : 'Not yet: answers missing'],
    ['Demand against limit', `${fmt(n.assessedDemandAmps)} A of ${fmt(n.demandLimitAmps)} A`],
    ['Lead time allowed', n.route === 'apply-before' ? countOf(n.leadTimeDays, 'day') : `Notify within ${countOf(n.notifyWithinDays, 'day')}`],
  ]);
  if (n.reasons.length) w.bullets(n.reasons.map((r) => `${r.text}${r.certain === false ? ' (possible: an answer is missing)' : ''}`), { size: 9 });
}

function earthingBlock(w: PackWriter, pack: Pack) {
  const e = pack.figures.earthing;
  if (!e) return;
  w.subheading(`Earthing${e.confirmedOnSite ? ' (confirmed on site)' : ''}`);
  const words: Record<string, string> = { pme: 'PME (TN-C-S)', tns: 'TN-S', tt: 'TT', unknown: 'Not known: treated as PME' };
  w.pairs([
    ['Arrangement', words[e.earthing] ?? e.earthing],
    ['722.411.4.1 measure', e.measureLabel ?? (e.measureNeeded ? 'Not recorded yet: amber until it is' : 'Not needed')],
    ...(e.electrodeTest ? [['Electrode', electrodeTestWords(e.electrodeTest)] as [string, string]] : []),
  ]);
}

function cableRunBlock(w: PackWriter, pack: Pack) {
  const c = pack.figures.cableRun;
  if (!c) return;
  w.subheading('Cable size: capacity and voltage drop');
  w.para(`${cableBasisWords(c)}.${c.routeAssumption ? ` ${c.routeAssumption}.` : ''}`, { size: 9 });
  if (c.factors.length) w.para(`Factors: ${c.factors.map((x) => `${x.name} ${fmt(x.value)} (${x.basis})`).join('; ')}.`, { size: 8 });
  if (c.lengthMetres === null || c.sizes.length === 0) {
    w.para('Cable run length not given: voltage drop not computed.');
    return;
  }
  w.para(
    `${fmt(c.currentAmps)} A over ${fmt(c.lengthMetres)} m. ${c.table}. Recommended: ${c.recommendedCsaMm2 === null ? 'no size passes' : `${c.recommendedCsaMm2} mm²`}.`,
    { size: 9 },
  );
  const highlight = c.sizes.findIndex((s) => s.csaMm2 === c.recommendedCsaMm2);
  w.table(
    [
      { header: 'Size', width: 60 },
      { header: 'mV/A/m', width: 50 },
      { header: 'Drop', width: 60 },
      { header: 'Drop %', width: 50 },
      { header: 'It', width: 45 },
      { header: 'Iz', width: 50 },
      { header: 'Result', width: w.width - 315 },
    ],
    c.sizes.map((s, i) => [
      `${s.csaMm2} mm²`,
      fmt(s.mvPerAPerM),
      `${fmt(s.volts)} V`,
      `${fmt(s.percent)}%`,
      `${s.tabulatedAmps} A`,
      `${fmt(s.capacityAmps)} A`,
      { text: i === highlight ? 'Passes: recommended' : s.passes ? 'Passes' : s.passesCapacity === false ? 'Iz below In' : 'Drop too high', colour: s.passes ? colours.green : colours.red, bold: i === highlight },
    ]),
    { highlight: highlight >= 0 ? highlight : undefined },
  );
}

function reachBlock(w: PackWriter, pack: Pack) {
  const r = pack.figures.reach;
  if (!r) return;
  w.subheading('Cable reach');
  w.pairs([
    ['Cable', `${fmt(r.cableMetres)} m (${cableSourceWords[r.cableSource] ?? r.cableSource})`],
    ['Charge port', portWord(r.port)],
  ]);
  if (r.verdicts.length) {
    w.table(
      [
        { header: 'Bay', width: 60 },
        { header: 'Parked', width: 80 },
        { header: 'On plan', width: 70 },
        { header: 'Cable needed', width: 80 },
        { header: 'Verdict', width: w.width - 290 },
      ],
      r.verdicts.map((v) => [
        `Bay ${v.bayIndex + 1}`,
        wayWord(v.way),
        `${fmt(v.planMetres)} m`,
        `${fmt(v.requiredMetres)} m`,
        { text: v.reaches ? 'Reaches' : `Short by ${fmt(v.shortByMetres)} m`, bold: true, colour: v.reaches ? colours.green : colours.amber },
      ]),
    );
  } else if (r.problem) {
    w.para(r.problem, { size: 9 });
  }
  if (r.sketches.length) {
    const gap = 12;
    const each = r.sketches.length > 1 ? (w.width - gap) / 2 : Math.min(w.width * 0.62, 320);
    const heights = r.sketches.map((s) => (s.height / s.width) * each);
    w.room(Math.max(...heights) + 24);
    const y = w.doc.y;
    r.sketches.forEach((sketch, i) => {
      const x = w.left + i * (each + gap);
      drawSketch(w.doc, sketch, x, y, each, w.t);
      w.font(false, 8, colours.muted).doc.text(w.t(sketch.caption), x, y + heights[i]! + 3, { width: each });
    });
    w.doc.y = y + Math.max(...heights) + 18;
    w.para('Solid line: the cable reaches; dashed: it falls short. Drawn from the customer’s plan, to scale (see the scale bar).', { size: 8, colour: colours.muted });
  }
}

function answersBlock(w: PackWriter, pack: Pack) {
  w.heading('Every answer');
  for (const section of pack.sections) {
    w.subheading(section.title);
    w.pairs(section.answers.map((a) => [a.label, a.confirmed ? `${a.value ?? 'Not answered'} · confirmed on site: ${a.confirmed}` : (a.value ?? 'Not answered')]));
  }
}

function photosBlock(w: PackWriter, pack: Pack, jpegs: Map<string, Buffer>) {
  w.heading('Photos');
  if (pack.photos.length === 0) {
    w.para('No photos yet.');
    return;
  }
  const gap = 12;
  const each = (w.width - gap) / 2;
  const maxHeight = 210;
  for (let i = 0; i < pack.photos.length; i += 2) {
    const pair = pack.photos.slice(i, i + 2);
    const heights = pair.map((p) => Math.min(maxHeight, p.width && p.height ? (p.height / p.width) * each : maxHeight));
    const rowHeight = Math.max(...heights) + 30;
    w.room(rowHeight);
    const y = w.doc.y;
    pair.forEach((photo, c) => {
      const x = w.left + c * (each + gap);
      const jpeg = jpegs.get(photo.id);
      if (jpeg) w.doc.image(jpeg, x, y, { fit: [each, maxHeight] });
      else w.font(false, 9, colours.red).doc.text('The file could not be read.', x, y, { width: each });
      w.font(true, 9).doc.text(w.t(`${photo.kindTitle}${photo.originalName ? ` · ${photo.originalName}` : ''}`), x, y + heights[c]! + 3, { width: each });
      w.font(false, 8, colours.muted).doc.text(w.t(`${uploadStateWords[photo.status]}${photo.reason ? `: ${photo.reason}` : ''} · ${formatMoment(photo.createdAt)}`), x, w.doc.y, { width: each });
    });
    w.doc.y = y + rowHeight;
  }
}

function documentsBlock(w: PackWriter, pack: Pack) {
  w.heading('Documents and their review');
  w.table(
    [
      { header: 'Required', width: 150 },
      { header: 'Review', width: 110 },
      { header: 'Files', width: w.width - 260 },
    ],
    [
      ...pack.documents.map((d) => [
        { text: d.title, bold: true },
        { text: `${uploadStateWords[d.state]}${d.reason ? `: ${d.reason}` : ''}`, colour: d.state === 'accepted' ? colours.green : d.state === 'rejected' ? colours.red : colours.amber, bold: true },
        d.files.length ? d.files.map((f) => `${f.originalName ?? f.mimeType} (${uploadStateWords[f.status]}, ${formatMoment(f.createdAt)})`).join('; ') : 'None sent',
      ] as Cell[]),
      ...pack.otherFiles.map((f) => [f.kindTitle, uploadStateWords[f.status], `${f.originalName ?? f.mimeType} (${formatMoment(f.createdAt)})${f.uploadedByRole === 'surveyor' ? ', from site' : ''}`] as Cell[]),
    ],
  );
}

function notesBlock(w: PackWriter, pack: Pack) {
  w.heading('Office notes');
  if (pack.notes.length === 0) {
    w.para('No notes.');
    return;
  }
  for (const note of pack.notes) {
    w.para(`${note.authorName ?? 'Office'} · ${formatMoment(note.createdAt)}`, { size: 8, colour: colours.muted, bold: true });
    w.para(note.body, { size: 9.5 });
    w.doc.moveDown(0.3);
  }
}

function outcomeBlock(w: PackWriter, pack: Pack) {
  const o = pack.outcome;
  if (!o) return;
  w.heading('Survey outcome');
  const measured = measurementIds
    .filter((id) => typeof o.measurements[id] === 'number')
    .map((id) => [measurementFields[id].label, `${o.measurements[id]} ${measurementFields[id].unit}`] as [string, string]);
  w.pairs([
    ['Outcome', o.outcomeLabel],
    ['Recorded', `${formatMoment(o.recordedAt)}${o.surveyorName ? ` by ${o.surveyorName}` : ''}`],
    ['Earthing, confirmed', o.confirmedEarthing ?? 'Not confirmed'],
    ['Main fuse, confirmed', o.confirmedFuseAmps ? `${o.confirmedFuseAmps} A` : 'Not confirmed'],
    ...measured,
  ]);
  if (o.notes) w.para(o.notes);
}

/** Header and footer on every page, once the page count is known. */
function stampPages(doc: Doc, pack: Pack, t: (s: string) => string) {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i += 1) {
    doc.switchToPage(i);
    const { width, height } = doc.page;
    const bottomMargin = doc.page.margins.bottom;
    const topMargin = doc.page.margins.top;
    // Writing inside the margins would otherwise start a new page.
    doc.page.margins.bottom = 0;
    doc.page.margins.top = 0;
    doc.font('regular').fontSize(8).fillColor(colours.muted);
    if (i > range.start) {
      doc.text(t(`Survey pack ${pack.reference} · ${[pack.address.lines[0], pack.address.postcode].filter(Boolean).join(', ')}`), MARGIN, MARGIN - 20, { width: width - 2 * MARGIN, lineBreak: false });
    }
    doc.moveTo(MARGIN, height - MARGIN + 4).lineTo(width - MARGIN, height - MARGIN + 4).lineWidth(0.5).strokeColor(colours.rule).stroke();
    doc.font('regular').fontSize(8).fillColor(colours.muted);
    doc.text(t(`${pack.reference} · page ${i - range.start + 1} of ${range.count}`), MARGIN, height - MARGIN + 9, { width: width - 2 * MARGIN, align: 'right', lineBreak: false });
    doc.text('Groundwork: preparation aid, not a design. Photos only; never open the cut-out.', MARGIN, height - MARGIN + 9, { width: width - 2 * MARGIN - 120, lineBreak: false });
    doc.page.margins.bottom = bottomMargin;
    doc.page.margins.top = topMargin;
  }
}

/**
 * The pack as PDF bytes.
 *
 * @example const bytes = await packPdf(await gatherPack(row)); bytes.subarray(0, 5).toString() // '%PDF-'
 */
export async function packPdf(pack: Pack): Promise<Buffer> {
  // The photos are resized on sharp's threads while the text is laid out here.
  const jpegsReady = photoJpegs(pack.photos);
  const font = await fonts();
  const doc = new PDFDocument({
    size: 'A4',
    margin: MARGIN,
    bufferPages: true,
    info: { Title: `Survey pack ${pack.reference}`, Author: 'Groundwork', Subject: [pack.address.lines[0], pack.address.postcode].filter(Boolean).join(', ') },
    lang: 'en-GB',
  });
  doc.registerFont('regular', font.regular);
  doc.registerFont('bold', font.bold);
  doc.font('regular');
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const finished = new Promise<void>((resolve, reject) => {
    doc.on('end', () => resolve());
    doc.on('error', reject);
  });
  const t = (text: string) => safeText(text, font.covers);
  const w = new PackWriter(doc, t);
  titleBlock(w, pack);
  cautionsBlock(w, pack);
  readinessBlock(w, pack);
  gapsBlock(w, pack);
  w.heading('Computed figures');
  demandBlock(w, pack);
  networkBlock(w, pack);
  earthingBlock(w, pack);
  cableRunBlock(w, pack);
  reachBlock(w, pack);
  outcomeBlock(w, pack);
  answersBlock(w, pack);
  photosBlock(w, pack, await jpegsReady);
  documentsBlock(w, pack);
  notesBlock(w, pack);
  stampPages(doc, pack, t);
  doc.end();
  await finished;
  return Buffer.concat(chunks);
}

/**
 * The download's file name: only letters, digits and hyphens from the reference.
 * @example packFileName('GW-7K2Q') // 'groundwork-pack-GW-7K2Q.pdf'
 */
export function packFileName(reference: string): string {
  return `groundwork-pack-${reference.replace(/[^A-Za-z0-9-]/g, '')}.pdf`;
}
