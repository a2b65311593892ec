// The admin's settings: every readiness threshold and lead time with its meaning, default and
// source, a reset to the default per field, and the automatic reminder schedule.
import { useEffect, useMemo, useState, type FormEvent } from 'react';
import { readinessSettingsSchema, type ReadinessSettingKey, type ReadinessSettings, type SettingDescription } from '@/lib/readiness/settings';
import { reminderSettingsSchema, type ReminderSettings } from '@/lib/schemas/settings';
import { CheckIcon, SpinnerIcon, StopIcon } from '@/components/icons';
import { apiCall } from './api';
import { plural } from './format';

type SettingsAnswer = {
  readiness: ReadinessSettings;
  reminders: ReminderSettings;
  defaults: ReadinessSettings;
  descriptions: Record<ReadinessSettingKey, SettingDescription>;
  recomputeQueued?: boolean;
};
type Draft = Record<string, string | boolean>;

const groups: { title: string; intro: string; keys: ReadinessSettingKey[] }[] = [
  {
    title: 'Supply and maximum demand',
    intro: 'How the supply-headroom check assesses maximum demand against the main fuse.',
    keys: ['nominalVoltage', 'chargerAmps', 'headroomMarginAmps', 'smallFuseAmps', 'socketCircuitAmps', 'assumedSocketCircuits', 'lightingKw', 'cookerKw', 'cookerUnitHasSocket', 'immersionKw', 'otherEvChargerAmps'],
  },
  {
    title: 'Network operator and lead times',
    intro: 'When the network operator must be asked first, and how long each step takes before the car arrives.',
    keys: ['enaDemandLimitAmps', 'notifyWithinDays', 'surveyLeadDays', 'installLeadDays', 'supplyUpgradeLeadDays', 'timingSlackDays'],
  },
  {
    title: 'Earthing and cable run',
    intro: 'Soft ground for an electrode; the charge-point circuit’s device, terminal basis and voltage-drop allowance; the long-run flag.',
    keys: ['nearSoftGroundMetres', 'protectiveDeviceAmps', 'terminalTemperatureC', 'voltageDropLimitPercent', 'upstreamDropPercent', 'longRunMetres'],
  },
  { title: 'Cable reach', intro: 'Assumptions when measuring the charging cable on the customer’s driveway plan.', keys: ['cableSlackMetres', 'defaultTetherMetres', 'defaultCustomerCableMetres', 'portInsetMetres'] },
  {
    title: 'Photo checks at upload',
    intro: 'When a photo is flagged to the customer (who may take it again or keep it) and to the office. The check advises; the office decides.',
    keys: [
      'photoSharpnessMin',
      'photoDarkMeanMax',
      'photoShadowClipPercentMax',
      'photoBrightMeanMin',
      'photoHighlightClipPercentMax',
      'photoDigitsMinLongEdgePx',
      'photoDigitsMinShortEdgePx',
      'photoSceneMinLongEdgePx',
      'photoSceneMinShortEdgePx',
      'photoDuplicateMaxBits',
    ],
  },
];

const reminderFields: { key: keyof ReminderSettings; label: string; meaning: string; unit: string }[] = [
  { key: 'enabled', label: 'Send automatic reminders', meaning: 'E-mail customers whose case is still being filled in, listing what is missing.', unit: 'yes/no' },
  { key: 'everyDays', label: 'Remind every', meaning: 'Days between reminders, counted from the invitation or the last chase.', unit: 'days' },
  { key: 'maxReminders', label: 'At most', meaning: 'Reminders per case before they stop; the office can still chase by hand.', unit: 'reminders' },
  { key: 'sendFromHour', label: 'Not before', meaning: 'Hour of the day (UK time) from which reminders, and any texts with chases, may go out.', unit: 'o’clock' },
  { key: 'sendUntilHour', label: 'Not after', meaning: 'Hour of the day (UK time) by which reminders and texts stop for the day: never at night.', unit: 'o’clock' },
];
const reminderDefaults: ReminderSettings = reminderSettingsSchema.parse({});

function toDraft(values: Record<string, unknown>): Draft {
  return Object.fromEntries(Object.entries(values).map(([k, v]) => [k, typeof v === 'boolean' ? v : String(v)]));
}

function fromDraft(draft: Draft): Record<string, unknown> {
  return Object.fromEntries(Object.entries(draft).map(([k, v]) => [k, typeof v === 'boolean' ? v : v.trim() === '' ? undefined : Number(v)]));
}

function issuesByKey(error: { issues: { path: (string | number)[]; message: string }[] }): Record<string, string> {
  return Object.fromEntries(error.issues.map((i) => [String(i.path[0]), i.message]));
}

const shown = (v: unknown, unit: string) => (typeof v === 'boolean' ? (v ? 'Yes' : 'No') : `${v} ${unit}`);

type RowProps = {
  id: string;
  label: string;
  meaning: string;
  unit: string;
  source?: string;
  value: string | boolean;
  saved: unknown;
  fallback: unknown;
  error?: string;
  onChange(v: string | boolean): void;
};

