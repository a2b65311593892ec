// The driveway plan as the customer sees it: from the street, looking at the house, with the
// wall along the top. The saved plan (src/lib/readiness/plan.ts) is measured from the wall
// looking out, so its x runs the other way: screen-left is the plan's larger x. Keeping that
// mirror in this one file is what keeps "front left" on the driver's left in the drawing.
import {
  drivewayPlanSchema,
  type CarSizeClass,
  type DrivewayPlan,
  type PlanBay,
  type PlanCar,
} from '@/lib/readiness/plan';
import type { ChargePort } from '@/lib/readiness/types';
import { roundTo } from '@/lib/readiness/units';

/** Garage or open driveway. Not yet in drivewayPlanSchema, which strips it on the server. */
export type BayKind = 'driveway' | 'garage';

/** A bay as the plan stores it, with the kind carried alongside. */
export type StoredBay = PlanBay & { kind?: BayKind | null };

/** A bay in street-view metres: `left` from the wall's left corner, `gap` out from the wall. */
export interface ViewBay {
  left: number;
  gap: number;
  width: number;
  length: number;
  /** True when the car parks along the wall (the plan's 90° bay). */
  along: boolean;
  /** The side the car drives in from, as seen from the street (only for bays along the wall). */
  from: 'left' | 'right';
  forEv: boolean | null;
  kind: BayKind;
}

/** The whole plan in street-view terms. */
export interface PlanView {
  wallLength: number;
  /** Charge point: metres from the wall's left corner, and out from the wall (0 = on it). */
  chargePoint: { along: number; out: number };
  bays: ViewBay[];
  car: PlanCar;
  chargePort: ChargePort | null;
}

/** A rectangle on screen, in metres: `left`/`top` from the wall's left corner. */
export interface ViewRect {
  left: number;
  top: number;
  width: number;
  height: number;
}

/** Limits for every figure the customer can change, in metres (all inside the schema's). */
export const limits = {
  wallLength: { min: 2, max: 30 },
  bayWidth: { min: 1.8, max: 8 },
  bayLength: { min: 3, max: 12 },
  bayGap: { min: 0, max: 15 },
  bayLeftMargin: 10,
  carLength: { min: 2.5, max: 6.5 },
  carWidth: { min: 1.4, max: 2.5 },
} as const;

/** Usual UK bay size (common practice, no published source): 2.4 m × 4.8 m. */
export const defaultBaySize = { width: 2.4, length: 4.8 } as const;

/**
 * A plan to start from: a 6 m wall, one 2.4 × 4.8 m bay 0.5 m out from it, centred, and the
 * charge point in the middle of the wall.
 *
 * @example defaultPlan().chargePoint // { x: 3, y: 0 }
 */
export function defaultPlan(): DrivewayPlan {
  const view: PlanView = {
    wallLength: 6,
    chargePoint: { along: 3, out: 0 },
    bays: [{ left: 1.8, gap: 0.5, ...defaultBaySize, along: false, from: 'right', forEv: null, kind: 'driveway' }],
    car: { sizeClass: 'medium' },
    chargePort: null,
  };
  return viewToPlan(view);
}

/**
 * A saved plan (free-form JSON) if it can be drawn, else null. A plan without bays gets the
 * default bay back, since the editor always shows at least one.
 *
 * @example readSavedPlan({ scribble: true }) // null
 */
export function readSavedPlan(value: unknown): DrivewayPlan | null {
  const parsed = drivewayPlanSchema.safeParse(value);
  if (!parsed.success) return null;
  const plan = parsed.data;
  const kinds = bayKindsOf(value);
  const bays: StoredBay[] = plan.bays.map((bay, i) => ({ ...bay, kind: kinds[i] ?? 'driveway' }));
  return { ...plan, bays: bays.length > 0 ? bays : defaultPlan().bays };
}

// zod strips keys it does not know, so the bay kind is read from the raw JSON.
function bayKindsOf(value: unknown): (BayKind | null)[] {
  const bays = (value as { bays?: unknown })?.bays;
  if (!Array.isArray(bays)) return [];
  return bays.map((bay) => {
    const kind = (bay as { kind?: unknown })?.kind;
    return kind === 'garage' || kind === 'driveway' ? kind : null;
  });
}

/**
 * The plan in street-view terms.
 *
 * @example planToView(defaultPlan()).bays[0].left // 1.8
 */
