// The driveway plan: a to-scale drawing the customer adjusts with buttons, number boxes, the
// arrow keys or a finger, and, live, whether the charging cable reaches the car's port for
// each way of parking. Controlled and pure client: saving is the caller's job.
import { useId, useMemo, useState } from 'react';
import { InfoIcon } from '@/components/icons';
import { cableForReach } from '@/lib/readiness/checks/cable-reach';
import { otherBaysOccupied, reachVerdict, type DrivewayPlan as PlanValue } from '@/lib/readiness/plan';
import { defaultReadinessSettings, type ReadinessSettings } from '@/lib/readiness/settings';
import type { ChargePort, ChargerPreference, ParkingHabit, ParkingWay } from '@/lib/readiness/types';
import { PlanControls } from './plan-controls';
import { PlanDrawing } from './plan-drawing';
import { bayName, defaultPlan, planToView, viewToPlan, type Movable, type PlanView } from '@/lib/plan/plan-view';
import { wayLabels } from '@/lib/vocabulary/plan';
import { ReachSummary } from './reach-summary';

/** The settings the plan measures with; the rest of the readiness settings do not matter here. */
export type PlanSettings = Pick<ReadinessSettings, 'cableSlackMetres' | 'portInsetMetres' | 'defaultTetherMetres' | 'defaultCustomerCableMetres'>;

export type DrivewayPlanProps = {
  /** The saved plan; null draws the starting plan until the customer changes something. */
  value: PlanValue | null;
  /** Every change, as a whole plan that passes drivewayPlanSchema. */
  onChange: (plan: PlanValue) => void;
  /** The vehicle step's answer, used until a port is picked on the plan. */
  chargePort?: ChargePort | null;
  tetherMetres?: number | null;
  preference?: ChargerPreference | null;
  habit?: ParkingHabit | null;
  /** How many cars the household parks (the parking step's answer): one car leaves the other bays empty. */
  cars?: number | null;
  /** The office's readiness settings; defaults when not given. */
  settings?: Partial<PlanSettings>;
  readOnly?: boolean;
  /** 'split' puts the drawing beside the controls on wide screens; 'stacked' keeps one column (for a narrow step). */
  layout?: 'split' | 'stacked';
};

/**
 * The driveway plan island body.
 *
 * @example <DrivewayPlan value={plan} onChange={setPlan} chargePort="front-left" preference="tethered" tetherMetres={5} habit="varies" />
 */
export function DrivewayPlan({ value, onChange, chargePort = null, tetherMetres = null, preference = null, habit = null, cars = null, settings, readOnly, layout = 'split' }: DrivewayPlanProps) {
  const titleId = useId();
  const starting = useMemo(defaultPlan, []);
  const plan = value ?? starting;
  const view = planToView(plan);
  const [way, setWay] = useState<ParkingWay>(habit === 'reverse-in' ? 'reverse-in' : 'nose-in');
  const [selected, setSelected] = useState<Movable | null>(null);

  const measured = { ...defaultReadinessSettings, ...settings };
  const cable = cableForReach({ preference, tetherMetres }, measured);
  const port = plan.chargePort ?? chargePort ?? null;
  const verdicts = port
    ? reachVerdict(plan, cable.metres, 'varies', {
        port,
        slackMetres: measured.cableSlackMetres,
        portInsetMetres: measured.portInsetMetres,
        otherBaysOccupied: otherBaysOccupied(cars),
      })
    : [];
  const carBays = carBaysOf(view);
  const change = (next: PlanView) => onChange(viewToPlan(next));
  const split = layout === 'split';

  return (
    <div className={`grid gap-4 ${split ? 'lg:grid-cols-[minmax(0,1.1fr)_minmax(0,1fr)] lg:items-start' : ''}`} data-testid="driveway-plan">
      <figure className={`card grid gap-3 p-3 sm:p-4 ${split ? 'lg:sticky lg:top-16' : ''}`}>
        <div className="flex flex-wrap items-end justify-between gap-x-4 gap-y-2">
          <div>
            <h3 id={titleId} className="text-lg font-bold text-ground-900">
              Your parking, from above
            </h3>
            <p className="text-sm text-ground-700">To scale: each square is 1 metre. The house is at the top, as you see it from the street.</p>
          </div>
          <WayToggle way={way} onChange={setWay} />
        </div>
        <div className="overflow-hidden rounded-md border border-ground-200">
          <PlanDrawing
            plan={plan}
            view={view}
            way={way}
            carBays={carBays}
            verdicts={verdicts.filter((v) => v.way === way)}
            selected={selected}
            onSelect={setSelected}
            onChange={change}
            readOnly={readOnly}
            titleId={titleId}
          />
        </div>
        <figcaption className="grid gap-2 text-sm text-ground-800">
          <Legend />
          {!readOnly && (
            <p>
              Tap the charge point or a parking space to pick it, then drag it or use the arrow keys (Shift for bigger steps). Every figure
              can also be set with the buttons below.
            </p>
          )}
        </figcaption>
      </figure>

      <div className="grid gap-4">
        <ReachSummary
          verdicts={verdicts}
          cable={cable}
          habit={habit}
          slackMetres={measured.cableSlackMetres}
          bayNames={view.bays.map((_, i) => bayName(view, i))}
          portKnown={port !== null}
        />
        <p className="flex gap-2 rounded-md border border-ground-200 bg-white p-3 text-sm text-ground-800" data-testid="plan-caution">
          <InfoIcon className="mt-0.5 h-5 w-5 text-ground-700" />
          <span>
            This plan helps your surveyor prepare. The electrician decides where the charge point and its cable finally go, under BS 7671
            and local rules.
          </span>
        </p>
        <PlanControls
          view={view}
          onChange={change}
          port={port}
          portFromVehicle={!plan.chargePort && chargePort !== null}
          selected={selected}
          onSelect={setSelected}
          readOnly={readOnly}
        />
      </div>
    </div>
  );
}

