// The top-down drawing, to scale on a metre grid: house along the top, bays, the car parked the
// chosen way, the cable from the charge point to the port. The charge point and each bay can
// be picked and moved by pointer (mouse, finger) or by the arrow keys.
import { useId, useRef, useState, type KeyboardEvent, type PointerEvent } from 'react';
import { carFootprint, type DrivewayPlan, type ReachVerdict } from '@/lib/readiness/plan';
import type { ParkingWay } from '@/lib/readiness/types';
import { formatNumber, roundTo } from '@/lib/readiness/units';
import { carShape, frameFor, HOUSE_DEPTH, rectToScreen, scaleBarMetres, svgPoints, toScreen, type Frame } from '@/lib/plan/drawing-geometry';
import { arrowStep, bayName, bayRect, moveChargePoint, nudge, updateBay, type Movable, type PlanView, type ViewRect } from '@/lib/plan/plan-view';

type Props = {
  plan: DrivewayPlan;
  view: PlanView;
  way: ParkingWay;
  /** The bays the electric car is drawn in. */
  carBays: readonly number[];
  /** Verdicts for the way shown (one per car bay), empty when the port is not known. */
  verdicts: readonly ReachVerdict[];
  selected: Movable | null;
  onSelect: (item: Movable | null) => void;
  onChange: (view: PlanView) => void;
  readOnly?: boolean;
  titleId?: string;
};

type Drag = { pointerId: number; item: Movable; start: { x: number; y: number }; origin: { x: number; y: number }; frame: Frame; moved: boolean };

const SNAP = 0.05;
const snap = (value: number) => roundTo(Math.round(value / SNAP) * SNAP, 2);

const same = (a: Movable | null, b: Movable) =>
  a !== null && a.kind === b.kind && (a.kind === 'charge-point' || (b.kind === 'bay' && a.index === b.index));

/**
 * The plan drawing. Controlled: every move is reported through `onChange` as a new view.
 *
 * @example <PlanDrawing plan={plan} view={planToView(plan)} way="nose-in" carBays={[0]} verdicts={v} selected={null} onSelect={pick} onChange={move} />
 */
