// Shapes for the drawing, in street-view metres (see plan-view.ts for the mirror): the plan's
// own geometry from src/lib/readiness/plan.ts, turned to face the customer.
import {
  carFootprint,
  carForward,
  carLeft,
  carSize,
  bayCentre,
  type DrivewayPlan,
  type PlanBay,
  type Point,
  type Rect,
} from '@/lib/readiness/plan';
import type { ParkingWay } from '@/lib/readiness/types';
import { bayRect, type PlanView, type ViewRect } from './plan-view';

/** Depth of the strip of house drawn above the wall, in metres. */
export const HOUSE_DEPTH = 1.5;

/**
 * A plan point on screen: x from the wall's left corner, y out from the wall.
 *
 * @example toScreen({ wall: { x0: 0, x1: 6 } } as DrivewayPlan, { x: 1, y: 2 }) // { x: 5, y: 2 }
 */
export function toScreen(plan: DrivewayPlan, point: Point): Point {
  return { x: plan.wall.x1 - point.x + 0, y: point.y };
}

/**
 * A plan rectangle on screen.
 *
 * @example rectToScreen({ wall: { x0: 0, x1: 6 } } as DrivewayPlan, { minX: 1, minY: 0, maxX: 2, maxY: 4 }) // { left: 4, top: 0, width: 1, height: 4 }
 */
export function rectToScreen(plan: DrivewayPlan, rect: Rect): ViewRect {
  return { left: plan.wall.x1 - rect.maxX, top: rect.minY, width: rect.maxX - rect.minX, height: rect.maxY - rect.minY };
}

/** The area to draw, with room for the house strip, labels and the scale bar. */
export interface Frame {
  minX: number;
  minY: number;
  width: number;
  height: number;
}

/**
 * The frame that holds the wall, every bay, every car and every port, with a margin.
 *
 * @example frameFor(view, []).minY // −HOUSE_DEPTH − 0.3
 */
export function frameFor(view: PlanView, extra: readonly ViewRect[]): Frame {
  const rects = [...view.bays.map(bayRect), ...extra];
  const minX = Math.min(0, ...rects.map((r) => r.left)) - 0.7;
  const maxX = Math.max(view.wallLength, ...rects.map((r) => r.left + r.width)) + 0.7;
  const minY = -HOUSE_DEPTH - 0.3;
  const maxY = Math.max(3, ...rects.map((r) => r.top + r.height)) + 1.5;
  return { minX, minY, width: maxX - minX, height: maxY - minY };
}

/** The car's body and its front, for drawing one bay and one way of parking. */
export interface CarShape {
  body: ViewRect;
  windscreen: ViewRect;
  rearWindow: ViewRect;
  wheels: ViewRect[];
  /** Unit vector of the car's nose on screen. */
  forward: Point;
}

/**
 * The car drawn in a bay, nose where the way of parking puts it.
 *
 * @example carShape(plan, plan.bays[0], 'nose-in').forward // { x: 0, y: -1 }: nose to the wall
 */
export function carShape(plan: DrivewayPlan, bay: PlanBay, way: ParkingWay): CarShape {
  const forward = carForward(bay, way);
  const left = carLeft(forward);
  const size = carSize(plan.car);
  const centre = bayCentre(bay);
  const half = size.lengthM / 2;
  const side = size.widthM / 2;
  // A band of the car in its own frame: `from`..`to` metres forward, `inset` in from each side.
  const band = (from: number, to: number, inset: number): Rect => {
    const a = at(centre, forward, left, from, side - inset);
    const b = at(centre, forward, left, to, -(side - inset));
    return { minX: Math.min(a.x, b.x), minY: Math.min(a.y, b.y), maxX: Math.max(a.x, b.x), maxY: Math.max(a.y, b.y) };
  };
  const wheel = (from: number, to: number, onLeft: boolean): Rect => {
    const sign = onLeft ? 1 : -1;
    const a = at(centre, forward, left, from, sign * (side + 0.06));
    const b = at(centre, forward, left, to, sign * (side - 0.2));
    return { minX: Math.min(a.x, b.x), minY: Math.min(a.y, b.y), maxX: Math.max(a.x, b.x), maxY: Math.max(a.y, b.y) };
  };
  const axle = half - Math.min(0.95, half * 0.4);
  return {
    body: rectToScreen(plan, carFootprint(plan, bay)),
    windscreen: rectToScreen(plan, band(half * 0.2, half * 0.42, 0.14)),
    rearWindow: rectToScreen(plan, band(-half * 0.72, -half * 0.6, 0.18)),
    wheels: [
      wheel(axle - 0.3, axle + 0.3, true),
      wheel(axle - 0.3, axle + 0.3, false),
      wheel(-axle - 0.3, -axle + 0.3, true),
      wheel(-axle - 0.3, -axle + 0.3, false),
    ].map((r) => rectToScreen(plan, r)),
    forward: { x: -forward.x + 0, y: forward.y },
  };
}

function at(centre: Point, forward: Point, left: Point, ahead: number, toLeft: number): Point {
  return { x: centre.x + ahead * forward.x + toLeft * left.x, y: centre.y + ahead * forward.y + toLeft * left.y };
}

/**
 * A "nice" scale bar length for the frame: 1, 2 or 5 m.
 *
 * @example scaleBarMetres(8) // 2
 */
export function scaleBarMetres(frameWidth: number): number {
  if (frameWidth < 5) return 1;
  return frameWidth < 14 ? 2 : 5;
}

/**
 * A polyline's points for SVG.
 *
 * @example svgPoints([{ x: 0, y: 0 }, { x: 1, y: 2 }]) // '0,0 1,2'
 */
export function svgPoints(points: readonly Point[]): string {
  return points.map((p) => `${round3(p.x)},${round3(p.y)}`).join(' ');
}

const round3 = (value: number) => Math.round(value * 1000) / 1000;
