import { describe, expect, it } from 'vitest';
import { checkCableReach, cableForReach } from '@/lib/readiness/checks/cable-reach';
import {
  cablePath,
  carFootprint,
  carLeft,
  carSize,
  carSizeDefaults,
  planProblems,
  portPosition,
  reachVerdict,
  type DrivewayPlan,
  type PlanBay,
} from '@/lib/readiness/plan';
import { defaultReadinessSettings, resolveReadinessSettings } from '@/lib/readiness/settings';
import type { ChargePort, ChargerAnswers, ParkingHabit, ParkingWay } from '@/lib/readiness';

// Geometry worked by hand. Plan convention: wall along y = 0, y away from the house, x to the
// right of someone at the wall looking out. Car "left" is the driver's left. Car sizes are from
// memory (medium 4.5 × 1.85 m); port inset 0.8 m and slack 1 m are settings (common practice,
// no published source).
//
// Bay A, at 0° (length away from the wall): x 0..2.4, y 0.5..5.3 → centre (1.2, 2.9).
// Medium car: half length 2.25, half width 0.925; wing ports 2.25 − 0.8 = 1.45 m from centre.
// Footprint x 0.275..2.125, y 0.65..5.15. Charge point C = (2.6, 0), to the right of the bay.
const bayA: PlanBay = { x: 0, y: 0.5, width: 2.4, length: 4.8, angle: 0 };
// Bay B, at 90° (along the wall), entered from the left: x 3..7.8, y 0.5..2.9 → centre (5.4, 1.7).
// Footprint x 3.15..7.65, y 0.775..2.625.
const bayB: PlanBay = { x: 3, y: 0.5, width: 2.4, length: 4.8, angle: 90 };

function plan(overrides: Partial<DrivewayPlan> = {}): DrivewayPlan {
  return {
    wall: { x0: 0, x1: 10 },
    chargePoint: { x: 2.6, y: 0 },
    bays: [bayA],
    car: { sizeClass: 'medium' },
    ...overrides,
  };
}

describe('car sizes and the driver’s left', () => {
  it('takes the size class defaults (from memory) unless the customer edits them', () => {
    expect(carSize({ sizeClass: 'medium' })).toEqual({ lengthM: 4.5, widthM: 1.85 });
    expect(carSize({ sizeClass: 'large', lengthM: 5.1 })).toEqual({ lengthM: 5.1, widthM: 1.95 });
    expect(carSize({ sizeClass: 'custom', lengthM: 3.6, widthM: 1.6 })).toEqual({ lengthM: 3.6, widthM: 1.6 });
    expect(Object.keys(carSizeDefaults)).toEqual(['small', 'medium', 'large', 'custom']);
  });

  it.each([
    // Facing away from the house (+y), the driver's left is −x; facing the house, +x.
    { forward: { x: 0, y: 1 }, left: { x: -1, y: 0 } },
    { forward: { x: 0, y: -1 }, left: { x: 1, y: 0 } },
    // Facing along the wall to +x, the driver's left is away from the house (+y).
    { forward: { x: 1, y: 0 }, left: { x: 0, y: 1 } },
    { forward: { x: -1, y: 0 }, left: { x: 0, y: -1 } },
  ])('forward $forward → left $left', ({ forward, left }) => {
    expect(carLeft(forward)).toEqual(left);
  });
});

