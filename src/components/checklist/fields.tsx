// The checklist's inputs: each labelled, with its help, error and warning tied to it by
// aria-describedby, and each queueing a save as the customer types or chooses.
import type { ChangeEvent, FocusEvent, HTMLAttributes, ReactNode } from 'react';
import { get, useFormState, useWatch } from 'react-hook-form';
import { InfoIcon, StopIcon, WarningIcon } from '@/components/icons';
import { fieldId, useChecklist } from './checklist-context';
import { fieldByPath, type Option } from './field-defs';

type Common = {
  path: string;
  /** Overrides the label from field-defs. */
  label?: string;
  /** Short help shown under the label at all times. */
  help?: ReactNode;
  /** Anything shown under the input (longer help, a region read back). */
  children?: ReactNode;
  /** Advice that never blocks a save, shown in amber. */
  warning?: string | null;
  /** Text read with the field (e.g. the region found for an MPAN), shown under it. */
  confirmation?: ReactNode;
};

/** The words on an answer filled in from the invitation, until the customer confirms it. */
export const PREFILLED_MARK = 'From your installer — please check';

function PrefilledMark({ path }: { path: string }) {
  const { prefilled } = useChecklist();
  if (!prefilled?.has(path)) return null;
  return (
    <p id={`${fieldId(path)}-prefilled`} className="mb-1.5 inline-flex items-center gap-1.5 rounded-full bg-clay-50 px-2.5 py-0.5 text-sm font-semibold text-clay-700" data-testid={`${fieldId(path)}-prefilled`}>
      <InfoIcon className="h-4 w-4" /> {PREFILLED_MARK}
    </p>
  );
}

/** A field's short help; folded behind "Help with this question" once the question was answered on an earlier visit. */
function FieldHelp({ id, path, className, children }: { id: string; path: string; className: string; children: ReactNode }) {
  const { helpRead } = useChecklist();
  if (helpRead?.has(path)) {
    return (
      <details id={`${id}-help`} className={`${className} group`} data-testid={`${id}-help-folded`}>
        <summary className="cursor-pointer list-none text-sm font-semibold text-ground-700 [&::-webkit-details-marker]:hidden">
          <span className="group-open:hidden">Show help with this question</span>
          <span className="hidden group-open:inline">Hide help</span>
        </summary>
        <div className="mt-1">{children}</div>
      </details>
    );
  }
  return (
    <div id={`${id}-help`} className={className}>
      {children}
    </div>
  );
}

function useFieldError(path: string): string | undefined {
  const { form } = useChecklist();
  const { errors } = useFormState({ control: form.control, name: path });
  return (get(errors, path) as { message?: string } | undefined)?.message;
}

function describedBy(id: string, parts: { help?: unknown; error?: unknown; warning?: unknown; confirmation?: unknown }) {
  const ids = [
    parts.help ? `${id}-help` : null,
    parts.error ? `${id}-error` : null,
    parts.warning ? `${id}-warning` : null,
    parts.confirmation ? `${id}-confirmation` : null,
  ].filter(Boolean);
  return ids.length > 0 ? ids.join(' ') : undefined;
}

function Messages({ id, error, warning, confirmation }: { id: string; error?: string; warning?: string | null; confirmation?: ReactNode }) {
  return (
    <>
      {error && (
        <p id={`${id}-error`} className="field-error flex items-start gap-1.5" data-testid={`${id}-error`}>
          <StopIcon className="mt-0.5 h-4 w-4" />
          <span>{error}</span>
        </p>
      )}
      {!error && warning && (
        <p id={`${id}-warning`} className="mt-2 flex items-start gap-2 rounded-md border border-attention/40 bg-attention-soft p-2.5 text-sm text-ink" data-testid={`${id}-warning`}>
          <WarningIcon className="mt-0.5 h-4 w-4 text-attention" />
          <span>
            <span className="font-semibold text-attention">Please check: </span>
            {warning}
          </span>
        </p>
      )}
      {!error && confirmation && (
        <div id={`${id}-confirmation`} className="mt-2" data-testid={`${id}-confirmation`}>
          {confirmation}
        </div>
      )}
    </>
  );
}

