// The office (or surveyor) records what no customer answer can supply: a measured maximum
// demand from smart-meter or logger data, the 722.411.4.1 measure chosen for PME, and a TT
// electrode's RA with the RCD's IΔn. Saved through the shared schema; the checks rerun.
import { useState, type FormEvent } from 'react';
import { zodIssuesToFields } from '@/lib/schemas/checklist';
import { earthingMeasureOptionLabels, earthingMeasureValues, measurementFields, siteMeasuresSchema } from '@/lib/schemas/outcome';
import type { EarthingMeasure, SiteMeasures } from '@/lib/readiness/types';
import { CheckIcon, SpinnerIcon } from '@/components/icons';
import { apiCall } from './api';

type Props = { caseId: string; initial: SiteMeasures; onSaved(measures: SiteMeasures): void };
type NumberKey = 'measuredMaxDemandAmps' | 'electrodeOhms' | 'rcdIdnMilliamps';
const numberKeys: NumberKey[] = ['measuredMaxDemandAmps', 'electrodeOhms', 'rcdIdnMilliamps'];
const shortLabels: Record<NumberKey, string> = {
  measuredMaxDemandAmps: 'Measured maximum demand (existing, busiest phase)',
  electrodeOhms: 'Earth electrode resistance, RA',
  rcdIdnMilliamps: 'RCD rated residual current, IΔn',
};

const text = (v: number | null | undefined) => (typeof v === 'number' ? String(v) : '');

export function SiteMeasuresForm({ caseId, initial, onSaved }: Props) {
  const [values, setValues] = useState<Record<NumberKey, string>>({
    measuredMaxDemandAmps: text(initial.measuredMaxDemandAmps),
    electrodeOhms: text(initial.electrodeOhms),
    rcdIdnMilliamps: text(initial.rcdIdnMilliamps),
  });
  const [measure, setMeasure] = useState<string>(initial.earthingMeasure ?? '');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [busy, setBusy] = useState(false);

  // A cleared box is sent as null so the saved value goes, not left as it was.
  const body = () => ({
    ...Object.fromEntries(numberKeys.map((k) => [k, values[k].trim() === '' ? null : Number(values[k].replace(',', '.'))])),
    earthingMeasure: measure === '' ? null : (measure as EarthingMeasure),
  });

  async function save(event: FormEvent) {
    event.preventDefault();
    const data = body();
    const checked = siteMeasuresSchema.safeParse(data);
    if (!checked.success) {
      setErrors(zodIssuesToFields(checked.error));
      setMessage({ ok: false, text: 'Some values need fixing.' });
      return;
    }
    setBusy(true);
    const r = await apiCall<{ siteMeasures: SiteMeasures }>('PUT', `/api/cases/${caseId}/site-measures`, data);
    setBusy(false);
    if (r.ok) {
      setErrors({});
      setMessage({ ok: true, text: 'Recorded. The checks have been worked out again.' });
      onSaved(r.data.siteMeasures);
    } else {
      setErrors(r.error.fields ?? {});
      setMessage({ ok: false, text: r.error.message });
    }
  }

  return (
    <section aria-labelledby="site-measures-heading" className="card" id="site-measures" data-testid="site-measures">
      <h2 id="site-measures-heading" className="text-lg font-bold text-ground-900">Recorded by the office or surveyor</h2>
      <p className="mt-1 text-sm text-ground-800">
        A measured maximum demand replaces the Table A2 estimate; PME earthing stays amber until a 722.411.4.1 measure is recorded; a TT
        electrode is checked as RA × IΔn ≤ 50 V.
      </p>
      <form className="mt-3 space-y-3" onSubmit={save} noValidate>
        {numberKeys.map((k) => (
          <div key={k}>
            <label htmlFor={`site-${k}`} className="field-label">
              {shortLabels[k]} ({measurementFields[k].unit})
            </label>
            <input
              id={`site-${k}`}
              className="field-input mt-1 max-w-[10rem]"
              inputMode="decimal"
              value={values[k]}
              onChange={(e) => setValues((v) => ({ ...v, [k]: e.target.value }))}
              aria-invalid={errors[k] ? true : undefined}
            />
            {errors[k] && <p className="field-error">{errors[k]}</p>}
          </div>
        ))}
        <div>
          <label htmlFor="site-earthingMeasure" className="field-label">722.411.4.1 measure (PME)</label>
          <select id="site-earthingMeasure" className="field-input mt-1" value={measure} onChange={(e) => setMeasure(e.target.value)}>
            <option value="">Not chosen yet</option>
            {earthingMeasureValues.map((m) => <option key={m} value={m}>{earthingMeasureOptionLabels[m]}</option>)}
          </select>
          {errors.earthingMeasure && <p className="field-error">{errors.earthingMeasure}</p>}
        </div>
        <button type="submit" className="btn-secondary min-h-[40px] px-4 py-2 text-sm" disabled={busy}>
          {busy ? <SpinnerIcon className="h-4 w-4" /> : <CheckIcon className="h-4 w-4" />}Record
        </button>
        {message && (
          <p role="status" data-testid="site-measures-message" className={`text-sm font-semibold ${message.ok ? 'text-clear' : 'text-attention'}`}>{message.text}</p>
        )}
      </form>
    </section>
  );
}
