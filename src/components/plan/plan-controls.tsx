// The plan's controls: every figure on the drawing can be set here with big buttons and number
// boxes, so nobody has to drag anything (or draw at all).
import type { ReactNode } from 'react';
import { carSize, carSizeDefaults } from '@/lib/readiness/plan';
import type { ChargePort } from '@/lib/readiness/types';
import { formatNumber } from '@/lib/readiness/units';
import { ChoiceGroup } from './choice-group';
import { MetreStepper } from './metre-stepper';
import { BinIcon, PlusIcon } from '@/components/icons';
import {
  addBay,
  bayName,
  bayLeftRange,
  evBayIndex,
  limits,
  moveChargePoint,
  removeBay,
  setCarSize,
  setEvBay,
  setSizeClass,
  setWallLength,
  updateBay,
  type BayKind,
  type Movable,
  type PlanView,
  type ViewBay,
} from '@/lib/plan/plan-view';
import { optionHint, optionWords } from '@/lib/vocabulary/fields';
import { sizeClassLabels } from '@/lib/vocabulary/plan';
import { PortPicker } from './port-picker';

type Props = {
  view: PlanView;
  onChange: (view: PlanView) => void;
  /** The port in use: the plan's own, else the vehicle step's. */
  port: ChargePort | null;
  portFromVehicle: boolean;
  selected: Movable | null;
  onSelect: (item: Movable | null) => void;
  readOnly?: boolean;
};

function Section({ title, children, active, onFocus, testId }: { title: string; children: ReactNode; active?: boolean; onFocus?: () => void; testId?: string }) {
  return (
    <section
      className={`card grid gap-4 p-4 transition-shadow sm:p-5 ${active ? 'ring-2 ring-clay-400' : ''}`}
      onFocusCapture={onFocus}
      aria-label={title}
      data-testid={testId}
    >
      <h3 className="text-lg font-bold text-ground-900">{title}</h3>
      {children}
    </section>
  );
}

const m = (value: number) => formatNumber(value, 2);

/**
 * All the controls, in the order a customer would measure: charge point, car, bays, wall.
 *
 * @example <PlanControls view={view} onChange={change} port="front-left" portFromVehicle selected={null} onSelect={pick} />
 */