describe('port position for each port and parking way (bay A, 0°)', () => {
  it.each([
    // Port = centre (1.2, 2.9) + a·forward + b·left, with a = ±1.45 (wing), ±2.25 (bumper) or 0
    // (side) and b = ±0.925 (half width) or 0. So x is 1.2 ± 0.925 = 2.125 / 0.275, and y is
    // 2.9 ± 1.45 = 1.45 / 4.35, or 2.9 ± 2.25 = 0.65 / 5.15 for the front-centre port.
    // Nose-in: forward (0, −1), left (+1, 0).
    { way: 'nose-in', port: 'front-left', x: 2.125, y: 1.45 },
    { way: 'nose-in', port: 'front-right', x: 0.275, y: 1.45 },
    { way: 'nose-in', port: 'front-centre', x: 1.2, y: 0.65 },
    { way: 'nose-in', port: 'rear-left', x: 2.125, y: 4.35 },
    { way: 'nose-in', port: 'rear-right', x: 0.275, y: 4.35 },
    { way: 'nose-in', port: 'side-left', x: 2.125, y: 2.9 },
    { way: 'nose-in', port: 'side-right', x: 0.275, y: 2.9 },
    // Reverse-in: forward (0, +1), left (−1, 0).
    { way: 'reverse-in', port: 'front-left', x: 0.275, y: 4.35 },
    { way: 'reverse-in', port: 'front-right', x: 2.125, y: 4.35 },
    { way: 'reverse-in', port: 'front-centre', x: 1.2, y: 5.15 },
    { way: 'reverse-in', port: 'rear-left', x: 0.275, y: 1.45 },
    { way: 'reverse-in', port: 'rear-right', x: 2.125, y: 1.45 },
    { way: 'reverse-in', port: 'side-left', x: 0.275, y: 2.9 },
    { way: 'reverse-in', port: 'side-right', x: 2.125, y: 2.9 },
  ] as const)('$way, $port → ($x, $y)', ({ way, port, x, y }) => {
    const point = portPosition(plan(), bayA, way, port);
    expect(point?.x).toBeCloseTo(x, 6);
    expect(point?.y).toBeCloseTo(y, 6);
  });

  it('has no position without a port', () => {
    expect(portPosition(plan(), bayA, 'nose-in')).toBeNull();
  });
});

describe('port position in a bay along the wall (bay B, 90°)', () => {
  it.each([
    // Centre (5.4, 1.7): x is 5.4 ± 1.45 = 6.85 / 3.95 (wing) or 5.4 + 2.25 = 7.65 (bumper);
    // y is 1.7 ± 0.925 = 2.625 / 0.775.
    // Entered from the left, nose-in faces +x: forward (1, 0), left (0, 1).
    { entry: 'left', way: 'nose-in', port: 'front-left', x: 6.85, y: 2.625 },
    { entry: 'left', way: 'nose-in', port: 'front-right', x: 6.85, y: 0.775 },
    { entry: 'left', way: 'nose-in', port: 'front-centre', x: 7.65, y: 1.7 },
    { entry: 'left', way: 'nose-in', port: 'side-right', x: 5.4, y: 0.775 },
    // Reversed in from the left faces −x: forward (−1, 0), left (0, −1).
    { entry: 'left', way: 'reverse-in', port: 'front-left', x: 3.95, y: 0.775 },
    { entry: 'left', way: 'reverse-in', port: 'rear-left', x: 6.85, y: 0.775 },
    { entry: 'left', way: 'reverse-in', port: 'side-left', x: 5.4, y: 0.775 },
    // Entered from the right, nose-in faces −x: the same as reversing in from the left.
    { entry: 'right', way: 'nose-in', port: 'front-left', x: 3.95, y: 0.775 },
  ] as const)('entry $entry, $way, $port → ($x, $y)', ({ entry, way, port, x, y }) => {
    const bay = { ...bayB, entry };
    const point = portPosition(plan({ bays: [bay] }), bay, way, port);
    expect(point?.x).toBeCloseTo(x, 6);
    expect(point?.y).toBeCloseTo(y, 6);
  });
});

describe('cable path: straight, or round the car', () => {
  it('is the straight line plus the slack when nothing is in the way', () => {
    // 3-4-5 triangle: 5 m + 1 m slack = 6 m.
    expect(cablePath({ x: 0, y: 0 }, { x: 3, y: 4 }, { slackMetres: 1 })).toMatchObject({ planMetres: 5, requiredMetres: 6 });
    // Default slack is the setting: 1 m.
    expect(cablePath({ x: 0, y: 0 }, { x: 0, y: 2 }).requiredMetres).toBe(3);
  });

  it('goes round the car body instead of through it', () => {
    // Nose-in, front-right port at (0.275, 1.45) is on the far side from C (2.6, 0); the
    // straight line would cross the bonnet. Round the front-right corner (0.275, 0.65):
    // √(2.325² + 0.65²) = √5.828125 = 2.41415, then 0.8 m along the side: 3.21415 m.
    const around = carFootprint(plan(), bayA);
    const expectedBox = { minX: 0.275, minY: 0.65, maxX: 2.125, maxY: 5.15 };
    for (const key of Object.keys(expectedBox) as (keyof typeof expectedBox)[]) {
      expect(around[key]).toBeCloseTo(expectedBox[key], 9);
    }
    const path = cablePath({ x: 2.6, y: 0 }, { x: 0.275, y: 1.45 }, { slackMetres: 1, around });
    const expectedPoints = [{ x: 2.6, y: 0 }, { x: 0.275, y: 0.65 }, { x: 0.275, y: 1.45 }];
    expect(path.points).toHaveLength(expectedPoints.length);
    path.points.forEach((point, i) => {
      expect(point.x).toBeCloseTo(expectedPoints[i]?.x ?? NaN, 9);
      expect(point.y).toBeCloseTo(expectedPoints[i]?.y ?? NaN, 9);
    });
    expect(path.planMetres).toBeCloseTo(3.214, 3);
    expect(path.requiredMetres).toBeCloseTo(4.214, 3);
  });
});

