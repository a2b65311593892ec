// Where the charge port is on the car: seven choices set round a small car seen from above,
// nose up, so the driver's left is on the left of the screen.
import { useId } from 'react';
import { chargePortValues } from '@/lib/readiness/plan';
import type { ChargePort } from '@/lib/readiness/types';
import { portLabels } from '@/lib/vocabulary/plan';

type Props = {
  value: ChargePort | null;
  /** True when the value comes from the vehicle step rather than from the plan. */
  fromVehicle: boolean;
  onChange: (port: ChargePort) => void;
  disabled?: boolean;
};

// Grid cells round the car (column, row), with the car in the middle column, rows 2 to 4.
const cells: Record<ChargePort, string> = {
  'front-centre': 'col-span-3 row-start-1 justify-self-center',
  'front-left': 'col-start-1 row-start-2',
  'front-right': 'col-start-3 row-start-2',
  'side-left': 'col-start-1 row-start-3',
  'side-right': 'col-start-3 row-start-3',
  'rear-left': 'col-start-1 row-start-4',
  'rear-right': 'col-start-3 row-start-4',
};

// The port's spot on the little car (viewBox 0 0 60 110).
const spots: Record<ChargePort, { x: number; y: number }> = {
  'front-centre': { x: 30, y: 6 },
  'front-left': { x: 7, y: 27 },
  'front-right': { x: 53, y: 27 },
  'side-left': { x: 6, y: 55 },
  'side-right': { x: 54, y: 55 },
  'rear-left': { x: 7, y: 86 },
  'rear-right': { x: 53, y: 86 },
};

/**
 * The charge-port picker.
 *
 * @example <PortPicker value="front-left" fromVehicle onChange={setPort} />
 */
export function PortPicker({ value, fromVehicle, onChange, disabled }: Props) {
  const name = useId();
  const helpId = `${name}-help`;
  return (
    <fieldset disabled={disabled} aria-describedby={helpId} data-testid="plan-port-picker">
      <legend className="field-label">Where is the charging socket on the car?</legend>
      <p id={helpId} className="field-help -mt-0.5 mb-2">
        Seen from above with the nose at the top; left and right as you sit in the driver’s seat.
        {fromVehicle && value ? ' We’ve started from your answer in the vehicle step.' : ''}
      </p>
      <div className="grid grid-cols-[minmax(0,1fr)_auto_minmax(0,1fr)] grid-rows-[auto_repeat(3,minmax(48px,auto))] items-center gap-x-2 gap-y-2">
        {chargePortValues.map((port) => (
          <label
            key={port}
            className={`${cells[port]} flex min-h-[44px] cursor-pointer items-center gap-2 rounded-md border border-ground-300 bg-white px-2 py-1.5 text-sm font-semibold leading-tight text-ground-900 hover:bg-ground-50 has-[:checked]:border-ground-700 has-[:checked]:bg-ground-50 has-[:checked]:ring-1 has-[:checked]:ring-ground-700`}
          >
            <input
              type="radio"
              name={name}
              value={port}
              checked={value === port}
              onChange={() => onChange(port)}
              className="h-5 w-5 shrink-0 accent-ground-700"
            />
            <span>{portLabels[port]}</span>
          </label>
        ))}
        <svg viewBox="0 0 60 110" className="col-start-2 row-span-3 row-start-2 h-32 w-16" aria-hidden="true" focusable="false">
          <rect x="8" y="4" width="44" height="102" rx="14" className="fill-ground-200 stroke-ground-700" strokeWidth="2" />
          <rect x="13" y="28" width="34" height="16" rx="4" className="fill-ground-700" />
          <rect x="14" y="82" width="32" height="10" rx="3" className="fill-ground-600" />
          <text x="30" y="20" textAnchor="middle" fontSize="8" className="fill-ground-800 font-semibold">
            Front
          </text>
          {value && <circle cx={spots[value].x} cy={spots[value].y} r="5.5" className="fill-clay-500 stroke-white" strokeWidth="2" />}
        </svg>
      </div>
    </fieldset>
  );
}