export function PlanControls({ view, onChange, port, portFromVehicle, selected, onSelect, readOnly }: Props) {
  const size = carSize(view.car);
  const chosenClass = view.car.sizeClass === 'custom' ? null : view.car.sizeClass;
  const isSelected = (item: Movable) =>
    selected?.kind === item.kind && (item.kind === 'charge-point' || (selected.kind === 'bay' && selected.index === item.index));

  return (
    <div className="grid gap-4">
      <Section title="Charge point" active={isSelected({ kind: 'charge-point' })} onFocus={() => onSelect({ kind: 'charge-point' })} testId="plan-section-charge-point">
        <MetreStepper
          label="From the left corner of the wall"
          help="Where on the wall you would like it, as you face the house from the street."
          value={view.chargePoint.along}
          min={0}
          max={view.wallLength}
          onChange={(along) => onChange(moveChargePoint(view, along))}
          lessLabel="Move the charge point left by 10 cm"
          moreLabel="Move the charge point right by 10 cm"
          disabled={readOnly}
        />
      </Section>

      <Section title="Your car" testId="plan-section-car">
        <PortPicker value={port} fromVehicle={portFromVehicle} onChange={(chargePort) => onChange({ ...view, chargePort })} disabled={readOnly} />
        <ChoiceGroup
          legend="Size"
          columns="grid-cols-1 sm:grid-cols-3"
          options={(['small', 'medium', 'large'] as const).map((value) => ({
            value,
            label: sizeClassLabels[value],
            hint: `${m(carSizeDefaults[value].lengthM)}\u00a0×\u00a0${m(carSizeDefaults[value].widthM)}\u00a0m`,
          }))}
          value={chosenClass}
          onChange={(sizeClass) => onChange(setSizeClass(view, sizeClass))}
          disabled={readOnly}
          testId="plan-car-size"
        />
        <div className="grid gap-4 sm:grid-cols-2">
          <MetreStepper
            label="Length, bumper to bumper"
            value={size.lengthM}
            min={limits.carLength.min}
            max={limits.carLength.max}
            onChange={(lengthM) => onChange(setCarSize(view, { lengthM }))}
            lessLabel="Make the car shorter by 10 cm"
            moreLabel="Make the car longer by 10 cm"
            disabled={readOnly}
          />
          <MetreStepper
            label="Width, mirrors folded"
            value={size.widthM}
            min={limits.carWidth.min}
            max={limits.carWidth.max}
            onChange={(widthM) => onChange(setCarSize(view, { widthM }))}
            lessLabel="Make the car narrower by 10 cm"
            moreLabel="Make the car wider by 10 cm"
            disabled={readOnly}
          />
        </div>
        <p className="field-help -mt-2">Typical sizes to start from; if you know your car’s, type them in (the handbook or the maker’s website lists them).</p>
      </Section>

      {view.bays.map((bay, index) => (
        <BayControls
          key={index}
          view={view}
          bay={bay}
          index={index}
          onChange={onChange}
          active={isSelected({ kind: 'bay', index })}
          onSelect={() => onSelect({ kind: 'bay', index })}
          readOnly={readOnly}
        />
      ))}

      {view.bays.length < 2 ? (
        <Section title="Another parking space?" testId="plan-section-add-bay">
          <p className="-mt-2 text-ground-800">If there is room for a second car, add it so we can see which space the electric car will use.</p>
          <div className="grid gap-2 sm:grid-cols-2">
            <button type="button" className="btn-secondary" onClick={() => onChange(addBay(view, 'beside'))} disabled={readOnly}>
              <PlusIcon /> Add one beside it
            </button>
            <button type="button" className="btn-secondary" onClick={() => onChange(addBay(view, 'behind'))} disabled={readOnly}>
              <PlusIcon /> Add one behind it
            </button>
          </div>
        </Section>
      ) : (
        <Section title="Which space does the electric car use?" testId="plan-section-ev-bay">
          <ChoiceGroup
            legend={<span className="sr-only">The electric car parks in</span>}
            columns="grid-cols-1 sm:grid-cols-3"
            options={[
              ...view.bays.map((_, i) => ({ value: String(i), label: bayName(view, i) })),
              { value: 'either', label: 'Either', hint: 'we check both' },
            ]}
            value={evBayIndex(view) === null ? 'either' : String(evBayIndex(view))}
            onChange={(choice) => onChange(setEvBay(view, choice === 'either' ? null : Number(choice)))}
            disabled={readOnly}
          />
        </Section>
      )}

      <Section title="House wall" testId="plan-section-wall">
        <MetreStepper
          label="Length of the wall by your parking"
          help="A rough measure is fine. A brick and its mortar joint are about 22.5 cm long, so 9 bricks make about 2 m."
          value={view.wallLength}
          min={limits.wallLength.min}
          max={limits.wallLength.max}
          onChange={(length) => onChange(setWallLength(view, length))}
          lessLabel="Make the wall shorter by 10 cm"
          moreLabel="Make the wall longer by 10 cm"
          disabled={readOnly}
        />
      </Section>
    </div>
  );
}

type BayProps = {
  view: PlanView;
  bay: ViewBay;
  index: number;
  onChange: (view: PlanView) => void;
  active: boolean;
  onSelect: () => void;
  readOnly?: boolean;
};