export function PlanDrawing({ plan, view, way, carBays, verdicts, selected, onSelect, onChange, readOnly, titleId }: Props) {
  const ids = useId().replace(/[^a-zA-Z0-9_-]/g, '');
  const svg = useRef<SVGSVGElement>(null);
  const drag = useRef<Drag | null>(null);
  const [frozen, setFrozen] = useState<Frame | null>(null);
  const [focused, setFocused] = useState<Movable | null>(null);

  const cars = carBays.map((index) => ({ index, shape: carShape(plan, plan.bays[index]!, way) }));
  const extra: ViewRect[] = [
    ...carBays.map((index) => rectToScreen(plan, carFootprint(plan, plan.bays[index]!))),
    ...verdicts.map((v) => {
      const p = toScreen(plan, v.port);
      return { left: p.x, top: p.y, width: 0, height: 0 };
    }),
  ];
  // While dragging, the frame stays still so the drawing does not rescale under the finger.
  const frame = frozen ?? frameFor(view, extra);
  const t = Math.max(0.26, frame.width / 24);
  const maxY = frame.minY + frame.height;

  const toWorld = (event: PointerEvent) => {
    const matrix = svg.current?.getScreenCTM();
    if (!matrix) return null;
    const p = new DOMPoint(event.clientX, event.clientY).matrixTransform(matrix.inverse());
    return { x: p.x, y: p.y };
  };

  const originOf = (item: Movable) => {
    if (item.kind === 'charge-point') return { x: view.chargePoint.along, y: 0 };
    const bay = view.bays[item.index]!;
    return { x: bay.left, y: bay.gap };
  };

  const movable = (item: Movable, label: string) =>
    readOnly
      ? {}
      : {
          tabIndex: 0,
          role: 'button',
          'aria-roledescription': 'movable item',
          'aria-label': label,
          'aria-describedby': `${ids}-hint`,
          'aria-pressed': same(selected, item),
          // A finger drags only what is already picked, so a swipe across the drawing still scrolls the page.
          style: { touchAction: same(selected, item) ? 'none' : 'manipulation', cursor: drag.current ? 'grabbing' : 'grab' },
          className: 'outline-none',
          onFocus: () => {
            setFocused(item);
            onSelect(item);
          },
          onBlur: () => setFocused(null),
          onKeyDown: (event: KeyboardEvent) => {
            const step = arrowStep(event.key, event.shiftKey);
            if (!step) return;
            event.preventDefault();
            onChange(nudge(view, item, step.right, step.down));
          },
          onPointerDown: (event: PointerEvent<SVGGElement>) => {
            if (event.button !== 0) return;
            const start = toWorld(event);
            if (!start) return;
            event.currentTarget.setPointerCapture(event.pointerId);
            drag.current = { pointerId: event.pointerId, item, start, origin: originOf(item), frame, moved: false };
            setFrozen(frame);
            onSelect(item);
          },
          onPointerMove: (event: PointerEvent) => {
            const current = drag.current;
            if (!current || current.pointerId !== event.pointerId) return;
            const at = toWorld(event);
            if (!at) return;
            current.moved = true;
            const x = snap(current.origin.x + at.x - current.start.x);
            const y = snap(current.origin.y + at.y - current.start.y);
            onChange(item.kind === 'charge-point' ? moveChargePoint(view, x) : updateBay(view, item.index, { left: x, gap: y }));
          },
          onPointerUp: () => {
            drag.current = null;
            setFrozen(null);
          },
          onPointerCancel: () => {
            drag.current = null;
            setFrozen(null);
          },
        };

  const gridX = range(Math.ceil(frame.minX), Math.floor(frame.minX + frame.width));
  const gridY = range(1, Math.floor(maxY));
  const bar = scaleBarMetres(frame.width);
  const cp = view.chargePoint;

  return (
    <svg
      ref={svg}
      viewBox={`${r(frame.minX)} ${r(frame.minY)} ${r(frame.width)} ${r(frame.height)}`}
      className="block h-auto w-full select-none lg:max-h-[calc(100vh-15rem)]"
      aria-labelledby={titleId}
      data-testid="plan-drawing"
    >
      <defs>
        <pattern id={`${ids}-brick`} width="0.45" height="0.3" patternUnits="userSpaceOnUse">
          <rect width="0.45" height="0.3" className="fill-clay-100" />
          <path d="M0 0.15H0.45M0.225 0V0.15M0 0.15V0.3M0.45 0.15V0.3" className="stroke-clay-200" strokeWidth="0.025" fill="none" />
        </pattern>
      </defs>
      <desc id={`${ids}-hint`}>Use the arrow keys to move it by 10 centimetres, or hold Shift to move it by 50 centimetres.</desc>

      {/* The drive, with a line every metre. */}
      <rect x={frame.minX} y={0} width={frame.width} height={maxY} className="fill-ground-50" />
      {gridX.map((x) => (
        <line key={`gx${x}`} x1={x} y1={0} x2={x} y2={maxY} className="stroke-ground-200" strokeWidth={x === 0 ? 0.03 : 0.015} />
      ))}
      {gridY.map((y) => (
        <line key={`gy${y}`} x1={frame.minX} y1={y} x2={frame.minX + frame.width} y2={y} className="stroke-ground-200" strokeWidth="0.015" />
      ))}

      {/* The house and its wall. */}
      <rect x={0} y={-HOUSE_DEPTH} width={view.wallLength} height={HOUSE_DEPTH} fill={`url(#${ids}-brick)`} />
      <line x1={0} y1={0} x2={view.wallLength} y2={0} className="stroke-ground-900" strokeWidth="0.12" strokeLinecap="square" />
      <text x={0.15} y={-HOUSE_DEPTH + t * 1.15} fontSize={t} className="fill-clay-800 font-semibold">
        Your house
      </text>
      <Dimension from={0} to={cp.along} y={-0.42} t={t} />

      {/* Bays, with the car drawn in the ones the electric car uses. */}
      {view.bays.map((bay, index) => {
        const rect = bayRect(bay);
        const item: Movable = { kind: 'bay', index };
        const car = cars.find((c) => c.index === index);
        const name = bayName(view, index);
        const label = `${name}, ${fmt(bay.width)} by ${fmt(bay.length)} metres, ${fmt(bay.left)} metres from the left corner and ${fmt(bay.gap)} metres out from the wall`;
        const isSelected = same(selected, item);
        const isFocused = focused !== null && same(focused, item);
        return (
          <g key={`bay${index}`} {...movable(item, label)} data-testid={`plan-bay-${index + 1}`}>
            <rect
              x={rect.left}
              y={rect.top}
              width={rect.width}
              height={rect.height}
              className={bay.kind === 'garage' ? 'fill-ground-100 stroke-ground-400' : 'fill-white stroke-ground-400'}
              strokeWidth="0.04"
              strokeDasharray={bay.kind === 'garage' ? undefined : '0.25 0.15'}
            />
            {bay.kind === 'garage' && <GarageWalls rect={rect} along={bay.along} from={bay.from} />}
            {car && <Car shape={car.shape} />}
            <BayTag rect={rect} name={name} t={t} />
            {(isSelected || isFocused) && (
              <rect
                x={rect.left - 0.12}
                y={rect.top - 0.12}
                width={rect.width + 0.24}
                height={rect.height + 0.24}
                rx="0.12"
                fill="none"
                className="stroke-clay-500"
                strokeWidth={isFocused ? 0.09 : 0.05}
                strokeDasharray={isFocused ? undefined : '0.2 0.12'}
              />
            )}
          </g>
        );
      })}

      {/* The cable, solid where it reaches and dashed where it falls short, and the port. */}
      {verdicts.map((v) => {
        const points = v.path.map((p) => toScreen(plan, p));
        const port = toScreen(plan, v.port);
        return (
          <g key={`cable${v.bayIndex}`} pointerEvents="none" data-testid="plan-cable">
            <polyline points={svgPoints(points)} fill="none" className="stroke-white" strokeWidth="0.16" strokeLinejoin="round" strokeLinecap="round" />
            <polyline
              points={svgPoints(points)}
              fill="none"
              className={v.reaches ? 'stroke-clear' : 'stroke-attention'}
              strokeWidth="0.08"
              strokeLinejoin="round"
              strokeLinecap="round"
              strokeDasharray={v.reaches ? undefined : '0.22 0.14'}
            />
            <circle cx={port.x} cy={port.y} r="0.17" className="fill-ink stroke-white" strokeWidth="0.06" />
          </g>
        );
      })}

      {/* The charge point, on the wall. */}
      <g
        {...movable({ kind: 'charge-point' }, `Charge point, ${fmt(cp.along)} metres from the left corner of the wall`)}
        data-testid="plan-charge-point"
      >
        <rect x={cp.along - 0.45} y={cp.out - 0.4} width="0.9" height="0.8" fill="transparent" />
        {(same(selected, { kind: 'charge-point' }) || (focused !== null && same(focused, { kind: 'charge-point' }))) && (
          <circle
            cx={cp.along}
            cy={cp.out}
            r="0.42"
            fill="none"
            className="stroke-clay-500"
            strokeWidth={focused?.kind === 'charge-point' ? 0.09 : 0.05}
            strokeDasharray={focused?.kind === 'charge-point' ? undefined : '0.2 0.12'}
          />
        )}
        <rect x={cp.along - 0.22} y={cp.out - 0.14} width="0.44" height="0.34" rx="0.06" className="fill-clay-500 stroke-clay-800" strokeWidth="0.04" />
        <path
          d={`M${r(cp.along + 0.03)} ${r(cp.out - 0.09)} L${r(cp.along - 0.08)} ${r(cp.out + 0.04)} H${r(cp.along + 0.02)} L${r(cp.along - 0.03)} ${r(cp.out + 0.16)} L${r(cp.along + 0.09)} ${r(cp.out + 0.01)} H${r(cp.along - 0.01)} Z`}
          className="fill-white"
        />
      </g>

      <ScaleBar x={frame.minX + 0.4} y={maxY - 0.55} metres={bar} t={t} />
      <text x={frame.minX + frame.width - 0.3} y={maxY - 0.4} fontSize={t * 0.9} textAnchor="end" className="fill-ground-700">
        Street side
      </text>
    </svg>
  );
}