export function planToView(plan: DrivewayPlan): PlanView {
  const corner = plan.wall.x1;
  return {
    wallLength: roundTo(plan.wall.x1 - plan.wall.x0, 2),
    chargePoint: { along: roundTo(corner - plan.chargePoint.x, 2), out: plan.chargePoint.y },
    bays: plan.bays.map((bay) => bayToView(bay as StoredBay, corner)),
    car: plan.car,
    chargePort: plan.chargePort ?? null,
  };
}

function bayToView(bay: StoredBay, corner: number): ViewBay {
  const along = bay.angle === 90;
  const spanX = along ? bay.length : bay.width;
  return {
    left: roundTo(corner - (bay.x + spanX), 2),
    gap: bay.y,
    width: bay.width,
    length: bay.length,
    along,
    // The plan's 'left' entry is its smaller-x end, which is on the right seen from the street.
    from: bay.entry === 'right' ? 'left' : 'right',
    forEv: bay.forEv ?? null,
    kind: bay.kind === 'garage' ? 'garage' : 'driveway',
  };
}

/**
 * Back to the saved plan, with the wall from x = 0 to its length and figures to the centimetre.
 *
 * @example viewToPlan(planToView(defaultPlan())) // the same plan
 */
export function viewToPlan(view: PlanView): DrivewayPlan {
  const corner = roundTo(view.wallLength, 2);
  const bays: StoredBay[] = view.bays.map((bay) => {
    const spanX = bay.along ? bay.length : bay.width;
    return {
      x: cm(corner - (bay.left + spanX)),
      y: cm(bay.gap),
      width: cm(bay.width),
      length: cm(bay.length),
      angle: bay.along ? 90 : 0,
      entry: bay.along ? (bay.from === 'left' ? 'right' : 'left') : null,
      forEv: bay.forEv,
      kind: bay.kind,
    };
  });
  return {
    wall: { x0: 0, x1: corner },
    chargePoint: { x: cm(corner - view.chargePoint.along), y: cm(view.chargePoint.out) },
    bays,
    car: view.car,
    chargePort: view.chargePort,
  };
}

const cm = (value: number) => roundTo(value, 2) + 0;

/**
 * The bay's outline on screen.
 *
 * @example bayRect({ left: 1, gap: 0.5, width: 2.4, length: 4.8, along: false } as ViewBay) // { left: 1, top: 0.5, width: 2.4, height: 4.8 }
 */
export function bayRect(bay: ViewBay): ViewRect {
  return { left: bay.left, top: bay.gap, width: bay.along ? bay.length : bay.width, height: bay.along ? bay.width : bay.length };
}

/**
 * A value kept within its limits and rounded to the centimetre.
 *
 * @example clampTo(7.123, 0, 6) // 6
 */
export function clampTo(value: number, min: number, max: number): number {
  return cm(Math.min(max, Math.max(min, value)));
}

/**
 * The bay's name on the drawing and in the controls: "Bay" or "Garage", numbered when two.
 *
 * @example bayName(twoBays, 1) // 'Bay 2'
 */
export function bayName(view: PlanView, index: number): string {
  const kind = view.bays[index]?.kind === 'garage' ? 'Garage' : 'Bay';
  return view.bays.length > 1 ? `${kind} ${index + 1}` : kind;
}

/** Where a bay's left edge may go: up to 10 m either side of the wall. */
export function bayLeftRange(view: PlanView, bay: ViewBay): { min: number; max: number } {
  const span = bayRect(bay).width;
  return { min: -limits.bayLeftMargin, max: cm(view.wallLength + limits.bayLeftMargin - span) };
}

/**
 * Moves the charge point along the wall, kept on the wall.
 *
 * @example moveChargePoint(view, 1.5).chargePoint.along // 1.5
 */
export function moveChargePoint(view: PlanView, along: number): PlanView {
  return { ...view, chargePoint: { ...view.chargePoint, along: clampTo(along, 0, view.wallLength) } };
}

/**
 * Changes one bay, then keeps it within its limits.
 *
 * @example updateBay(view, 0, { gap: 1 }).bays[0].gap // 1
 */
export function updateBay(view: PlanView, index: number, change: Partial<ViewBay>): PlanView {
  const bays = view.bays.map((bay, i) => (i === index ? fitBay(view, { ...bay, ...change }) : bay));
  return { ...view, bays };
}

function fitBay(view: PlanView, bay: ViewBay): ViewBay {
  const sized = {
    ...bay,
    width: clampTo(bay.width, limits.bayWidth.min, limits.bayWidth.max),
    length: clampTo(bay.length, limits.bayLength.min, limits.bayLength.max),
    gap: clampTo(bay.gap, limits.bayGap.min, limits.bayGap.max),
  };
  const range = bayLeftRange(view, sized);
  return { ...sized, left: clampTo(sized.left, range.min, range.max) };
}