function SettingRow({ id, label, meaning, unit, source, value, saved, fallback, error, onChange }: RowProps) {
  const isBool = typeof value === 'boolean';
  const current = isBool ? value : Number(value);
  const atDefault = current === fallback;
  const unsaved = (isBool ? value : Number(value)) !== saved;
  return (
    <div className="grid gap-2 py-3 md:grid-cols-[minmax(0,1fr)_18rem] md:gap-6" data-testid={`setting-${id}`}>
      <div>
        <label htmlFor={`setting-${id}`} className="font-semibold text-ground-900">{label}</label>
        <p className="text-sm text-ground-800">{meaning}</p>
        {source && <p className="mt-0.5 text-xs text-ground-600">Source: {source}</p>}
      </div>
      <div>
        <div className="flex items-center gap-2">
          {isBool ? (
            <input id={`setting-${id}`} type="checkbox" className="h-5 w-5 accent-ground-700" checked={value} onChange={(e) => onChange(e.target.checked)} />
          ) : (
            <input
              id={`setting-${id}`}
              type="number"
              inputMode="decimal"
              step="any"
              className="field-input w-28 tabular-nums"
              value={value}
              aria-invalid={!!error}
              aria-describedby={`setting-${id}-default${error ? ` setting-${id}-error` : ''}`}
              onChange={(e) => onChange(e.target.value)}
            />
          )}
          <span className="text-sm text-ground-700">{unit === 'yes/no' ? '' : unit}</span>
          {unsaved && <span className="rounded bg-clay-100 px-1.5 py-0.5 text-xs font-semibold text-clay-800">Not saved</span>}
        </div>
        <p id={`setting-${id}-default`} className="mt-1 flex flex-wrap items-center gap-x-2 text-xs text-ground-700">
          Default: {shown(fallback, unit === 'yes/no' ? '' : unit)}
          {!atDefault && (
            <button type="button" className="font-semibold text-ground-700 underline decoration-ground-300 underline-offset-2" onClick={() => onChange(isBool ? Boolean(fallback) : String(fallback))}>
              Reset to default<span className="sr-only"> for {label}</span>
            </button>
          )}
        </p>
        {error && <p id={`setting-${id}-error`} className="field-error">{error}</p>}
      </div>
    </div>
  );
}

function SaveBar({ changes, busy, message }: { changes: number; busy: boolean; message: { ok: boolean; text: string } | null }) {
  return (
    <div className="mt-2 flex flex-wrap items-center gap-3 border-t border-ground-100 pt-4">
      <button type="submit" className="btn-primary" disabled={busy || changes === 0}>
        {busy && <SpinnerIcon className="h-5 w-5" />}Save {changes > 0 ? plural(changes, 'change') : 'changes'}
      </button>
      {message && (
        <p role="status" className={`flex items-center gap-1.5 text-sm font-semibold ${message.ok ? 'text-clear' : 'text-blocked'}`} data-testid="settings-message">
          {message.ok ? <CheckIcon className="h-4 w-4" /> : <StopIcon className="h-4 w-4" />}{message.text}
        </p>
      )}
    </div>
  );
}

