// A set of large radio choices in a fieldset: the native radios keep keyboard use (arrow keys
// between options) and screen-reader names for free.
import { useId, type ReactNode } from 'react';

export type ChoiceOption<T extends string> = { value: T; label: string; hint?: string };

type Props<T extends string> = {
  legend: ReactNode;
  options: readonly ChoiceOption<T>[];
  value: T | null;
  onChange: (value: T) => void;
  /** Tailwind grid columns for the options, e.g. 'grid-cols-2'. */
  columns?: string;
  help?: string;
  disabled?: boolean;
  testId?: string;
};

/**
 * Radio choices as big tappable pills.
 *
 * @example <ChoiceGroup legend="Car size" options={[{ value: 'small', label: 'Small' }]} value="small" onChange={setSize} />
 */
export function ChoiceGroup<T extends string>({ legend, options, value, onChange, columns = 'grid-cols-2', help, disabled, testId }: Props<T>) {
  const name = useId();
  return (
    <fieldset disabled={disabled} data-testid={testId}>
      <legend className="field-label">{legend}</legend>
      {help && <p className="field-help -mt-0.5 mb-2">{help}</p>}
      <div className={`grid gap-2 ${columns}`}>
        {options.map((option) => (
          <label
            key={option.value}
            className="flex min-h-[48px] cursor-pointer items-center gap-2.5 rounded-md border border-ground-300 bg-white px-3 py-2 text-ground-900 hover:bg-ground-50 has-[:checked]:border-ground-700 has-[:checked]:bg-ground-50 has-[:checked]:ring-1 has-[:checked]:ring-ground-700 has-[:disabled]:cursor-not-allowed has-[:disabled]:opacity-60"
          >
            <input
              type="radio"
              name={name}
              value={option.value}
              checked={value === option.value}
              onChange={() => onChange(option.value)}
              className="h-5 w-5 shrink-0 accent-ground-700"
            />
            <span className="min-w-0">
              <span className="block font-semibold leading-tight">{option.label}</span>
              {option.hint && <span className="block text-sm leading-tight text-ground-700">{option.hint}</span>}
            </span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}
