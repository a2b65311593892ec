// The surveyor records the visit: outcome, confirmed earthing and main fuse, readings, notes and
// photos from site. The shared outcome schema checks the form here and again on the server.
import { useRef, useState, type FormEvent, type ReactNode } from 'react';
import { zodIssuesToFields } from '@/lib/schemas/checklist';
import {
  confirmedEarthingValues,
  confirmedFuseValues,
  earthingLabels,
  earthingMeasureOptionLabels,
  earthingMeasureValues,
  measurementFields,
  measurementIds,
  outcomeLabels,
  outcomeSchema,
  surveyOutcomeValues,
  type MeasurementId,
  type SurveyOutcome,
} from '@/lib/schemas/outcome';
import { CheckIcon, SpinnerIcon, StopIcon, WarningIcon } from '@/components/icons';

type Props = {
  caseId: string;
  reference: string;
  /** What the customer answered, shown beside the confirmed choices. */
  customerEarthing: string | null;
  customerFuse: string | null;
  /** The customer's cable-run estimate, shown beside the measured run. */
  customerCableRun: number | null;
};

type SitePhoto = { name: string; state: 'sending' | 'sent' | 'failed'; message?: string };

const outcomeHelp: Record<SurveyOutcome, string> = {
  go_ahead: 'The install can go ahead as planned.',
  go_ahead_with_changes: 'It can go ahead, with changes you describe in the notes.',
  cannot_install: 'It cannot be installed; say why in the notes.',
};

