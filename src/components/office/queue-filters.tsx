// The queue's filter bar: search, readiness, stage, surveyor, "car due within" and flagged photos.
import { countOf } from '@/lib/grammar';
import { useEffect, useRef, type ReactNode } from 'react';
import { lights } from '@/lib/schemas/queue';
import { stageLabels, stages, type StageId } from '@/lib/stages';
import { CameraIcon, ChevronDownIcon } from '@/components/icons';
import { LightIcon } from '@/components/readiness/light-badge';
import { staffLightWords as lightWords } from '@/lib/readiness/lights';
import { toggle, type Light, type QueueView } from './queue-state';

export type Surveyor = { id: string; name: string | null; email: string };

type Props = {
  view: QueueView;
  searchText: string;
  onSearchText(text: string): void;
  onChange(next: Partial<QueueView>): void;
  surveyors: Surveyor[];
};

// Worst first, as the queue is read: what blocks the job, then what needs attention.
const lightOrder: Light[] = ['red', 'amber', 'green'];
const lightChip: Record<Light, string> = {
  red: 'peer-checked:border-blocked peer-checked:bg-blocked-soft peer-checked:text-blocked',
  amber: 'peer-checked:border-attention peer-checked:bg-attention-soft peer-checked:text-attention',
  green: 'peer-checked:border-clear peer-checked:bg-clear-soft peer-checked:text-clear',
};
export const deliveryChoices = [7, 14, 30, 60, 90] as const;

/** A small drop-down of checkboxes; closes on Escape or a click elsewhere. */
function MultiPicker({ label, summary, children, testId }: { label: string; summary: string; children: ReactNode; testId?: string }) {
  const ref = useRef<HTMLDetailsElement>(null);
  useEffect(() => {
    const close = (e: MouseEvent | KeyboardEvent) => {
      const el = ref.current;
      if (!el?.open) return;
      if (e instanceof KeyboardEvent ? e.key === 'Escape' : !el.contains(e.target as Node)) el.open = false;
    };
    document.addEventListener('mousedown', close);
    document.addEventListener('keydown', close);
    return () => {
      document.removeEventListener('mousedown', close);
      document.removeEventListener('keydown', close);
    };
  }, []);
  return (
    <div>
      <span className="mb-1 block text-sm font-semibold text-ground-900" id={`${label}-label`}>{label}</span>
      <details ref={ref} className="relative" data-testid={testId}>
        <summary
          className="flex min-h-[40px] cursor-pointer list-none items-center justify-between gap-2 rounded-md border border-ground-300 bg-white px-3 py-1.5 text-sm [&::-webkit-details-marker]:hidden"
          aria-labelledby={`${label}-label`}
          aria-describedby={`${label}-summary`}
        >
          <span id={`${label}-summary`} className="truncate">{summary}</span>
          <ChevronDownIcon className="h-4 w-4 text-ground-600" />
        </summary>
        <div className="absolute left-0 z-20 mt-1 w-64 rounded-md border border-ground-200 bg-white p-2 shadow-lg">{children}</div>
      </details>
    </div>
  );
}

