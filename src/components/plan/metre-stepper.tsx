// A length in metres with large − / + buttons and a box to type in. The arrow keys in the box
// step 0.1 m (0.5 m with Shift), like the arrow keys on the drawing.
import { useId, useState, type KeyboardEvent } from 'react';
import { MinusIcon, PlusIcon } from '@/components/icons';
import { roundTo } from '@/lib/readiness/units';

type Props = {
  label: string;
  value: number;
  onChange: (value: number) => void;
  min: number;
  max: number;
  /** Names for the buttons, e.g. "Move the charge point left 0.1 m". */
  lessLabel: string;
  moreLabel: string;
  help?: string;
  step?: number;
  disabled?: boolean;
};

const BIG_STEP = 0.5;

const shown = (value: number) => String(roundTo(value, 2));

function parseMetres(text: string): number | null {
  const cleaned = text.trim().replace(',', '.').replace(/\s*m$/i, '');
  if (cleaned === '' || !/^-?\d*\.?\d+$|^-?\d+\.$/.test(cleaned)) return null;
  const value = Number(cleaned);
  return Number.isFinite(value) ? value : null;
}

/**
 * A labelled metre field with stepper buttons.
 *
 * @example <MetreStepper label="Width" value={2.4} min={1.8} max={8} onChange={setWidth} lessLabel="Narrower by 0.1 m" moreLabel="Wider by 0.1 m" />
 */
export function MetreStepper({ label, value, onChange, min, max, lessLabel, moreLabel, help, step = 0.1, disabled }: Props) {
  const id = useId();
  // What the customer is typing, kept only while it belongs to the current value: a change made
  // elsewhere (the drawing, the buttons) shows at once, in the same render, with no effect to
  // wait for.
  const [draft, setDraft] = useState<{ text: string; forValue: number; error: string | null } | null>(null);
  const current = draft !== null && draft.forValue === roundTo(value, 2) ? draft : null;
  const text = current ? current.text : shown(value);
  const error = current ? current.error : null;

  const commit = (next: number) => {
    setDraft(null);
    onChange(roundTo(Math.min(max, Math.max(min, next)), 2));
  };

  const typed = (raw: string) => {
    const parsed = parseMetres(raw);
    const here = roundTo(value, 2);
    if (parsed === null) return setDraft({ text: raw, forValue: here, error: raw.trim() === '' ? null : 'Please type a number of metres, like 2.4.' });
    if (parsed < min || parsed > max) return setDraft({ text: raw, forValue: here, error: `Please choose between ${shown(min)} m and ${shown(max)} m.` });
    setDraft({ text: raw, forValue: roundTo(parsed, 2), error: null });
    onChange(roundTo(parsed, 2));
  };

  const keys = (event: KeyboardEvent<HTMLInputElement>) => {
    if (event.key !== 'ArrowUp' && event.key !== 'ArrowDown') return;
    event.preventDefault();
    const size = event.shiftKey ? BIG_STEP : step;
    commit(value + (event.key === 'ArrowUp' ? size : -size));
  };

  const buttonClass =
    'inline-flex h-12 w-12 shrink-0 items-center justify-center rounded-md border border-ground-300 bg-white text-ground-800 hover:bg-ground-50 active:bg-ground-100 disabled:cursor-not-allowed disabled:opacity-50';
  const described = [help ? `${id}-help` : null, error ? `${id}-error` : null].filter(Boolean).join(' ') || undefined;

  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
        <span className="sr-only">, in metres</span>
      </label>
      <div className="flex items-center gap-2">
        <button type="button" className={buttonClass} aria-label={lessLabel} title={lessLabel} disabled={disabled || value <= min} onClick={() => commit(value - step)}>
          <MinusIcon className="h-6 w-6" />
        </button>
        <div className="relative min-w-0 flex-1">
          <input
            id={id}
            type="text"
            inputMode="decimal"
            autoComplete="off"
            className={`field-input pr-9 text-center text-lg font-semibold tabular-nums ${error ? 'border-blocked' : ''}`}
            value={text}
            onChange={(event) => typed(event.target.value)}
            onKeyDown={keys}
            onBlur={() => setDraft(null)}
            aria-invalid={error ? true : undefined}
            aria-describedby={described}
            disabled={disabled}
          />
          <span className="pointer-events-none absolute inset-y-0 right-3 flex items-center text-ground-700" aria-hidden="true">
            m
          </span>
        </div>
        <button type="button" className={buttonClass} aria-label={moreLabel} title={moreLabel} disabled={disabled || value >= max} onClick={() => commit(value + step)}>
          <PlusIcon className="h-6 w-6" />
        </button>
      </div>
      {help && (
        <p id={`${id}-help`} className="field-help">
          {help}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="field-error">
          {error}
        </p>
      )}
    </div>
  );
}