function BayControls({ view, bay, index, onChange, active, onSelect, readOnly }: BayProps) {
  const name = bayName(view, index);
  const set = (change: Partial<ViewBay>) => onChange(updateBay(view, index, change));
  const leftRange = bayLeftRange(view, bay);
  const lower = view.bays.length > 1 ? name.toLowerCase() : `the ${name.toLowerCase()}`;
  return (
    <Section title={view.bays.length > 1 ? name : bay.kind === 'garage' ? 'Garage' : 'Parking space'} active={active} onFocus={onSelect} testId={`plan-section-bay-${index + 1}`}>
      <ChoiceGroup<BayKind>
        legend="What kind of space is it?"
        options={[
          { value: 'driveway', label: optionWords('charger.plan.bays.kind', 'driveway', 'customer')! },
          { value: 'garage', label: optionWords('charger.plan.bays.kind', 'garage', 'customer')! },
        ]}
        value={bay.kind}
        onChange={(kind) => set({ kind })}
        disabled={readOnly}
      />
      <ChoiceGroup<'facing' | 'along'>
        legend="How does the car sit?"
        options={[
          { value: 'facing', label: optionWords('charger.plan.bays.angle', 0, 'customer')!, hint: optionHint('charger.plan.bays.angle', 0) },
          { value: 'along', label: optionWords('charger.plan.bays.angle', 90, 'customer')!, hint: optionHint('charger.plan.bays.angle', 90) },
        ]}
        value={bay.along ? 'along' : 'facing'}
        onChange={(choice) => set({ along: choice === 'along' })}
        disabled={readOnly}
      />
      {bay.along && (
        <ChoiceGroup<'left' | 'right'>
          legend="Which end do you drive in at?"
          help="As you face the house from the street."
          options={[
            // The street view's left end is the saved plan's 'right' entry (src/lib/plan/plan-view.ts).
            { value: 'left', label: optionWords('charger.plan.bays.entry', 'right', 'customer')! },
            { value: 'right', label: optionWords('charger.plan.bays.entry', 'left', 'customer')! },
          ]}
          value={bay.from}
          onChange={(from) => set({ from })}
          disabled={readOnly}
        />
      )}
      <div className="grid gap-4 sm:grid-cols-2">
        <MetreStepper
          label="Left edge, from the left corner"
          help="Below 0 if it starts left of the wall."
          value={bay.left}
          min={leftRange.min}
          max={leftRange.max}
          onChange={(left) => set({ left })}
          lessLabel={`Move ${lower} left by 10 cm`}
          moreLabel={`Move ${lower} right by 10 cm`}
          disabled={readOnly}
        />
        <MetreStepper
          label="Gap between it and the wall"
          value={bay.gap}
          min={limits.bayGap.min}
          max={limits.bayGap.max}
          onChange={(gap) => set({ gap })}
          lessLabel={`Move ${lower} closer to the wall by 10 cm`}
          moreLabel={`Move ${lower} away from the wall by 10 cm`}
          disabled={readOnly}
        />
        <MetreStepper
          label={bay.along ? 'Depth, out from the wall' : 'Width'}
          value={bay.width}
          min={limits.bayWidth.min}
          max={limits.bayWidth.max}
          onChange={(width) => set({ width })}
          lessLabel={`Make ${lower} narrower by 10 cm`}
          moreLabel={`Make ${lower} wider by 10 cm`}
          disabled={readOnly}
        />
        <MetreStepper
          label={bay.along ? 'Length, along the wall' : 'Length, out from the wall'}
          value={bay.length}
          min={limits.bayLength.min}
          max={limits.bayLength.max}
          onChange={(length) => set({ length })}
          lessLabel={`Make ${lower} shorter by 10 cm`}
          moreLabel={`Make ${lower} longer by 10 cm`}
          disabled={readOnly}
        />
      </div>
      {view.bays.length > 1 && (
        <button type="button" className="btn-secondary justify-self-start" onClick={() => onChange(removeBay(view, index))} disabled={readOnly}>
          <BinIcon /> Remove {name.toLowerCase()}
        </button>
      )}
    </Section>
  );
}
