// The driveway plan and its geometry: where the car's charge port ends up for each way of
// parking, and how much cable it takes to reach it from the charge point.
//
// Plan convention, in metres, viewed from above: the house wall runs along y = 0 with the
// house at y < 0; y grows away from the house; x grows to the right of someone standing at
// the wall looking out over the drive. (A screen that draws y downward should draw (x, -y)
// flipped top to bottom, i.e. the house along the bottom edge, or the sides will swap.)
// A car's "left" and "right" are as seen from the driver's seat looking forward.
import { z } from 'zod';
import type { ChargePort, ParkingHabit, ParkingWay } from './types';
import { defaultReadinessSettings } from './settings';
import { roundTo } from './units';

const onPlan = z.number().finite().min(-500).max(500);

export const chargePortValues = [
  'front-left',
  'front-right',
  'front-centre',
  'rear-left',
  'rear-right',
  'side-left',
  'side-right',
] as const satisfies readonly ChargePort[];

export const carSizeClassValues = ['small', 'medium', 'large', 'custom'] as const;

const pointSchema = z.object({ x: onPlan, y: onPlan });

/**
 * A parking bay. Angle 0: its length runs away from the wall, covering x..x+width and
 * y..y+length, and a car parked nose-in faces the wall. Angle 90: its length runs along the
 * wall, covering x..x+length and y..y+width, and a car parked nose-in entered from `entry`
 * (default 'left', the smaller-x end) so it faces the other end. `forEv` marks the bay the
 * electric car uses; when no bay is marked, every bay must reach.
 */
const baySchema = z.object({
  x: onPlan,
  y: onPlan,
  width: z.number().finite().positive().max(50),
  length: z.number().finite().positive().max(50),
  angle: z.union([z.literal(0), z.literal(90)]),
  entry: z.enum(['left', 'right']).nullish(),
  forEv: z.boolean().nullish(),
  // What the customer called the space; the geometry does not depend on it.
  kind: z.enum(['driveway', 'garage']).nullish(),
});

/** lengthM / widthM (body, mirrors folded) override the size class's defaults when given. */
const carSchema = z.object({
  sizeClass: z.enum(carSizeClassValues),
  lengthM: z.number().finite().positive().max(10).nullish(),
  widthM: z.number().finite().positive().max(4).nullish(),
});

/**
 * The driveway plan as saved in `charger.plan`: the wall (y = 0 from x0 to x1), the charge
 * point, one or two bays, the car, and the charge port as picked on the plan (which falls back
 * to the vehicle step's answer).
 *
 * @example drivewayPlanSchema.safeParse({ wall: { x0: 0, x1: 8 }, chargePoint: { x: 1, y: 0 }, bays: [], car: { sizeClass: 'small' } }).success // true
 */
export const drivewayPlanSchema = z.object({
  wall: z.object({ x0: onPlan, x1: onPlan }),
  chargePoint: pointSchema,
  bays: z.array(baySchema).max(2),
  car: carSchema,
  chargePort: z.enum(chargePortValues).nullish(),
});

export type Point = z.infer<typeof pointSchema>;
export type PlanBay = z.infer<typeof baySchema>;
export type CarSizeClass = (typeof carSizeClassValues)[number];
export type PlanCar = z.infer<typeof carSchema>;
export type PlanWall = DrivewayPlan['wall'];
export type DrivewayPlan = z.infer<typeof drivewayPlanSchema>;

export interface CarSize {
  lengthM: number;
  widthM: number;
}

/**
 * Typical body sizes of cars on sale, mirrors folded. From memory, not a published source:
 * starting values the customer can edit. 'custom' starts from the medium size.
 */
export const carSizeDefaults: Readonly<Record<CarSizeClass, CarSize>> = Object.freeze({
  small: { lengthM: 4.0, widthM: 1.8 },
  medium: { lengthM: 4.5, widthM: 1.85 },
  large: { lengthM: 4.9, widthM: 1.95 },
  custom: { lengthM: 4.5, widthM: 1.85 },
});