describe('reach verdict for every port and way (bay A, C at (2.6, 0), slack 1 m)', () => {
  it.each([
    // Nose-in: C → front-left (2.125, 1.45): √(0.475² + 1.45²) = √2.328125 = 1.52582 → 2.526 m.
    { way: 'nose-in', port: 'front-left', required: 2.526 },
    // C → round (0.275, 0.65) → (0.275, 1.45): 2.41415 + 0.8 = 3.21415 → 4.214 m.
    { way: 'nose-in', port: 'front-right', required: 4.214 },
    // C → (1.2, 0.65): √(1.4² + 0.65²) = √2.3825 = 1.54353 → 2.544 m.
    { way: 'nose-in', port: 'front-centre', required: 2.544 },
    // C → (2.125, 4.35): √(0.475² + 4.35²) = √19.148125 = 4.37586 → 5.376 m.
    { way: 'nose-in', port: 'rear-left', required: 5.376 },
    // C → round (0.275, 0.65) → (0.275, 4.35): 2.41415 + 3.7 = 6.11415 → 7.114 m (the way round
    // the back, √(0.475² + 5.15²) + 1.85 + 0.8 = 7.822, is longer).
    { way: 'nose-in', port: 'rear-right', required: 7.114 },
    // C → (2.125, 2.9): √(0.475² + 2.9²) = √8.635625 = 2.93865 → 3.939 m.
    { way: 'nose-in', port: 'side-left', required: 3.939 },
    // C → round (0.275, 0.65) → (0.275, 2.9): 2.41415 + 2.25 = 4.66415 → 5.664 m.
    { way: 'nose-in', port: 'side-right', required: 5.664 },
    // Reversed in, the sides swap: front-left is at (0.275, 4.35), as nose-in rear-right.
    { way: 'reverse-in', port: 'front-left', required: 7.114 },
    { way: 'reverse-in', port: 'front-right', required: 5.376 },
    // C → (2.125, 5.15) → (1.2, 5.15): √(0.475² + 5.15²) = √26.748125 = 5.17186 + 0.925
    // = 6.09686 → 7.097 m.
    { way: 'reverse-in', port: 'front-centre', required: 7.097 },
    { way: 'reverse-in', port: 'rear-left', required: 4.214 },
    { way: 'reverse-in', port: 'rear-right', required: 2.526 },
    { way: 'reverse-in', port: 'side-left', required: 5.664 },
    { way: 'reverse-in', port: 'side-right', required: 3.939 },
  ] as const)('$way, $port needs $required m', ({ way, port, required }) => {
    const [verdict] = reachVerdict(plan(), 5, way, { port, slackMetres: 1 });
    expect(verdict?.way).toBe(way);
    expect(verdict?.requiredMetres).toBeCloseTo(required, 3);
    // A 5 m tethered cable reaches exactly when the requirement is 5 m or less.
    expect(verdict?.reaches).toBe(required <= 5);
  });

  it('checks both ways when parking varies, and says how short it falls', () => {
    const verdicts = reachVerdict(plan({ chargePort: 'front-left' }), 5, 'varies', { slackMetres: 1 });
    expect(verdicts.map((v) => [v.way, v.reaches])).toEqual([
      ['nose-in', true],
      ['reverse-in', false],
    ]);
    // 7.114 − 5 = 2.114 m short.
    expect(verdicts[1]?.shortByMetres).toBeCloseTo(2.114, 3);
  });

  it('measures a bay along the wall, round the car where needed', () => {
    // Bay B nose-in, C at (5.4, 0) behind the middle of the car.
    // side-right (5.4, 0.775): 0.775 m straight → 1.775 m.
    // front-right (6.85, 0.775): √(1.45² + 0.775²) = √2.703125 = 1.64412 → 2.644 m.
    // front-left (6.85, 2.625) is on the far side: round (7.65, 0.775), √(2.25² + 0.775²)
    // = √5.663125 = 2.37973, + 1.85 up the front + 0.8 back = 5.02973 → 6.030 m.
    const alongWall = plan({ bays: [bayB], chargePoint: { x: 5.4, y: 0 } });
    const need = (port: ChargePort) => reachVerdict(alongWall, 5, 'nose-in', { port, slackMetres: 1 })[0]?.requiredMetres;
    expect(need('side-right')).toBeCloseTo(1.775, 3);
    expect(need('front-right')).toBeCloseTo(2.644, 3);
    expect(need('front-left')).toBeCloseTo(6.03, 3);
  });

  it('checks only the bay marked for the electric car, or every bay when none is marked', () => {
    const both = plan({ bays: [bayA, bayB], chargePort: 'front-left' });
    expect(reachVerdict(both, 5, 'nose-in').map((v) => v.bayIndex)).toEqual([0, 1]);
    const marked = plan({ bays: [bayA, { ...bayB, forEv: true }], chargePort: 'front-left' });
    expect(reachVerdict(marked, 5, 'nose-in').map((v) => v.bayIndex)).toEqual([1]);
  });

  it('finds what stops a plan being measured, whatever JSON was saved', () => {
    expect(planProblems(plan())).toEqual([]);
    expect(planProblems(plan({ bays: [] }))).toEqual(['Add the parking bay to the plan.']);
    expect(planProblems(plan({ bays: [{ ...bayA, width: 0 }] }))).toEqual([
      'Give each parking bay a position, width and length (one or two bays).',
    ]);
    // Three bays is more than the plan allows (one or two).
    expect(planProblems(plan({ bays: [bayA, bayB, bayB] }))).toHaveLength(1);
    expect(planProblems({ ...plan(), car: 'big' })).toEqual(["Choose your car's size."]);
    expect(planProblems({ ...plan(), chargePort: 'roof' })).toEqual(['Pick where the charging socket is on the car.']);
    expect(planProblems({ scribble: true }).length).toBeGreaterThan(1);
  });
});

