// A static sketch of the customer's driveway plan for the survey pack: the same geometry as the
// customer's drawing (src/components/plan, geometry in src/lib/plan), laid out as plain shapes so the pack page can show
// it as SVG and the PDF can draw it with vectors. Pure: no DOM, no React.
import { carFootprint, type DrivewayPlan, type Point, type ReachVerdict } from '@/lib/readiness/plan';
import type { ParkingWay } from '@/lib/readiness/types';
import { wayLabels } from '@/lib/vocabulary/plan';
import { carShape, frameFor, HOUSE_DEPTH, rectToScreen, scaleBarMetres, toScreen } from './drawing-geometry';
import { bayName, bayRect, planToView, type ViewRect } from './plan-view';

/** The palette of tailwind.config.mjs, spelled out: the PDF and an SVG image have no classes. */
export const sketchColours = {
  drive: '#f2f7f6',
  grid: '#b9d6d0',
  house: '#f5e6d6',
  houseLine: '#ebcaa9',
  houseText: '#864324',
  wall: '#1c302e',
  bay: '#ffffff',
  garage: '#dcebe8',
  bayLine: '#5f988f',
  carBody: '#8dbab2',
  carLine: '#2b504c',
  carGlass: '#2b504c',
  carRear: '#34635d',
  wheel: '#1c302e',
  reaches: '#1f7a4d',
  short: '#9a6100',
  port: '#1d2524',
  chargePoint: '#c26d33',
  chargePointLine: '#6c3823',
  text: '#1c302e',
  muted: '#2b504c',
  white: '#ffffff',
} as const;

export type SketchShape =
  | { kind: 'rect'; x: number; y: number; w: number; h: number; rx?: number; fill?: string; stroke?: string; strokeWidth?: number; dash?: [number, number] }
  | { kind: 'line'; x1: number; y1: number; x2: number; y2: number; stroke: string; strokeWidth: number }
  | { kind: 'polyline'; points: Point[]; stroke: string; strokeWidth: number; dash?: [number, number] }
  | { kind: 'circle'; cx: number; cy: number; r: number; fill: string; stroke?: string; strokeWidth?: number }
  | { kind: 'text'; x: number; y: number; text: string; size: number; fill: string; anchor: 'start' | 'middle' | 'end'; bold?: boolean };

/** A drawing in metres on the street-view plan (house along the top). */
export interface PlanSketch {
  way: ParkingWay;
  minX: number;
  minY: number;
  width: number;
  height: number;
  shapes: SketchShape[];
  /** One line saying what the drawing shows, for a caption and the SVG's title. */
  caption: string;
}


/**
 * The sketch for one way of parking: the wall, the bays, the car in each bay the electric car
 * uses, and the cable from the charge point to the port, solid where it reaches and dashed where
 * it falls short.
 *
 * @example planSketch(plan, verdicts, 'nose-in').shapes.some((s) => s.kind === 'polyline') // true when the port is known
 */
export function planSketch(plan: DrivewayPlan, verdicts: readonly ReachVerdict[], way: ParkingWay): PlanSketch {
  const view = planToView(plan);
  const forWay = verdicts.filter((v) => v.way === way);
  const carBays = [...new Set(forWay.map((v) => v.bayIndex))].filter((i) => plan.bays[i]);
  const extra: ViewRect[] = [
    ...carBays.map((i) => rectToScreen(plan, carFootprint(plan, plan.bays[i]!))),
    ...forWay.map((v) => toScreen(plan, v.port)).map((p) => ({ left: p.x, top: p.y, width: 0, height: 0 })),
  ];
  const frame = frameFor(view, extra);
  const t = Math.max(0.26, frame.width / 24);
  const maxY = frame.minY + frame.height;
  const shapes: SketchShape[] = [
    ...groundShapes(frame.minX, frame.width, maxY),
    ...houseShapes(view.wallLength, t),
    ...view.bays.map((bay) => bayShape(bayRect(bay), bay.kind === 'garage')),
    ...carBays.flatMap((index) => carShapes(plan, index, way)),
    ...view.bays.flatMap((bay, index) => bayTag(bayRect(bay), bayName(view, index), t)),
    ...forWay.flatMap((v) => cableShapes(plan, v)),
    ...chargePointShapes(view.chargePoint.along, view.chargePoint.out, t),
    ...scaleBarShapes(frame.minX + 0.4, maxY - 0.55, scaleBarMetres(frame.width), t),
    { kind: 'text', x: frame.minX + frame.width - 0.3, y: maxY - 0.4, text: 'Street side', size: t * 0.9, fill: sketchColours.muted, anchor: 'end' },
  ];
  const reach = forWay.length === 0 ? 'charge port not known' : forWay.every((v) => v.reaches) ? 'the cable reaches' : 'the cable falls short';
  return { way, ...frame, shapes, caption: `Driveway plan, car ${wayLabels[way].toLowerCase()}: ${reach}.` };
}