function Dimension({ from, to, y, t }: { from: number; to: number; y: number; t: number }) {
  const wide = to - from > t * 3.2;
  return (
    <g pointerEvents="none" aria-hidden="true">
      <line x1={from} y1={y} x2={to} y2={y} className="stroke-ground-900" strokeWidth="0.03" />
      <line x1={from} y1={y - 0.12} x2={from} y2={y + 0.12} className="stroke-ground-900" strokeWidth="0.03" />
      <line x1={to} y1={y - 0.12} x2={to} y2={y + 0.12} className="stroke-ground-900" strokeWidth="0.03" />
      <text
        x={wide ? (from + to) / 2 : to + 0.15}
        y={y - 0.1}
        fontSize={t * 0.9}
        textAnchor={wide ? 'middle' : 'start'}
        className="fill-ground-900 font-semibold"
        data-testid="plan-charge-point-dimension"
      >
        {`${fmt(to - from)} m`}
      </text>
    </g>
  );
}

function Car({ shape }: { shape: ReturnType<typeof carShape> }) {
  const { body, windscreen, rearWindow, wheels } = shape;
  return (
    <g pointerEvents="none">
      {wheels.map((w, i) => (
        <rect key={i} x={w.left} y={w.top} width={w.width} height={w.height} rx="0.05" className="fill-ground-900" />
      ))}
      <rect x={body.left} y={body.top} width={body.width} height={body.height} rx="0.4" className="fill-ground-300 stroke-ground-700" strokeWidth="0.05" />
      <rect x={windscreen.left} y={windscreen.top} width={windscreen.width} height={windscreen.height} rx="0.12" className="fill-ground-700" />
      <rect x={rearWindow.left} y={rearWindow.top} width={rearWindow.width} height={rearWindow.height} rx="0.08" className="fill-ground-600" />
    </g>
  );
}