/** An axis-aligned rectangle (bays are at 0 or 90 degrees, so cars are too). */
export interface Rect {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

/**
 * The car's size: the customer's own figures where given, else the size class's default.
 *
 * @example carSize({ sizeClass: 'small' }) // { lengthM: 4, widthM: 1.8 }
 */
export function carSize(car: PlanCar): CarSize {
  const base = carSizeDefaults[car.sizeClass] ?? carSizeDefaults.medium;
  return {
    lengthM: positive(car.lengthM) ?? base.lengthM,
    widthM: positive(car.widthM) ?? base.widthM,
  };
}

/**
 * The ways the car must be checked for: "varies" means both.
 *
 * @example parkingWays('varies') // ['nose-in', 'reverse-in']
 */
export function parkingWays(habit: ParkingHabit | null | undefined): ParkingWay[] {
  if (habit === 'nose-in' || habit === 'reverse-in') return [habit];
  return ['nose-in', 'reverse-in'];
}

/**
 * The bay's centre, where the car is parked.
 *
 * @example bayCentre({ x: 0, y: 0.5, width: 2.4, length: 4.8, angle: 0 }) // { x: 1.2, y: 2.9 }
 */
export function bayCentre(bay: PlanBay): Point {
  const spanX = bay.angle === 0 ? bay.width : bay.length;
  const spanY = bay.angle === 0 ? bay.length : bay.width;
  return { x: bay.x + spanX / 2, y: bay.y + spanY / 2 };
}

/**
 * The unit vector the car's nose points along, for a bay and a way of parking.
 *
 * @example carForward({ x: 0, y: 0, width: 2.4, length: 4.8, angle: 0 }, 'nose-in') // { x: 0, y: -1 }
 */
export function carForward(bay: PlanBay, way: ParkingWay): Point {
  const noseIn: Point = bay.angle === 0 ? { x: 0, y: -1 } : { x: bay.entry === 'right' ? -1 : 1, y: 0 };
  return way === 'nose-in' ? noseIn : { x: -noseIn.x, y: -noseIn.y };
}

/**
 * The driver's left, a quarter turn anticlockwise from forward when viewed from above.
 *
 * @example carLeft({ x: 0, y: 1 }) // { x: -1, y: 0 } (facing away from the house, left is −x)
 */
export function carLeft(forward: Point): Point {
  return { x: -forward.y + 0, y: forward.x + 0 };
}

/**
 * The port's offset in the car's own frame: metres forward of the centre and metres to the
 * driver's left. Wing ports sit `insetM` in from the bumper; side ports at mid-length.
 *
 * @example portOffset('front-left', { lengthM: 4.5, widthM: 1.85 }, 0.8) // { forward: 1.45, left: 0.925 }
 */
export function portOffset(port: ChargePort, size: CarSize, insetM: number): { forward: number; left: number } {
  const half = size.lengthM / 2;
  const wing = half - Math.min(insetM, half);
  const side = size.widthM / 2;
  const offsets: Record<ChargePort, { forward: number; left: number }> = {
    'front-left': { forward: wing, left: side },
    'front-right': { forward: wing, left: -side },
    'front-centre': { forward: half, left: 0 },
    'rear-left': { forward: -wing, left: side },
    'rear-right': { forward: -wing, left: -side },
    'side-left': { forward: 0, left: side },
    'side-right': { forward: 0, left: -side },
  };
  return offsets[port];
}

/**
 * Where the car's charge port is when parked in the bay that way (car centred in the bay).
 * Null when no port is known.
 *
 * @example portPosition(plan, { x: 0, y: 0.5, width: 2.4, length: 4.8, angle: 0 }, 'nose-in', 'front-centre')
 * // medium car, nose to the wall: { x: 1.2, y: 2.9 - 2.25 } = { x: 1.2, y: 0.65 }
 */
export function portPosition(
  plan: DrivewayPlan,
  bay: PlanBay,
  way: ParkingWay,
  port: ChargePort | null | undefined = plan.chargePort,
  insetM: number = defaultReadinessSettings.portInsetMetres,
): Point | null {
  if (!port) return null;
  const centre = bayCentre(bay);
  const forward = carForward(bay, way);
  const left = carLeft(forward);
  const offset = portOffset(port, carSize(plan.car), insetM);
  return {
    x: centre.x + offset.forward * forward.x + offset.left * left.x,
    y: centre.y + offset.forward * forward.y + offset.left * left.y,
  };
}

/**
 * The car's footprint parked in the bay (axis-aligned, centred in the bay).
 *
 * @example carFootprint(plan, { x: 0, y: 0.5, width: 2.4, length: 4.8, angle: 0 }) // medium: x 0.275..2.125, y 0.65..5.15
 */
export function carFootprint(plan: DrivewayPlan, bay: PlanBay): Rect {
  const centre = bayCentre(bay);
  const size = carSize(plan.car);
  const halfX = (bay.angle === 0 ? size.widthM : size.lengthM) / 2;
  const halfY = (bay.angle === 0 ? size.lengthM : size.widthM) / 2;
  return { minX: centre.x - halfX, minY: centre.y - halfY, maxX: centre.x + halfX, maxY: centre.y + halfY };
}

export interface CablePath {
  /** The path on the plan: the charge point, any corners of the car passed, the port. */
  points: Point[];
  planMetres: number;
  slackMetres: number;
  requiredMetres: number;
}

/**
 * Cable needed from the charge point to the port: the shortest path on the plan (straight,
 * or around the car's body when the car is in the way) plus a slack allowance so the cable
 * droops rather than pulls taut (common practice, no published source).
 *
 * @example cablePath({ x: 0, y: 0 }, { x: 3, y: 4 }, { slackMetres: 1 }).requiredMetres // 5 + 1 = 6
 */
export function cablePath(
  chargePoint: Point,
  port: Point,
  options: { slackMetres?: number; around?: Rect | null; obstacles?: readonly Rect[] } = {},
): CablePath {
  const slackMetres = options.slackMetres ?? defaultReadinessSettings.cableSlackMetres;
  const obstacles = [...(options.around ? [options.around] : []), ...(options.obstacles ?? [])];
  const points = obstacles.length > 0 ? shortestPathAround(chargePoint, port, obstacles) : [chargePoint, port];
  const planMetres = pathLength(points);
  return { points, planMetres: roundTo(planMetres, 3), slackMetres, requiredMetres: roundTo(planMetres + slackMetres, 3) };
}

export interface ReachVerdict {
  bayIndex: number;
  way: ParkingWay;
  port: Point;
  path: Point[];
  planMetres: number;
  requiredMetres: number;
  reaches: boolean;
  /** How much longer the cable would need to be; 0 when it reaches. */
  shortByMetres: number;
}

/**
 * Whether another bay holds a car while the electric car charges: yes unless the customer said
 * there is only one car (an unknown count is taken as the harder case).
 * @example otherBaysOccupied(1) // false
 */
export function otherBaysOccupied(cars: number | null | undefined): boolean {
  return typeof cars !== 'number' || cars >= 2;
}

export interface ReachOptions {
  port?: ChargePort | null;
  slackMetres?: number;
  portInsetMetres?: number;
  /**
   * Whether the other bays hold a car (of the same size, assumed) when the electric car is
   * parked: each occupied bay is an obstacle the cable must go round. Default true.
   */
  otherBaysOccupied?: boolean;
}

/**
 * Whether a cable of `cableMetres` reaches the port for each way the car parks, in each bay
 * the electric car uses. Empty when no port is known.
 *
 * @example reachVerdict(plan, 5, 'varies').map((v) => v.reaches) // [true, false]: nose-in reaches, reversed does not
 */
export function reachVerdict(
  plan: DrivewayPlan,
  cableMetres: number,
  habit: ParkingHabit | null | undefined,
  options: ReachOptions = {},
): ReachVerdict[] {
  const port = options.port ?? plan.chargePort ?? null;
  if (!port) return [];
  const inset = options.portInsetMetres ?? defaultReadinessSettings.portInsetMetres;
  const othersOccupied = options.otherBaysOccupied ?? true;
  return evBays(plan).flatMap(({ bay, index }) =>
    parkingWays(habit).map((way) => {
      const position = portPosition(plan, bay, way, port, inset) as Point;
      const others = othersOccupied ? plan.bays.filter((_, i) => i !== index).map((other) => carFootprint(plan, other)) : [];
      const path = cablePath(plan.chargePoint, position, {
        slackMetres: options.slackMetres,
        around: carFootprint(plan, bay),
        obstacles: others,
      });
      const reaches = path.requiredMetres <= cableMetres;
      return {
        bayIndex: index,
        way,
        port: { x: roundTo(position.x, 3), y: roundTo(position.y, 3) },
        path: path.points.map((p) => ({ x: roundTo(p.x, 3), y: roundTo(p.y, 3) })),
        planMetres: path.planMetres,
        requiredMetres: path.requiredMetres,
        reaches,
        shortByMetres: reaches ? 0 : roundTo(path.requiredMetres - cableMetres, 3),
      };
    }),
  );
}

const problemBySection: Record<string, string> = {
  wall: 'Draw the house wall.',
  chargePoint: 'Mark where you would like the charge point.',
  bays: 'Give each parking bay a position, width and length (one or two bays).',
  car: "Choose your car's size.",
  chargePort: 'Pick where the charging socket is on the car.',
};

/**
 * Reads a saved plan (free-form JSON) into a measurable plan, or says in plain words what is
 * missing.
 *
 * @example readPlan({ ...plan, bays: [] }) // { plan: null, problems: ['Add the parking bay to the plan.'] }
 */
export function readPlan(value: unknown): { plan: DrivewayPlan | null; problems: string[] } {
  const parsed = drivewayPlanSchema.safeParse(value);
  if (!parsed.success) {
    const sections = parsed.error.issues.map((issue) => String(issue.path[0] ?? ''));
    const problems = [...new Set(sections.map((section) => problemBySection[section] ?? 'Finish your driveway plan.'))];
    return { plan: null, problems };
  }
  if (parsed.data.bays.length === 0) return { plan: null, problems: ['Add the parking bay to the plan.'] };
  return { plan: parsed.data, problems: [] };
}

/**
 * What stops a plan being measured; empty when it can be.
 *
 * @example planProblems({ ...plan, bays: [] }) // ['Add the parking bay to the plan.']
 */
export function planProblems(value: unknown): string[] {
  return readPlan(value).problems;
}

function evBays(plan: DrivewayPlan): { bay: PlanBay; index: number }[] {
  const all = plan.bays.map((bay, index) => ({ bay, index }));
  const marked = all.filter(({ bay }) => bay.forEv === true);
  return marked.length > 0 ? marked : all;
}

function positive(value: number | null | undefined): number | null {
  return typeof value === 'number' && Number.isFinite(value) && value > 0 ? value : null;
}

function distance(a: Point, b: Point): number {
  return Math.hypot(b.x - a.x, b.y - a.y);
}

function pathLength(points: readonly Point[]): number {
  return points.slice(1).reduce((total, point, i) => total + distance(points[i] as Point, point), 0);
}

const EPS = 1e-9;

function strictlyInside(p: Point, r: Rect): boolean {
  return p.x > r.minX + EPS && p.x < r.maxX - EPS && p.y > r.minY + EPS && p.y < r.maxY - EPS;
}

// Liang–Barsky clip; a convex shape's chord either lies along an edge or crosses the inside.
function segmentCrossesInside(a: Point, b: Point, r: Rect): boolean {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  let t0 = 0;
  let t1 = 1;
  const bounds: [number, number][] = [
    [-dx, a.x - r.minX],
    [dx, r.maxX - a.x],
    [-dy, a.y - r.minY],
    [dy, r.maxY - a.y],
  ];
  for (const [p, q] of bounds) {
    if (p === 0) {
      if (q < 0) return false;
      continue;
    }
    const t = q / p;
    if (p < 0) t0 = Math.max(t0, t);
    else t1 = Math.min(t1, t);
  }
  if (t1 - t0 <= EPS) return false;
  const mid = (t0 + t1) / 2;
  return strictlyInside({ x: a.x + mid * dx, y: a.y + mid * dy }, r);
}

// Shortest path round the parked cars: a small visibility graph over every car's corners.
function shortestPathAround(from: Point, to: Point, rects: readonly Rect[]): Point[] {
  // Only the cars the end points are not inside can block: a port sits on its own car's body.
  const blocking = rects.filter((r) => !strictlyInside(from, r));
  const blocked = (a: Point, b: Point) => blocking.some((r) => segmentCrossesInside(a, b, r));
  if (!blocked(from, to)) return [from, to];
  const corners = blocking.flatMap((r) => [
    { x: r.minX, y: r.minY },
    { x: r.maxX, y: r.minY },
    { x: r.maxX, y: r.maxY },
    { x: r.minX, y: r.maxY },
  ]);
  const nodes: Point[] = [from, to, ...corners.filter((c) => !blocking.some((r) => strictlyInside(c, r)))];
  const best = nodes.map(() => Infinity);
  const previous = nodes.map(() => -1);
  const done = nodes.map(() => false);
  best[0] = 0;
  for (let round = 0; round < nodes.length; round += 1) {
    const current = nearestOpen(best, done);
    if (current === -1) break;
    done[current] = true;
    nodes.forEach((node, next) => {
      if (done[next] || blocked(nodes[current] as Point, node)) return;
      const through = (best[current] as number) + distance(nodes[current] as Point, node);
      if (through < (best[next] as number)) {
        best[next] = through;
        previous[next] = current;
      }
    });
  }
  return walkBack(nodes, previous, from, to);
}

function nearestOpen(best: readonly number[], done: readonly boolean[]): number {
  let index = -1;
  best.forEach((value, i) => {
    if (!done[i] && value < Infinity && (index === -1 || value < (best[index] as number))) index = i;
  });
  return index;
}

function walkBack(nodes: readonly Point[], previous: readonly number[], from: Point, to: Point): Point[] {
  if (previous[1] === -1) return [from, to];
  const path: Point[] = [];
  for (let i = 1; i !== -1; i = previous[i] as number) path.unshift(nodes[i] as Point);
  return path;
}