describe('cable-reach check', () => {
  function reach(charger: ChargerAnswers, habit: ParkingHabit | null, vehiclePort: ChargePort | null = null) {
    return checkCableReach({
      answers: { charger, parking: { habit }, vehicle: { chargePort: vehiclePort } },
      uploads: [],
      site: {},
      settings: defaultReadinessSettings,
      today: '2025-03-03',
    });
  }

  it.each([
    // Tethered 5 m, front-left, nose-in: 2.526 m ≤ 5 → green.
    { tether: 5, port: 'front-left', habit: 'nose-in', light: 'green' },
    // Varies: reverse-in needs 7.114 m > 5 → amber.
    { tether: 5, port: 'front-left', habit: 'varies', light: 'amber' },
    // A 7.5 m tether covers 7.114 m both ways → green.
    { tether: 7.5, port: 'front-left', habit: 'varies', light: 'green' },
    // No way reaches (rear-right nose-in needs 7.114 m): still amber — fixable, not a blocker.
    { tether: 5, port: 'rear-right', habit: 'nose-in', light: 'amber' },
    // Habit not answered counts as "varies": front-left reverse-in fails → amber.
    { tether: 5, port: 'front-left', habit: null, light: 'amber' },
  ] as const)('tether $tether m, $port, $habit → $light', ({ tether, port, habit, light }) => {
    const result = reach({ preference: 'tethered', tetherMetres: tether, plan: plan({ chargePort: port }) }, habit);
    expect(result.light).toBe(light);
    expect(result.figures.cableSource).toBe('tether');
  });

  it('uses the customer’s own cable (5 m, common practice) for a socketed unit', () => {
    expect(cableForReach({ preference: 'socketed', tetherMetres: 10 }, defaultReadinessSettings)).toEqual({
      metres: 5,
      source: 'customer-cable-assumed',
    });
    // Socketed with a 7.5 m setting for the customer's cable: side-right nose-in 5.664 m → green.
    const result = checkCableReach({
      answers: { charger: { preference: 'socketed', plan: plan({ chargePort: 'side-right' }) }, parking: { habit: 'nose-in' } },
      uploads: [],
      site: {},
      settings: resolveReadinessSettings({ defaultCustomerCableMetres: 7.5 }),
      today: '2025-03-03',
    });
    expect(result.light).toBe('green');
    expect(result.figures.cableMetres).toBe(7.5);
  });

  it('assumes the usual 5 m when a tethered length is not given', () => {
    expect(cableForReach({ preference: 'tethered' }, defaultReadinessSettings)).toEqual({ metres: 5, source: 'tether-assumed' });
  });

  it('takes the port from the vehicle step when the plan has none', () => {
    const result = reach({ preference: 'tethered', tetherMetres: 5, plan: plan() }, 'nose-in', 'front-left');
    expect(result.light).toBe('green');
    expect(result.figures.portSource).toBe('vehicle');
  });

  it.each([
    { name: 'no plan', charger: { preference: 'tethered' as const }, port: 'front-left' as const, action: /Draw your driveway plan/ },
    { name: 'no port', charger: { preference: 'tethered' as const, plan: plan() }, port: null, action: /charging socket/ },
    { name: 'no bay', charger: { preference: 'tethered' as const, plan: plan({ bays: [] }) }, port: 'front-left' as const, action: /parking bay/ },
    // Saved JSON that is not a plan at all: amber, never a crash.
    { name: 'junk plan', charger: { preference: 'tethered' as const, plan: { bays: 'none' } as unknown as DrivewayPlan }, port: 'front-left' as const, action: /./ },
  ])('$name → amber with an action', ({ charger, port, action }) => {
    const result = reach(charger, 'nose-in', port);
    expect(result.light).toBe('amber');
    expect(result.actions[0]).toMatch(action);
  });

  it('explains a failed way in words', () => {
    const result = reach({ preference: 'tethered', tetherMetres: 5, plan: plan({ chargePort: 'front-left' }) }, 'varies');
    expect(result.customerText).toContain('reverse in');
    expect(result.customerText).toContain('7.1 m');
    const ways = (result.figures.verdicts as { way: ParkingWay }[]).map((v) => v.way);
    expect(ways).toEqual(['nose-in', 'reverse-in']);
  });
});