type TextFieldProps = Common & {
  type?: 'text' | 'email' | 'tel' | 'date';
  inputMode?: HTMLAttributes<HTMLInputElement>['inputMode'];
  autoComplete?: string;
  /** Tidies the value when the customer leaves the field (e.g. a postcode's spacing). */
  normalise?: (value: string) => string;
  /** Runs on each keystroke, e.g. to check an MPAN as soon as all 13 digits are in. */
  onType?: (value: string) => void;
  multiline?: boolean;
  placeholder?: string;
  /** Narrower inputs for short answers (postcode, registration). */
  size?: 'full' | 'short';
  autoCapitalize?: string;
  spellCheck?: boolean;
};

/** A labelled text input (or textarea) that saves as the customer types. */
export function TextField(props: TextFieldProps) {
  const { path, type = 'text', normalise, onType, multiline, size = 'full' } = props;
  const { form, edit } = useChecklist();
  const error = useFieldError(path);
  const id = fieldId(path);
  const reg = form.register(path);
  const label = props.label ?? fieldByPath[path]?.label ?? path;
  const { prefilled } = useChecklist();
  const described = describedBy(id, { help: props.help, error, warning: props.warning, confirmation: props.confirmation });
  const describedby = prefilled?.has(path) ? [`${id}-prefilled`, described].filter(Boolean).join(' ') : described;

  const onChange = (e: ChangeEvent<HTMLInputElement | HTMLTextAreaElement>) => {
    void reg.onChange(e);
    edit(path, e.target.value, 'soon');
    onType?.(e.target.value);
  };
  const onBlur = (e: FocusEvent<HTMLInputElement | HTMLTextAreaElement>) => {
    const tidy = normalise ? normalise(e.target.value) : e.target.value;
    if (tidy !== e.target.value) form.setValue(path, tidy);
    void reg.onBlur(e);
    edit(path, tidy, 'now');
  };
  const shared = {
    ...reg,
    id,
    onChange,
    onBlur,
    className: `field-input ${size === 'short' ? 'max-w-[14rem]' : ''} ${error ? 'border-blocked focus:border-blocked focus:ring-blocked/20' : ''}`,
    'aria-invalid': error ? true : undefined,
    'aria-describedby': describedby,
    // Drawn into the server's HTML, so the answer shows before the script runs.
    defaultValue: String(form.getValues(path) ?? ''),
    placeholder: props.placeholder,
    spellCheck: props.spellCheck,
  };

  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <PrefilledMark path={path} />
      {props.help && (
        <FieldHelp id={id} path={path} className="field-help mb-1.5 mt-0">
          {props.help}
        </FieldHelp>
      )}
      {multiline ? (
        <textarea {...shared} rows={3} />
      ) : (
        <input
          {...shared}
          type={type}
          inputMode={props.inputMode}
          autoComplete={props.autoComplete ?? 'off'}
          autoCapitalize={props.autoCapitalize}
        />
      )}
      <Messages id={id} error={error} warning={props.warning} confirmation={props.confirmation} />
      {props.children}
    </div>
  );
}

type NumberFieldProps = Common & { integer?: boolean; placeholder?: string };

/** A number with its unit beside it (kW, m); a decimal keypad on phones. */
export function NumberField(props: NumberFieldProps) {
  const { path, integer } = props;
  const { form, edit } = useChecklist();
  const error = useFieldError(path);
  const id = fieldId(path);
  const def = fieldByPath[path];
  const reg = form.register(path);
  const label = props.label ?? def?.label ?? path;
  const describedby = describedBy(id, { help: props.help, error });

  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      {props.help && (
        <FieldHelp id={id} path={path} className="field-help mb-1.5 mt-0">
          {props.help}
        </FieldHelp>
      )}
      <div className="flex max-w-[14rem] items-stretch">
        <input
          {...reg}
          id={id}
          type="text"
          inputMode={integer ? 'numeric' : 'decimal'}
          autoComplete="off"
          placeholder={props.placeholder}
          defaultValue={String(form.getValues(path) ?? '')}
          className={`field-input ${def?.unit ? 'rounded-r-none' : ''} ${error ? 'border-blocked' : ''}`}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedby}
          onChange={(e) => {
            void reg.onChange(e);
            edit(path, e.target.value, 'soon');
          }}
          onBlur={(e) => {
            void reg.onBlur(e);
            edit(path, e.target.value, 'now');
          }}
        />
        {def?.unit && (
          <span className="flex min-w-[3rem] items-center justify-center rounded-r-md border border-l-0 border-ground-300 bg-ground-50 px-3 font-semibold text-ground-800" aria-hidden="true">
            {def.unit}
          </span>
        )}
      </div>
      {def?.unit && <span className="sr-only">Unit: {def.unit === 'kW' ? 'kilowatts' : 'metres'}</span>}
      <Messages id={id} error={error} />
      {props.children}
    </div>
  );
}

