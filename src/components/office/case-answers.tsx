// The customer's answers, grouped as the checklist groups them, with what is still missing.
import { sectionIds, type Checklist, type SectionId, type SectionProgress } from '@/lib/schemas/checklist';
import { summaryRows } from '@/components/checklist/progress';
import { CheckIcon, WarningIcon } from '@/components/icons';
import { countOf } from '@/lib/grammar';
import { staffAnswer, staffLabel } from '@/lib/vocabulary';
import { valueAt } from '@/components/checklist/form-values';
import type { FieldDef } from '@/components/checklist/field-defs';
import type { VehicleLookupInfo } from './case-types';
import { formatDayTime } from './format';
import { fuelFit, fuelWords } from '@/lib/vehicle-fuel';

type Props = { checklist: Checklist; progress: SectionProgress[]; warnings: Record<string, string>; vehicleLookup?: VehicleLookupInfo };

function planSummary(checklist: Checklist): string | null {
  const plan = checklist.charger?.plan as { bays?: unknown[] } | null | undefined;
  if (!plan) return null;
  const bays = Array.isArray(plan.bays) ? plan.bays.length : 0;
  return `Drawn (${countOf(bays, 'bay')}) — see the cable reach check`;
}

/**
 * Where the vehicle's make came from: the registration look-up (when the saved make and plate
 * are the ones it found) or the customer's own typing, with what the records said beside it.
 */
export function vehicleSourceWords(checklist: Checklist, lookup: VehicleLookupInfo | undefined): string | null {
  const make = checklist.vehicle?.make ?? null;
  const registration = checklist.vehicle?.registration ?? null;
  if (!make) return null;
  if (!lookup || !registration || lookup.registration !== registration) return 'Make typed by the customer (no registration look-up).';
  const record = [lookup.colour?.toLowerCase(), lookup.makeWords, lookup.yearOfManufacture, lookup.fuelType ? fuelWords(lookup.fuelType) : null].filter(Boolean).join(', ');
  const fuel = fuelFit(lookup.fuelType) === 'electric' ? '' : ' The records do not show a fully electric car.';
  const when = formatDayTime(lookup.lookedUpAt);
  if (lookup.makeWords && lookup.makeWords.toLowerCase() === make.trim().toLowerCase()) {
    return `Make from the vehicle records look-up of ${registration} on ${when} (${record}).${fuel}`;
  }
  return `Make typed by the customer; the vehicle records for ${registration} show ${record} (looked up ${when}).${fuel}`;
}

// Choices read in staff words; phone, MPAN, dates and measures read the same for everyone.
function staffValue(def: FieldDef, checklist: Checklist, shown: string | null): string | null {
  if (shown === null || !['choice', 'numchoice', 'yesno', 'fuse'].includes(def.kind)) return shown;
  const { present, value } = valueAt(checklist, def.path);
  return staffAnswer(def.path, value, present) ?? shown;
}

function Section({ id, title, checklist, progress, warnings, note }: { id: SectionId; title: string; checklist: Checklist; progress?: SectionProgress; warnings: Record<string, string>; note?: string | null }) {
  const rows = summaryRows(id, checklist).map((r) => ({ def: r.def, value: staffValue(r.def, checklist, r.value) }));
  const answered = rows.filter((r) => r.value !== null);
  // Unanswered fields are listed on one line, so a half-filled case stays short to read.
  const missing = new Set((progress?.missing ?? []).map((m) => `${id}.${m}`));
  const gaps = rows.filter((r) => r.value === null && missing.has(r.def.path)).map((r) => staffLabel(r.def.path));
  const optional = rows.filter((r) => r.value === null && !missing.has(r.def.path)).map((r) => staffLabel(r.def.path));
  const plan = id === 'charger' ? planSummary(checklist) : null;
  return (
    <div className="py-3" data-testid={`answers-${id}`}>
      <h3 className="mb-1 flex items-center gap-2 font-bold text-ground-900">
        {title}
        {progress?.complete ? (
          <span className="inline-flex items-center gap-1 text-sm font-semibold text-clear"><CheckIcon className="h-4 w-4" />Complete</span>
        ) : (
          <span className="inline-flex items-center gap-1 text-sm font-semibold text-attention"><WarningIcon className="h-4 w-4" />{progress?.missing.length ?? 0} missing</span>
        )}
      </h3>
      {(answered.length > 0 || plan) && (
        <dl className="grid grid-cols-1 gap-x-6 text-sm sm:grid-cols-[12rem_1fr]">
          {answered.map(({ def, value }) => (
            <div key={def.path} className="contents">
              <dt className="pt-1 text-ground-700">{staffLabel(def.path)}</dt>
              <dd className="pb-1 font-semibold text-ink sm:pt-1">
                {value}
                {warnings[def.path] && (
                  <span className="mt-0.5 flex items-start gap-1 text-xs font-normal text-attention"><WarningIcon className="h-3.5 w-3.5" />{warnings[def.path]}</span>
                )}
              </dd>
            </div>
          ))}
          {plan && (
            <div className="contents">
              <dt className="pt-1 text-ground-700">{staffLabel('charger.plan')}</dt>
              <dd className="pb-1 font-semibold sm:pt-1">{plan}</dd>
            </div>
          )}
        </dl>
      )}
      {note && <p className="mt-1 text-sm text-ground-800" data-testid="vehicle-source">{note}</p>}
      {gaps.length > 0 && (
        <p className="mt-1 text-sm"><span className="font-semibold text-attention">Not answered yet:</span> {gaps.join(', ')}</p>
      )}
      {optional.length > 0 && <p className="mt-0.5 text-xs text-ground-600">Left blank (optional or not yet relevant): {optional.join(', ')}</p>}
    </div>
  );
}

/**
 * The answer warnings the office should see. A plate the vehicle records hold has been issued,
 * whatever its age identifier suggests, so its registration warning is dropped (as on the
 * customer's vehicle step).
 *
 * @example officeWarnings({ 'vehicle.registration': '…not in use yet…' }, { vehicle: { registration: 'GW29 EVA' } }, { registration: 'GW29 EVA' }) // {}
 */
export function officeWarnings(warnings: Record<string, string>, checklist: Checklist, lookup: { registration: string } | null | undefined): Record<string, string> {
  const plate = checklist.vehicle?.registration;
  if (!lookup || !plate || lookup.registration !== plate || !warnings['vehicle.registration']) return warnings;
  const { 'vehicle.registration': _onRecord, ...rest } = warnings;
  return rest;
}

export function CaseAnswers({ checklist, progress, warnings: all, vehicleLookup }: Props) {
  const warnings = officeWarnings(all, checklist, vehicleLookup);
  return (
    <section aria-labelledby="answers-heading" className="card" id="answers">
      <h2 id="answers-heading" className="text-lg font-bold text-ground-900">Answers</h2>
      <div className="divide-y divide-ground-100">
        {sectionIds.map(([id, title]) => (
          <Section key={id} id={id} title={title} checklist={checklist} progress={progress.find((p) => p.id === id)} warnings={warnings} note={id === 'vehicle' ? vehicleSourceWords(checklist, vehicleLookup) : null} />
        ))}
      </div>
    </section>
  );
}