/** The outcome form island. @example <OutcomeForm client:load caseId={id} reference="GW-7K2Q" customerEarthing="PME (TN-C-S)" customerFuse="100 A" customerCableRun={9} /> */
export default function OutcomeForm({ caseId, reference, customerEarthing, customerFuse, customerCableRun }: Props) {
  const [outcome, setOutcome] = useState<SurveyOutcome | ''>('');
  const [earthing, setEarthing] = useState<string>('');
  const [fuse, setFuse] = useState<string>('');
  const [measure, setMeasure] = useState<string>('');
  const [readings, setReadings] = useState<Record<MeasurementId, string>>(() => Object.fromEntries(measurementIds.map((id) => [id, ''])) as Record<MeasurementId, string>);
  const [notes, setNotes] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const [photos, setPhotos] = useState<SitePhoto[]>([]);
  const summary = useRef<HTMLDivElement>(null);

  const body = () => ({
    outcome: outcome || undefined,
    confirmedEarthing: earthing || null,
    confirmedFuseAmps: fuse ? Number(fuse) : null,
    earthingMeasure: measure || null,
    measurements: Object.fromEntries(measurementIds.filter((id) => readings[id].trim() !== '').map((id) => [id, Number(readings[id].replace(',', '.'))])),
    notes: notes.trim() || undefined,
  });

  const fail = (fields: Record<string, string>, text: string) => {
    setErrors(fields);
    setMessage(text);
    requestAnimationFrame(() => summary.current?.focus());
  };

  async function submit(event: FormEvent) {
    event.preventDefault();
    const data = body();
    const checked = outcomeSchema.safeParse(data);
    if (!checked.success) return fail(zodIssuesToFields(checked.error), 'Some answers need fixing before the outcome can be saved.');
    setSaving(true);
    setErrors({});
    setMessage(null);
    try {
      const res = await fetch(`/api/cases/${caseId}/outcome`, { method: 'POST', headers: { 'Content-Type': 'application/json', Accept: 'application/json' }, body: JSON.stringify(data) });
      if (res.ok) {
        window.location.assign(`/surveys/cases/${caseId}?recorded=1`);
        return;
      }
      const answer = (await res.json().catch(() => null)) as { error?: { message?: string; fields?: Record<string, string> } } | null;
      fail(answer?.error?.fields ?? {}, answer?.error?.message ?? `Something went wrong (HTTP ${res.status}). Please try again.`);
    } catch {
      fail({}, 'Could not reach Groundwork. Check the connection and try again: nothing has been lost from this form.');
    } finally {
      setSaving(false);
    }
  }

  async function sendPhotos(files: FileList | null) {
    for (const file of Array.from(files ?? [])) {
      setPhotos((list) => [...list, { name: file.name, state: 'sending' }]);
      const update = (next: Partial<SitePhoto>) => setPhotos((list) => list.map((p) => (p.name === file.name && p.state === 'sending' ? { ...p, ...next } : p)));
      const form = new FormData();
      form.append('kind', 'other');
      form.append('file', file);
      try {
        const res = await fetch(`/api/cases/${caseId}/uploads`, { method: 'POST', body: form, headers: { Accept: 'application/json' } });
        if (res.ok) update({ state: 'sent' });
        else {
          const answer = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
          update({
            state: 'failed',
            message: res.status === 403 ? 'Photos from site cannot be added from this account yet: send them to the office.' : answer?.error?.message ?? `Not sent (HTTP ${res.status}).`,
          });
        }
      } catch {
        update({ state: 'failed', message: 'Not sent: check the connection and try again.' });
      }
    }
  }

  // A fixed answer drops its own error at once; the summary goes when nothing is left in it.
  const cleared = (key: string) => {
    if (!(key in errors)) return;
    const rest = Object.fromEntries(Object.entries(errors).filter(([k]) => k !== key));
    setErrors(rest);
    if (Object.keys(rest).length === 0) setMessage(null);
  };
  const fieldError = (key: string) => errors[key];
  const errorText = (key: string) => fieldError(key) && <p id={`${key}-error`} className="field-error">{fieldError(key)}</p>;

  return (
    <form method="post" onSubmit={submit} noValidate className="grid gap-5" data-testid="outcome-form" aria-describedby="outcome-intro">
      <p id="outcome-intro" className="text-ground-800">
        Saving moves case <span className="font-mono font-semibold">{reference}</span> to Surveyed, tells the office, and the checks then use what you confirmed in place of the customer’s answers.
      </p>

      {message && (
        <div ref={summary} tabIndex={-1} role="alert" className="rounded-md border border-blocked/40 bg-blocked-soft p-3" data-testid="outcome-errors">
          <p className="flex items-center gap-2 font-semibold text-blocked"><StopIcon className="h-5 w-5" />{message}</p>
          {Object.keys(errors).length > 0 && <ul className="mt-1 list-disc pl-6 text-sm">{Object.entries(errors).map(([k, v]) => <li key={k}>{v}</li>)}</ul>}
        </div>
      )}

      <Fieldset legend="Outcome of the survey" error={errorText('outcome')}>
        <div className="grid gap-2 sm:grid-cols-3">
          {surveyOutcomeValues.map((value) => (
            <Choice key={value} name="outcome" value={value} checked={outcome === value} onChange={() => { setOutcome(value); cleared('outcome'); cleared('notes'); }} label={outcomeLabels[value]} help={outcomeHelp[value]} />
          ))}
        </div>
      </Fieldset>

      <div className="grid gap-5 sm:grid-cols-2">
        <Fieldset legend="Earthing, confirmed on site" hint={`Customer said: ${customerEarthing ?? 'not answered'}.`} error={errorText('confirmedEarthing')}>
          <div className="grid grid-cols-2 gap-2">
            {confirmedEarthingValues.map((value) => (
              <Choice key={value} name="confirmedEarthing" value={value} checked={earthing === value} onChange={() => { setEarthing(value); cleared('confirmedEarthing'); }} label={earthingLabels[value]} />
            ))}
            <Choice name="confirmedEarthing" value="" checked={earthing === ''} onChange={() => { setEarthing(''); cleared('confirmedEarthing'); }} label="Not confirmed" />
          </div>
        </Fieldset>
        <Fieldset legend="Main fuse (cut-out), confirmed on site" hint={`Customer said: ${customerFuse ?? 'not answered'}. Read the rating from the carrier; never open the cut-out.`} error={errorText('confirmedFuseAmps')}>
          <div className="grid grid-cols-2 gap-2">
            {confirmedFuseValues.map((value) => (
              <Choice key={value} name="confirmedFuseAmps" value={String(value)} checked={fuse === String(value)} onChange={() => { setFuse(String(value)); cleared('confirmedFuseAmps'); }} label={`${value} A`} />
            ))}
            <Choice name="confirmedFuseAmps" value="" checked={fuse === ''} onChange={() => { setFuse(''); cleared('confirmedFuseAmps'); }} label="Not confirmed" />
          </div>
        </Fieldset>
      </div>

      <div>
        <label htmlFor="outcome-earthing-measure" className="field-label">PME: the BS 7671 722.411.4.1 measure that will be used</label>
        <select id="outcome-earthing-measure" className="field-input" value={measure} onChange={(e) => { setMeasure(e.target.value); cleared('earthingMeasure'); }}>
          <option value="">Not chosen yet (the earthing check stays amber on PME)</option>
          {earthingMeasureValues.map((m) => <option key={m} value={m}>{earthingMeasureOptionLabels[m]}</option>)}
        </select>
        <p className="field-help">For a TT electrode, record RA and the RCD’s IΔn below: RA × IΔn must be 50 V or less (411.5.3).</p>
        {errorText('earthingMeasure')}
      </div>

      <fieldset className="rounded-lg border border-ground-200 bg-white p-4">
        <legend className="px-1 font-bold text-ground-900">Measured or noted values (optional)</legend>
        <div className="grid gap-4 sm:grid-cols-2">
          {measurementIds.map((id) => {
            const f = measurementFields[id];
            const key = `measurements.${id}`;
            const hint = id === 'cableRunMetres' && customerCableRun !== null ? `Customer estimated ${customerCableRun} m.` : `${f.min} to ${f.max} ${f.unit}.`;
            return (
              <div key={id}>
                <label htmlFor={`m-${id}`} className="field-label">{f.label} <span className="font-normal text-ground-700">({f.unit})</span></label>
                <input
                  id={`m-${id}`}
                  type="number"
                  inputMode="decimal"
                  step={f.step}
                  min={f.min}
                  max={f.max}
                  className="field-input"
                  value={readings[id]}
                  onChange={(e) => {
                    setReadings((r) => ({ ...r, [id]: e.target.value }));
                    cleared(key);
                  }}
                  aria-invalid={Boolean(fieldError(key))}
                  aria-describedby={`m-${id}-help${fieldError(key) ? ` ${key}-error` : ''}`}
                />
                <p id={`m-${id}-help`} className="field-help">{hint}</p>
                {errorText(key)}
              </div>
            );
          })}
        </div>
      </fieldset>

      <div>
        <label htmlFor="outcome-notes" className="field-label">Notes{outcome && outcome !== 'go_ahead' ? ' (needed)' : ' (optional for a plain go-ahead)'}</label>
        <textarea
          id="outcome-notes"
          className="field-input min-h-[120px]"
          value={notes}
          onChange={(e) => {
            setNotes(e.target.value);
            cleared('notes');
          }}
          aria-invalid={Boolean(fieldError('notes'))}
          aria-describedby={`outcome-notes-help${fieldError('notes') ? ' notes-error' : ''}`}
        />
        <p id="outcome-notes-help" className="field-help">What changes, what you found, anything the installer needs to know.</p>
        {errorText('notes')}
      </div>

      <fieldset className="rounded-lg border border-ground-200 bg-white p-4">
        <legend className="px-1 font-bold text-ground-900">Photos from site (optional)</legend>
        <label htmlFor="site-photos" className="field-label">Add photos</label>
        <input id="site-photos" type="file" accept="image/jpeg,image/png,image/webp,application/pdf" capture="environment" multiple className="block w-full text-sm" onChange={(e) => void sendPhotos(e.currentTarget.files)} />
        <p className="field-help">Each one is sent as soon as you choose it and shows in the pack as “from site”.</p>
        {photos.length > 0 && (
          <ul className="mt-2 grid gap-1 text-sm" aria-live="polite">
            {photos.map((p, i) => (
              <li key={`${p.name}-${i}`} className="flex items-start gap-2">
                {p.state === 'sending' ? <SpinnerIcon className="h-4 w-4" /> : p.state === 'sent' ? <CheckIcon className="h-4 w-4 text-clear" /> : <WarningIcon className="h-4 w-4 text-attention" />}
                <span>{p.name}: {p.state === 'sending' ? 'sending…' : p.state === 'sent' ? 'sent' : p.message}</span>
              </li>
            ))}
          </ul>
        )}
      </fieldset>

      <div className="flex flex-wrap items-center gap-3">
        <button type="submit" className="btn-primary" disabled={saving} data-testid="save-outcome">
          {saving ? <SpinnerIcon className="h-5 w-5" /> : <CheckIcon className="h-5 w-5" />}
          Save the outcome
        </button>
        <a href={`/surveys/cases/${caseId}`} className="btn-secondary">Back to the pack</a>
      </div>
    </form>
  );
}

function Fieldset({ legend, hint, error, children }: { legend: string; hint?: string; error?: ReactNode; children: ReactNode }) {
  return (
    <fieldset className="rounded-lg border border-ground-200 bg-white p-4">
      <legend className="px-1 font-bold text-ground-900">{legend}</legend>
      {hint && <p className="mb-2 text-sm text-ground-700">{hint}</p>}
      {children}
      {error}
    </fieldset>
  );
}

function Choice({ name, value, checked, onChange, label, help }: { name: string; value: string; checked: boolean; onChange: () => void; label: string; help?: string }) {
  const id = `${name}-${value || 'none'}`;
  return (
    <label htmlFor={id} className={`flex min-h-[44px] cursor-pointer items-start gap-2 rounded-md border p-3 ${checked ? 'border-ground-600 bg-ground-50' : 'border-ground-200 bg-white'}`}>
      <input id={id} type="radio" name={name} value={value} checked={checked} onChange={onChange} className="mt-1 h-4 w-4 accent-ground-700" />
      <span>
        <span className="font-semibold">{label}</span>
        {help && <span className="block text-sm text-ground-700">{help}</span>}
      </span>
    </label>
  );
}