/**
 * Changes the wall's length, keeping everything where it is from the left corner; the charge
 * point stays on the wall.
 *
 * @example setWallLength(view, 4).wallLength // 4
 */
export function setWallLength(view: PlanView, length: number): PlanView {
  const wallLength = clampTo(length, limits.wallLength.min, limits.wallLength.max);
  const resized = { ...view, wallLength };
  return {
    ...moveChargePoint(resized, view.chargePoint.along),
    bays: view.bays.map((bay) => fitBay(resized, bay)),
  };
}

/**
 * Adds a second bay beside the first (to its right, 0.2 m apart) or behind it (further from
 * the wall), the same size.
 *
 * @example addBay(view, 'behind').bays[1].gap // first bay's gap + its depth
 */
export function addBay(view: PlanView, where: 'beside' | 'behind'): PlanView {
  const first = view.bays[0];
  if (!first || view.bays.length >= 2) return view;
  const rect = bayRect(first);
  const second: ViewBay =
    where === 'beside'
      ? { ...first, left: cm(rect.left + rect.width + 0.2), forEv: null }
      : { ...first, gap: cm(rect.top + rect.height), forEv: null, kind: 'driveway' };
  return { ...view, bays: [{ ...first, forEv: null }, fitBay(view, second)] };
}

/**
 * Removes a bay (never the last one); the other bay is then the electric car's.
 *
 * @example removeBay(twoBays, 1).bays.length // 1
 */
export function removeBay(view: PlanView, index: number): PlanView {
  if (view.bays.length <= 1) return view;
  return { ...view, bays: view.bays.filter((_, i) => i !== index).map((bay) => ({ ...bay, forEv: null })) };
}

/**
 * Marks which bay the electric car uses; null means either (both are checked).
 *
 * @example setEvBay(twoBays, 1).bays.map((b) => b.forEv) // [null, true]
 */
export function setEvBay(view: PlanView, index: number | null): PlanView {
  return { ...view, bays: view.bays.map((bay, i) => ({ ...bay, forEv: index === i ? true : null })) };
}

/** The bay the electric car uses, or null for either. */
export function evBayIndex(view: PlanView): number | null {
  const index = view.bays.findIndex((bay) => bay.forEv === true);
  return index === -1 ? null : index;
}

/**
 * Picks a size class, dropping any figures the customer typed for the old one.
 *
 * @example setSizeClass(view, 'large').car // { sizeClass: 'large' }
 */
export function setSizeClass(view: PlanView, sizeClass: CarSizeClass): PlanView {
  return { ...view, car: { sizeClass } };
}

/**
 * Sets the car's own length or width (mirrors folded), overriding the size class.
 *
 * @example setCarSize(view, { lengthM: 4.2 }).car.lengthM // 4.2
 */
export function setCarSize(view: PlanView, change: { lengthM?: number; widthM?: number }): PlanView {
  const car = { ...view.car };
  if (change.lengthM !== undefined) car.lengthM = clampTo(change.lengthM, limits.carLength.min, limits.carLength.max);
  if (change.widthM !== undefined) car.widthM = clampTo(change.widthM, limits.carWidth.min, limits.carWidth.max);
  return { ...view, car };
}

/** The things on the drawing that can be picked and moved. */
export type Movable = { kind: 'charge-point' } | { kind: 'bay'; index: number };

/**
 * Moves a picked item by a step on screen (metres right and down); the charge point only
 * moves along the wall.
 *
 * @example nudge(view, { kind: 'charge-point' }, 0.5, 0).chargePoint.along // along + 0.5
 */
export function nudge(view: PlanView, item: Movable, right: number, down: number): PlanView {
  if (item.kind === 'charge-point') return moveChargePoint(view, view.chargePoint.along + right);
  const bay = view.bays[item.index];
  if (!bay) return view;
  return updateBay(view, item.index, { left: bay.left + right, gap: bay.gap + down });
}

/**
 * The arrow-key step: 0.1 m, or 0.5 m with Shift. Null for keys that do not move anything.
 *
 * @example arrowStep('ArrowLeft', true) // { right: -0.5, down: 0 }
 */
export function arrowStep(key: string, shift: boolean): { right: number; down: number } | null {
  const size = shift ? 0.5 : 0.1;
  if (key === 'ArrowLeft') return { right: -size, down: 0 };
  if (key === 'ArrowRight') return { right: size, down: 0 };
  if (key === 'ArrowUp') return { right: 0, down: -size };
  if (key === 'ArrowDown') return { right: 0, down: size };
  return null;
}