// The bays the electric car uses: the one marked, or every bay (as reachVerdict measures).
function carBaysOf(view: PlanView): number[] {
  const marked = view.bays.findIndex((bay) => bay.forEv === true);
  return marked === -1 ? view.bays.map((_, i) => i) : [marked];
}

function WayToggle({ way, onChange }: { way: ParkingWay; onChange: (way: ParkingWay) => void }) {
  const name = useId();
  return (
    <fieldset className="flex items-center gap-2" data-testid="plan-way-toggle">
      <legend className="sr-only">Show the car parked</legend>
      <span className="text-sm font-semibold text-ground-800" aria-hidden="true">
        Show:
      </span>
      <div className="inline-flex rounded-md border border-ground-300 bg-white p-0.5">
        {(['nose-in', 'reverse-in'] as const).map((option) => (
          <label
            key={option}
            className="relative flex min-h-[40px] cursor-pointer items-center rounded px-3 text-sm font-semibold text-ground-800 has-[:checked]:bg-ground-700 has-[:checked]:text-white has-[:focus-visible]:outline has-[:focus-visible]:outline-[3px] has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-clay-500"
          >
            <input type="radio" name={name} value={option} checked={way === option} onChange={() => onChange(option)} className="sr-only" />
            {wayLabels[option]}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

function Legend() {
  return (
    <ul className="flex flex-wrap gap-x-4 gap-y-1" aria-label="Key">
      <li className="flex items-center gap-1.5">
        <svg viewBox="0 0 20 16" className="h-4 w-5" aria-hidden="true">
          <rect x="3" y="2" width="14" height="12" rx="2" className="fill-clay-500 stroke-clay-800" strokeWidth="1.5" />
        </svg>
        Charge point
      </li>
      <li className="flex items-center gap-1.5">
        <svg viewBox="0 0 16 16" className="h-4 w-4" aria-hidden="true">
          <circle cx="8" cy="8" r="5.5" className="fill-ink stroke-white" strokeWidth="2" />
        </svg>
        Charging socket on the car
      </li>
      <li className="flex items-center gap-1.5">
        <svg viewBox="0 0 28 8" className="h-2 w-7" aria-hidden="true">
          <line x1="1" y1="4" x2="27" y2="4" className="stroke-clear" strokeWidth="3" strokeLinecap="round" />
        </svg>
        Cable reaches
      </li>
      <li className="flex items-center gap-1.5">
        <svg viewBox="0 0 28 8" className="h-2 w-7" aria-hidden="true">
          <line x1="1" y1="4" x2="27" y2="4" className="stroke-attention" strokeWidth="3" strokeDasharray="5 3" />
        </svg>
        Cable too short
      </li>
    </ul>
  );
}