function groundShapes(minX: number, width: number, maxY: number): SketchShape[] {
  const shapes: SketchShape[] = [{ kind: 'rect', x: minX, y: 0, w: width, h: maxY, fill: sketchColours.drive }];
  for (let x = Math.ceil(minX); x <= Math.floor(minX + width); x += 1) {
    shapes.push({ kind: 'line', x1: x, y1: 0, x2: x, y2: maxY, stroke: sketchColours.grid, strokeWidth: x === 0 ? 0.03 : 0.015 });
  }
  for (let y = 1; y <= Math.floor(maxY); y += 1) {
    shapes.push({ kind: 'line', x1: minX, y1: y, x2: minX + width, y2: y, stroke: sketchColours.grid, strokeWidth: 0.015 });
  }
  return shapes;
}

function houseShapes(wallLength: number, t: number): SketchShape[] {
  return [
    { kind: 'rect', x: 0, y: -HOUSE_DEPTH, w: wallLength, h: HOUSE_DEPTH, fill: sketchColours.house, stroke: sketchColours.houseLine, strokeWidth: 0.03 },
    { kind: 'line', x1: 0, y1: 0, x2: wallLength, y2: 0, stroke: sketchColours.wall, strokeWidth: 0.12 },
    { kind: 'text', x: 0.15, y: -HOUSE_DEPTH + t * 1.15, text: 'House', size: t, fill: sketchColours.houseText, anchor: 'start', bold: true },
  ];
}

function bayShape(rect: ViewRect, garage: boolean): SketchShape {
  return {
    kind: 'rect',
    x: rect.left,
    y: rect.top,
    w: rect.width,
    h: rect.height,
    fill: garage ? sketchColours.garage : sketchColours.bay,
    stroke: sketchColours.bayLine,
    strokeWidth: garage ? 0.1 : 0.04,
    dash: garage ? undefined : [0.25, 0.15],
  };
}

// The name sits on a white tag near the bay's street end, drawn over any car.
function bayTag(rect: ViewRect, name: string, t: number): SketchShape[] {
  const width = t * (name.length * 0.55 + 0.8);
  const x = rect.left + rect.width / 2;
  const y = rect.top + rect.height - t * 1.1;
  return [
    { kind: 'rect', x: x - width / 2, y: y - t * 0.75, w: width, h: t * 1.5, rx: t * 0.3, fill: sketchColours.white, stroke: sketchColours.carLine, strokeWidth: 0.03 },
    { kind: 'text', x, y: y + t * 0.33, text: name, size: t, fill: sketchColours.text, anchor: 'middle', bold: true },
  ];
}

function carShapes(plan: DrivewayPlan, index: number, way: ParkingWay): SketchShape[] {
  const { body, windscreen, rearWindow, wheels } = carShape(plan, plan.bays[index]!, way);
  const box = (r: ViewRect, fill: string, rx: number): SketchShape => ({ kind: 'rect', x: r.left, y: r.top, w: r.width, h: r.height, rx, fill });
  return [
    ...wheels.map((w) => box(w, sketchColours.wheel, 0.05)),
    { kind: 'rect', x: body.left, y: body.top, w: body.width, h: body.height, rx: 0.4, fill: sketchColours.carBody, stroke: sketchColours.carLine, strokeWidth: 0.05 },
    box(windscreen, sketchColours.carGlass, 0.12),
    box(rearWindow, sketchColours.carRear, 0.08),
  ];
}

function cableShapes(plan: DrivewayPlan, verdict: ReachVerdict): SketchShape[] {
  const points = verdict.path.map((p) => toScreen(plan, p));
  const port = toScreen(plan, verdict.port);
  const colour = verdict.reaches ? sketchColours.reaches : sketchColours.short;
  return [
    { kind: 'polyline', points, stroke: sketchColours.white, strokeWidth: 0.16 },
    { kind: 'polyline', points, stroke: colour, strokeWidth: 0.08, dash: verdict.reaches ? undefined : [0.22, 0.14] },
    { kind: 'circle', cx: port.x, cy: port.y, r: 0.17, fill: sketchColours.port, stroke: sketchColours.white, strokeWidth: 0.06 },
  ];
}