export function QueueFilters({ view, searchText, onSearchText, onChange, surveyors }: Props) {
  const stageSummary = view.stage.length === 0 ? 'Any stage' : view.stage.length === 1 ? stageLabels[view.stage[0]!] : countOf(view.stage.length, 'stage');
  return (
    <div className="grid grid-cols-2 gap-3 rounded-lg border border-ground-100 bg-white p-3 shadow-sm md:grid-cols-[minmax(14rem,2fr)_auto_minmax(9rem,1fr)_minmax(9rem,1fr)_minmax(9rem,1fr)_auto] md:items-end">
      <div className="col-span-2 md:col-span-1">
        <label htmlFor="queue-search" className="mb-1 block text-sm font-semibold text-ground-900">Search</label>
        <input
          id="queue-search"
          type="search"
          className="field-input min-h-[40px] py-1.5 text-sm"
          placeholder="Name, e-mail, postcode, reference or MPAN"
          value={searchText}
          onChange={(e) => onSearchText(e.target.value)}
        />
      </div>
      <fieldset className="col-span-2 md:col-span-1">
        <legend className="mb-1 block text-sm font-semibold text-ground-900">Readiness</legend>
        <div className="flex flex-wrap gap-1.5">
          {lightOrder.filter((l) => lights.includes(l)).map((light) => (
            <label key={light} className="cursor-pointer">
              <input
                type="checkbox"
                className="peer sr-only"
                checked={view.light.includes(light)}
                onChange={() => onChange({ light: toggle(view.light, light), page: 1 })}
              />
              <span
                className={`inline-flex min-h-[40px] items-center gap-1.5 rounded-md border border-ground-300 bg-white px-2.5 text-sm font-semibold text-ground-800 peer-focus-visible:outline peer-focus-visible:outline-[3px] peer-focus-visible:outline-offset-2 peer-focus-visible:outline-clay-500 ${lightChip[light]}`}
              >
                <LightIcon light={light} />
                {lightWords[light]}
              </span>
            </label>
          ))}
        </div>
      </fieldset>
      <MultiPicker label="Stage" summary={stageSummary} testId="stage-picker">
        <fieldset>
          <legend className="sr-only">Stages to show</legend>
          {stages.map((s: StageId) => (
            <label key={s} className="flex min-h-[36px] cursor-pointer items-center gap-2 rounded px-2 text-sm hover:bg-ground-50">
              <input type="checkbox" className="h-4 w-4 accent-ground-700" checked={view.stage.includes(s)} onChange={() => onChange({ stage: toggle(view.stage, s), page: 1 })} />
              {stageLabels[s]}
            </label>
          ))}
        </fieldset>
      </MultiPicker>
      <div>
        <label htmlFor="queue-surveyor" className="mb-1 block text-sm font-semibold text-ground-900">Surveyor</label>
        <select
          id="queue-surveyor"
          className="field-input min-h-[40px] py-1.5 text-sm"
          value={view.surveyor}
          onChange={(e) => onChange({ surveyor: e.target.value, page: 1 })}
        >
          <option value="">Anyone</option>
          <option value="none">Not assigned</option>
          {surveyors.map((s) => (
            <option key={s.id} value={s.id}>{s.name ?? s.email}</option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor="queue-delivery" className="mb-1 block text-sm font-semibold text-ground-900">Car due</label>
        <select
          id="queue-delivery"
          className="field-input min-h-[40px] py-1.5 text-sm"
          value={view.deliveryWithin ?? ''}
          onChange={(e) => onChange({ deliveryWithin: e.target.value === '' ? null : Number(e.target.value), page: 1 })}
        >
          <option value="">Any time</option>
          {deliveryChoices.map((n) => (
            <option key={n} value={n}>Within {n} days</option>
          ))}
          {view.deliveryWithin !== null && !deliveryChoices.includes(view.deliveryWithin as (typeof deliveryChoices)[number]) && (
            <option value={view.deliveryWithin}>Within {view.deliveryWithin} days</option>
          )}
        </select>
      </div>
      <label className="flex min-h-[40px] cursor-pointer items-center gap-2 rounded-md border border-ground-300 bg-white px-2.5 text-sm font-semibold text-ground-800 has-[:checked]:border-attention has-[:checked]:bg-attention-soft has-[:checked]:text-attention">
        <input
          type="checkbox"
          className="h-4 w-4 accent-ground-700"
          checked={view.photosFlagged}
          onChange={(e) => onChange({ photosFlagged: e.target.checked, page: 1 })}
          data-testid="filter-photos-flagged"
        />
        <CameraIcon className="h-4 w-4" />
        Photos flagged
      </label>
    </div>
  );
}