describe('two bays: the car in the other bay is an obstacle', () => {
  // Bay 1 at x 0..2.4 and bay 2 (the electric car's) at x 2.4..4.8, both 0°, y 0.5..5.3.
  // Medium cars: bay 1 footprint x 0.275..2.125, bay 2 x 2.675..4.525, both y 0.65..5.15.
  // Charge point C = (0.2, 0). The electric car noses in (nose to the wall, facing −y, so its
  // right is −x): rear-right port at x 3.6 − 0.925 = 2.675, y 2.9 + 2.25 − 0.8 = 4.35.
  const bay1: PlanBay = { x: 0, y: 0.5, width: 2.4, length: 4.8, angle: 0 };
  const bay2: PlanBay = { x: 2.4, y: 0.5, width: 2.4, length: 4.8, angle: 0, forEv: true };
  const twoBays = plan({ chargePoint: { x: 0.2, y: 0 }, bays: [bay1, bay2], chargePort: 'rear-right' });

  it('goes round the car in bay 1 when it is there', () => {
    // Empty bay 1: straight, √(2.475² + 4.35²) = √25.048125 = 5.0048 → 6.005 m with 1 m slack.
    // Car in bay 1: the straight line enters it (at y 0.65, x 0.57), so round its corner (2.125, 0.65):
    // √(1.925² + 0.65²) = 2.0318, + √(0.55² + 3.7²) = 3.7407 → 5.7724 → 6.772 m.
    const empty = reachVerdict(twoBays, 6.5, 'nose-in', { slackMetres: 1, otherBaysOccupied: false })[0]!;
    const occupied = reachVerdict(twoBays, 6.5, 'nose-in', { slackMetres: 1 })[0]!;
    expect(empty.requiredMetres).toBeCloseTo(6.005, 3);
    expect(occupied.requiredMetres).toBeCloseTo(6.772, 3);
    expect(occupied.path).toContainEqual({ x: 2.125, y: 0.65 });
    expect([empty.reaches, occupied.reaches]).toEqual([true, false]);
  });

  it('counts the other bay as occupied unless the customer has one car', () => {
    const check = (cars: number | null) =>
      checkCableReach({
        answers: { charger: { preference: 'tethered', tetherMetres: 6.5, plan: twoBays }, parking: { habit: 'nose-in', cars } },
        uploads: [],
        site: {},
        settings: defaultReadinessSettings,
        today: '2025-03-03',
      });
    expect(check(2).light).toBe('amber');
    expect(check(null).light).toBe('amber');
    expect(check(1).light).toBe('green');
    expect(check(2).figures.otherBaysOccupied).toBe(true);
  });
});