export default function SettingsApp() {
  const [saved, setSaved] = useState<SettingsAnswer | null>(null);
  const [loadError, setLoadError] = useState<string | null>(null);
  const [readiness, setReadiness] = useState<Draft>({});
  const [reminders, setReminders] = useState<Draft>({});
  const [errors, setErrors] = useState<{ readiness: Record<string, string>; reminders: Record<string, string> }>({ readiness: {}, reminders: {} });
  const [busy, setBusy] = useState<'readiness' | 'reminders' | null>(null);
  const [message, setMessage] = useState<{ group: 'readiness' | 'reminders'; ok: boolean; text: string } | null>(null);

  function take(answer: SettingsAnswer) {
    setSaved(answer);
    setReadiness(toDraft(answer.readiness));
    setReminders(toDraft(answer.reminders));
  }

  useEffect(() => {
    apiCall<SettingsAnswer>('GET', '/api/settings').then((r) => (r.ok ? take(r.data) : setLoadError(r.error.message)));
  }, []);

  const readinessChanges = useMemo(() => (saved ? Object.keys(readiness).filter((k) => fromDraft({ [k]: readiness[k]! })[k] !== (saved.readiness as Record<string, unknown>)[k]).length : 0), [readiness, saved]);
  const reminderChanges = useMemo(() => (saved ? Object.keys(reminders).filter((k) => fromDraft({ [k]: reminders[k]! })[k] !== (saved.reminders as Record<string, unknown>)[k]).length : 0), [reminders, saved]);

  async function save(group: 'readiness' | 'reminders', e: FormEvent) {
    e.preventDefault();
    setMessage(null);
    const draft = group === 'readiness' ? readiness : reminders;
    const blanks = Object.fromEntries(Object.entries(draft).filter(([, v]) => v === '').map(([k]) => [k, 'Enter a number, or reset to the default.']));
    if (Object.keys(blanks).length) {
      setErrors((x) => ({ ...x, [group]: blanks }));
      setMessage({ group, ok: false, text: 'Some values need fixing; nothing was saved.' });
      return;
    }
    const values = fromDraft(draft);
    const check = group === 'readiness' ? readinessSettingsSchema.partial().strict().safeParse(values) : reminderSettingsSchema.safeParse(values);
    if (!check.success) {
      setErrors((x) => ({ ...x, [group]: issuesByKey(check.error) }));
      setMessage({ group, ok: false, text: 'Some values need fixing; nothing was saved.' });
      return;
    }
    setErrors((x) => ({ ...x, [group]: {} }));
    setBusy(group);
    const r = await apiCall<SettingsAnswer>('PUT', '/api/settings', { [group]: check.data });
    setBusy(null);
    if (!r.ok) {
      const fields = Object.fromEntries(Object.entries(r.error.fields ?? {}).map(([k, v]) => [k.replace(/^(readiness|reminders)\./, ''), v]));
      setErrors((x) => ({ ...x, [group]: fields }));
      setMessage({ group, ok: false, text: r.error.message });
      return;
    }
    take(r.data);
    setMessage({
      group,
      ok: true,
      text: group === 'readiness' ? 'Saved. Every open case is being worked out again with these settings: the lights in the queue change within a minute or so.' : 'Saved. The next reminders follow this schedule.',
    });
  }

  if (loadError) return <p role="alert" className="card font-semibold text-blocked">{loadError}</p>;
  if (!saved) return <p className="card flex items-center gap-2"><SpinnerIcon className="h-5 w-5" />Loading settings…</p>;
  const known = new Set(groups.flatMap((g) => g.keys));
  const others = (Object.keys(saved.descriptions) as ReadinessSettingKey[]).filter((k) => !known.has(k));
  const allGroups = others.length ? [...groups, { title: 'Other', intro: '', keys: others }] : groups;

  return (
    <div className="space-y-6">
      <form method="post" onSubmit={(e) => save('readiness', e)} noValidate className="card" aria-labelledby="readiness-settings-heading">
        <h2 id="readiness-settings-heading" className="text-xl font-bold text-ground-900">Readiness checks</h2>
        <p className="text-sm text-ground-800">
          Saving works out every open case’s readiness again. These are preparation thresholds, not design values: the installation is designed and
          certified by the electrician under BS 7671 and local rules.
        </p>
        {readinessChanges > 0 && (
          <div className="mt-3 flex flex-wrap items-center gap-3 rounded-md border border-clay-200 bg-clay-50 px-3 py-2 text-sm">
            <span className="font-semibold text-clay-800">{plural(readinessChanges, 'change')} not saved yet</span>
            <button type="submit" className="btn-secondary min-h-[36px] px-3 py-1 text-sm" disabled={busy === 'readiness'}>Save {plural(readinessChanges, 'change')}</button>
          </div>
        )}
        {allGroups.map((g) => (
          <fieldset key={g.title} className="mt-5">
            <legend className="text-lg font-bold text-ground-900">{g.title}</legend>
            {g.intro && <p className="text-sm text-ground-700">{g.intro}</p>}
            <div className="divide-y divide-ground-100">
              {g.keys.map((k) => {
                const d = saved.descriptions[k];
                return (
                  <SettingRow
                    key={k}
                    id={k}
                    label={d.label}
                    meaning={d.meaning}
                    unit={d.unit}
                    source={d.source}
                    value={readiness[k] ?? ''}
                    saved={(saved.readiness as Record<string, unknown>)[k]}
                    fallback={d.default}
                    error={errors.readiness[k]}
                    onChange={(v) => setReadiness((x) => ({ ...x, [k]: v }))}
                  />
                );
              })}
            </div>
          </fieldset>
        ))}
        <SaveBar changes={readinessChanges} busy={busy === 'readiness'} message={message?.group === 'readiness' ? message : null} />
      </form>

      <form method="post" onSubmit={(e) => save('reminders', e)} noValidate className="card" aria-labelledby="reminder-settings-heading">
        <h2 id="reminder-settings-heading" className="text-xl font-bold text-ground-900">Automatic reminders</h2>
        <p className="text-sm text-ground-800">For cases still being filled in. Each reminder lists exactly what is missing, with a sign-in link.</p>
        <div className="divide-y divide-ground-100">
          {reminderFields.map((f) => (
            <SettingRow
              key={f.key}
              id={`reminders-${f.key}`}
              label={f.label}
              meaning={f.meaning}
              unit={f.unit}
              value={reminders[f.key] ?? ''}
              saved={saved.reminders[f.key]}
              fallback={reminderDefaults[f.key]}
              error={errors.reminders[f.key]}
              onChange={(v) => setReminders((x) => ({ ...x, [f.key]: v }))}
            />
          ))}
        </div>
        <SaveBar changes={reminderChanges} busy={busy === 'reminders'} message={message?.group === 'reminders' ? message : null} />
      </form>
    </div>
  );
}