type ChoiceFieldProps = Common & {
  options?: Option[];
  /** Two columns from small screens up, for short options such as Yes / No. */
  columns?: 1 | 2 | 3;
  /** Runs after a choice, with the new value. */
  onChoose?: (value: string) => void;
  /** Shown beside the options (e.g. a picture that illustrates them). */
  aside?: ReactNode;
};

/** A question answered by one of several cards (radio buttons); saves as soon as one is chosen. */
export function ChoiceField(props: ChoiceFieldProps) {
  const { path, columns = 1 } = props;
  const { form, edit } = useChecklist();
  const error = useFieldError(path);
  const id = fieldId(path);
  const def = fieldByPath[path];
  const options = props.options ?? def?.options ?? [];
  const reg = form.register(path);
  const label = props.label ?? def?.label ?? path;
  const chosen = String(form.getValues(path) ?? '');
  const grid = columns === 3 ? 'grid-cols-3' : columns === 2 ? 'grid-cols-2' : 'grid-cols-1';

  const cards = (
    <div className={`grid min-w-0 flex-1 gap-2 ${grid}`}>
      {options.map((option) => {
        const optionId = `${id}-${option.value}`;
        return (
          <label
            key={option.value}
            htmlFor={optionId}
            className={`${option.wide ? 'col-span-full' : ''} flex min-h-[48px] cursor-pointer items-start gap-3 rounded-lg border-2 border-ground-100 bg-white p-3 transition-colors hover:border-ground-300 has-[:checked]:border-ground-600 has-[:checked]:bg-ground-50 has-[:focus-visible]:ring-4 has-[:focus-visible]:ring-clay-300 has-[:disabled]:cursor-not-allowed has-[:disabled]:opacity-70`}
          >
            <input
              {...reg}
              id={optionId}
              type="radio"
              value={option.value}
              defaultChecked={chosen === option.value}
              className="mt-0.5 h-5 w-5 shrink-0 accent-ground-700"
              aria-labelledby={`${optionId}-label`}
              aria-describedby={option.hint ? `${optionId}-hint` : undefined}
              onChange={(e) => {
                void reg.onChange(e);
                edit(path, e.target.value, 'now');
                props.onChoose?.(e.target.value);
              }}
            />
            <span className="min-w-0">
              <span id={`${optionId}-label`} className="block font-semibold text-ground-900">
                {option.label}
              </span>
              {option.hint && (
                <span id={`${optionId}-hint`} className="mt-0.5 block text-sm text-ground-700">
                  {option.hint}
                </span>
              )}
            </span>
          </label>
        );
      })}
    </div>
  );

  return (
    <fieldset aria-describedby={describedBy(id, { help: props.help, error })} data-testid={id}>
      <legend className="field-label">{label}</legend>
      {props.help && (
        <FieldHelp id={id} path={path} className="field-help mb-2 mt-0">
          {props.help}
        </FieldHelp>
      )}
      {props.aside ? (
        <div className="flex items-start gap-3">
          {cards}
          {props.aside}
        </div>
      ) : (
        cards
      )}
      <Messages id={id} error={error} />
      {props.children}
    </fieldset>
  );
}

/** The current form value of a field, re-rendering when it changes. */
export function useFieldValue(path: string): string {
  const { form } = useChecklist();
  const value = useWatch({ control: form.control, name: path });
  return typeof value === 'string' ? value : '';
}
