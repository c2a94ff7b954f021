// Form primitives: a labelled control with its hint and error wired for assistive technology
// (aria-invalid, aria-describedby), a select and a group of radio choices. The ids follow
// conform's (`<id>-description`, `<id>-error`), so a conform field's own props agree with them.
import type { ReactNode } from "react";

export const inputClass =
  "mt-1 block w-full rounded border border-stone-300 px-3 py-3 text-base aria-[invalid]:border-red-600";

/** What a control needs to be described by its field: spread it onto the input, select or textarea. */
export interface ControlProps {
  id: string;
  "aria-invalid": true | undefined;
  "aria-describedby": string | undefined;
}

export function controlProps(id: string, error?: string, hint?: ReactNode): ControlProps {
  const describedBy = [hint ? `${id}-description` : "", error ? `${id}-error` : ""].filter(Boolean).join(" ");
  return { id, "aria-invalid": error ? true : undefined, "aria-describedby": describedBy || undefined };
}

export function FieldError({ id, message }: { id: string; message?: string }) {
  return message ? (
    <span id={`${id}-error`} className="mt-1 block text-sm text-red-700">
      {message}
    </span>
  ) : null;
}

interface FieldProps {
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  className?: string;
  labelClassName?: string;
  /** The control, given the id and aria attributes to spread onto it. */
  children: (control: ControlProps) => ReactNode;
}

/** A label, the control, an optional hint and the error, tied together by ids. */
export function Field({
  id,
  label,
  hint,
  error,
  className = "block",
  labelClassName = "font-semibold",
  children,
}: FieldProps) {
  return (
    <div className={className}>
      <label htmlFor={id} className={labelClassName}>
        {label}
      </label>
      {hint && (
        <span id={`${id}-description`} className="block text-sm text-stone-600">
          {hint}
        </span>
      )}
      {children(controlProps(id, error, hint))}
      <FieldError id={id} message={error} />
    </div>
  );
}

type Option = readonly [value: string, label: string];
type OptionGroup = { label: string; options: readonly Option[] };

interface SelectProps extends Omit<FieldProps, "children"> {
  name: string;
  options: readonly (Option | OptionGroup)[];
  defaultValue?: string;
  /** Extra props for the select (conform's getSelectProps, a key). */
  selectProps?: React.SelectHTMLAttributes<HTMLSelectElement>;
}

/** A labelled select; options are [value, label] pairs, or groups of them. */
export function Select({ name, options, defaultValue, selectProps, ...field }: SelectProps) {
  return (
    <Field {...field}>
      {(control) => (
        <select name={name} defaultValue={defaultValue} {...selectProps} {...control} className={inputClass}>
          {options.map((o) =>
            "options" in o ? (
              <optgroup key={o.label} label={o.label}>
                {o.options.map(([v, text]) => (
                  <option key={v} value={v}>
                    {text}
                  </option>
                ))}
              </optgroup>
            ) : (
              <option key={o[0]} value={o[0]}>
                {o[1]}
              </option>
            ),
          )}
        </select>
      )}
    </Field>
  );
}

interface RadioChoicesProps {
  id: string;
  name: string;
  /** The choices in order: value → label. */
  choices: Readonly<Record<string, ReactNode>>;
  legend?: ReactNode;
  legendClassName?: string;
  error?: string;
  defaultValue?: string;
  className?: string;
  choiceClassName?: string;
}

/** One radio per choice in a fieldset, the error below and tied to the group. */
export function RadioChoices({
  id,
  name,
  choices,
  legend,
  legendClassName = "font-semibold",
  error,
  defaultValue,
  className = "mt-1 grid gap-2",
  choiceClassName,
}: RadioChoicesProps) {
  const { "aria-describedby": describedBy, "aria-invalid": invalid } = controlProps(id, error);
  return (
    <fieldset aria-describedby={describedBy}>
      {legend && <legend className={legendClassName}>{legend}</legend>}
      <div className={className}>
        {Object.entries(choices).map(([value, label]) => (
          <label
            key={value}
            className={choiceClassName ?? "flex items-center gap-3 rounded border border-stone-300 px-3 py-3"}
          >
            <input
              type="radio"
              id={`${id}-${value}`}
              name={name}
              value={value}
              defaultChecked={defaultValue === value}
              aria-invalid={invalid}
              className="h-5 w-5"
            />
            <span>{label}</span>
          </label>
        ))}
      </div>
      <FieldError id={id} message={error} />
    </fieldset>
  );
}