function BayTag({ rect, name, t }: { rect: ViewRect; name: string; t: number }) {
  const width = t * (name.length * 0.52 + 0.8);
  const x = rect.left + rect.width / 2;
  const y = rect.top + rect.height / 2;
  return (
    <g pointerEvents="none">
      <rect x={x - width / 2} y={y - t * 0.75} width={width} height={t * 1.5} rx={t * 0.3} className="fill-white stroke-ground-700" strokeWidth="0.03" />
      <text x={x} y={y + t * 0.33} fontSize={t} textAnchor="middle" className="fill-ground-900 font-semibold">
        {name}
      </text>
    </g>
  );
}

function GarageWalls({ rect, along, from }: { rect: ViewRect; along: boolean; from: 'left' | 'right' }) {
  const { left, top, width, height } = rect;
  const right = left + width;
  const bottom = top + height;
  // The door is the end the car drives in by: the far end, or the entry side for a bay along the wall.
  const walls = along
    ? [
        [left, top, right, top],
        [left, bottom, right, bottom],
        from === 'left' ? [right, top, right, bottom] : [left, top, left, bottom],
      ]
    : [
        [left, top, right, top],
        [left, top, left, bottom],
        [right, top, right, bottom],
      ];
  return (
    <g pointerEvents="none">
      {walls.map(([x1, y1, x2, y2], i) => (
        <line key={i} x1={x1} y1={y1} x2={x2} y2={y2} className="stroke-ground-800" strokeWidth="0.14" strokeLinecap="square" />
      ))}
    </g>
  );
}

function ScaleBar({ x, y, metres, t }: { x: number; y: number; metres: number; t: number }) {
  const h = 0.14;
  return (
    <g pointerEvents="none" data-testid="plan-scale-bar">
      {range(0, metres - 1).map((i) => (
        <rect key={i} x={x + i} y={y} width="1" height={h} className={i % 2 === 0 ? 'fill-ground-900' : 'fill-white'} />
      ))}
      <rect x={x} y={y} width={metres} height={h} fill="none" className="stroke-ground-900" strokeWidth="0.025" />
      <text x={x} y={y - 0.1} fontSize={t * 0.8} textAnchor="middle" className="fill-ground-900">
        0
      </text>
      <text x={x + metres} y={y - 0.1} fontSize={t * 0.8} textAnchor="middle" className="fill-ground-900">
        {`${metres} m`}
      </text>
    </g>
  );
}

function range(from: number, to: number): number[] {
  const out: number[] = [];
  for (let i = from; i <= to; i += 1) out.push(i);
  return out;
}

const r = (value: number) => Math.round(value * 1000) / 1000;
const fmt = (value: number) => formatNumber(value, 2);