function chargePointShapes(along: number, out: number, t: number): SketchShape[] {
  return [
    { kind: 'rect', x: along - 0.22, y: out - 0.14, w: 0.44, h: 0.34, rx: 0.06, fill: sketchColours.chargePoint, stroke: sketchColours.chargePointLine, strokeWidth: 0.04 },
    { kind: 'text', x: along, y: -0.3, text: 'Charge point', size: t * 0.85, fill: sketchColours.chargePointLine, anchor: 'middle', bold: true },
  ];
}

function scaleBarShapes(x: number, y: number, metres: number, t: number): SketchShape[] {
  const shapes: SketchShape[] = [];
  for (let i = 0; i < metres; i += 1) shapes.push({ kind: 'rect', x: x + i, y, w: 1, h: 0.14, fill: i % 2 === 0 ? sketchColours.wall : sketchColours.white });
  shapes.push({ kind: 'rect', x, y, w: metres, h: 0.14, stroke: sketchColours.wall, strokeWidth: 0.025 });
  shapes.push({ kind: 'text', x, y: y - 0.1, text: '0', size: t * 0.8, fill: sketchColours.text, anchor: 'middle' });
  shapes.push({ kind: 'text', x: x + metres, y: y - 0.1, text: `${metres} m`, size: t * 0.8, fill: sketchColours.text, anchor: 'middle' });
  return shapes;
}

const r3 = (value: number) => Math.round(value * 1000) / 1000;
const escapeXml = (text: string) => text.replace(/[&<>"]/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;' })[c]!);

/**
 * The sketch as an SVG document string (inline colours, no classes), for the pack page.
 *
 * @example sketchToSvg(planSketch(plan, verdicts, 'nose-in')).startsWith('<svg') // true
 */
export function sketchToSvg(sketch: PlanSketch): string {
  const body = sketch.shapes.map(shapeToSvg).join('');
  const viewBox = `${r3(sketch.minX)} ${r3(sketch.minY)} ${r3(sketch.width)} ${r3(sketch.height)}`;
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="${viewBox}" role="img" aria-label="${escapeXml(sketch.caption)}" font-family="'Source Sans 3', sans-serif" style="display:block;width:100%;height:auto"><title>${escapeXml(sketch.caption)}</title>${body}</svg>`;
}

function shapeToSvg(shape: SketchShape): string {
  switch (shape.kind) {
    case 'rect':
      return `<rect x="${r3(shape.x)}" y="${r3(shape.y)}" width="${r3(shape.w)}" height="${r3(shape.h)}"${shape.rx ? ` rx="${shape.rx}"` : ''} fill="${shape.fill ?? 'none'}"${stroke(shape.stroke, shape.strokeWidth, shape.dash)}/>`;
    case 'line':
      return `<line x1="${r3(shape.x1)}" y1="${r3(shape.y1)}" x2="${r3(shape.x2)}" y2="${r3(shape.y2)}"${stroke(shape.stroke, shape.strokeWidth)} stroke-linecap="square"/>`;
    case 'polyline':
      return `<polyline points="${shape.points.map((p) => `${r3(p.x)},${r3(p.y)}`).join(' ')}" fill="none"${stroke(shape.stroke, shape.strokeWidth, shape.dash)} stroke-linejoin="round" stroke-linecap="round"/>`;
    case 'circle':
      return `<circle cx="${r3(shape.cx)}" cy="${r3(shape.cy)}" r="${shape.r}" fill="${shape.fill}"${stroke(shape.stroke, shape.strokeWidth)}/>`;
    case 'text':
      return `<text x="${r3(shape.x)}" y="${r3(shape.y)}" font-size="${r3(shape.size)}" fill="${shape.fill}" text-anchor="${shape.anchor}"${shape.bold ? ' font-weight="700"' : ''}>${escapeXml(shape.text)}</text>`;
  }
}

function stroke(colour: string | undefined, width: number | undefined, dash?: [number, number]): string {
  if (!colour) return '';
  return ` stroke="${colour}" stroke-width="${width ?? 0.03}"${dash ? ` stroke-dasharray="${dash.join(' ')}"` : ''}`;
}
