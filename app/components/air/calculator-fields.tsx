// The fields of "What reaches my tool?": units, supply and line, tool, compressor and tank.
import type { CalculatorTool, TypedValues } from "~/air/calculator";
import { RUNNING_AIR_FACTOR } from "~/air/line";
import {
  COUPLER_LABELS,
  COUPLER_PROFILES,
  HOSE_BORES,
  LENGTH_UNITS,
  PRESSURE_UNITS,
  type PressureUnit,
  SYSTEM_UNITS,
} from "~/domain";
import { Field as FieldPrimitive, inputClass, Select as SelectPrimitive } from "~/components/field";
import type { FieldErrors } from "~/utils/forms";

export function CalculatorFields({
  values,
  errors,
  tools,
  metric,
  pu,
}: {
  values: TypedValues;
  errors: FieldErrors;
  tools: CalculatorTool[];
  metric: boolean;
  pu: PressureUnit;
}) {
  const u = SYSTEM_UNITS[metric ? "mm" : "in"];
  const field = { values, errors };
  return (
    <>
      <fieldset className="grid grid-cols-2 gap-3">
        <legend className="mb-1 font-semibold">Units</legend>
        <Select
          name="lu"
          label="System"
          value={values.lu}
          options={LENGTH_UNITS.map((s) => [s, [...new Set(Object.values(SYSTEM_UNITS[s]))].join(" · ")])}
        />
        <Select name="pu" label="Pressure" value={pu} options={PRESSURE_UNITS.map((p) => [p, p])} />
      </fieldset>
      <fieldset className="space-y-3">
        <legend className="mb-1 font-semibold">Supply and line</legend>
        <Field name="supply" label={`Regulator (or tank) pressure, ${pu}`} {...field} inputMode="decimal" />
        <Field name="hid" label={`Hose inside diameter, ${u.bore}`} {...field} list="hose-ids" />
        <datalist id="hose-ids">
          {HOSE_BORES.map((b) => (metric ? b.mmText : b.inText)).map((v) => (
            <option key={v} value={v} />
          ))}
        </datalist>
        <Field name="hlen" label={`Hose length, ${u.hose}`} {...field} inputMode="decimal" />
        <div className="grid grid-cols-2 gap-3">
          <Field name="wlen" label={`Whip length, ${u.hose} (if any)`} {...field} inputMode="decimal" />
          <Field name="wid" label={`Whip inside diameter, ${u.bore}`} {...field} list="hose-ids" />
        </div>
        <div className="grid grid-cols-[1fr_6rem] gap-3">
          <Select
            name="cp"
            label="Coupler profile"
            value={values.cp}
            options={COUPLER_PROFILES.map((k) => [k, COUPLER_LABELS[k]])}
          />
          <Field name="cc" label="Couplers" {...field} inputMode="numeric" />
        </div>
      </fieldset>
      <fieldset className="space-y-3">
        <legend className="mb-1 font-semibold">Tool</legend>
        <Select
          name="tool"
          label="From the catalogue"
          value={values.tool ?? ""}
          options={[["", "— type its air use instead —"], ...tools.map((t) => [t.slug, t.label] as [string, string])]}
        />
        {errors.tool && <p className="text-sm text-red-700">{errors.tool[0]}</p>}
        {!values.tool && (
          <>
            <Field name="cons" label={`Rated air use at 90 psi, ${u.flow}`} {...field} inputMode="decimal" />
            <Field name="run" label={`Air use while running, ${u.flow} (if known)`} {...field} inputMode="decimal" />
            <p className="text-xs text-stone-600">
              Left empty, we take {RUNNING_AIR_FACTOR}× the rated figure and say it is an estimate.
            </p>
          </>
        )}
      </fieldset>
      <fieldset className="space-y-3">
        <legend className="mb-1 font-semibold">Compressor and tank</legend>
        <Field name="comp" label={`Compressor delivery (free air), ${u.flow}`} {...field} inputMode="decimal" />
        <Field name="tank" label={`Tank size, ${u.volume}`} {...field} inputMode="decimal" />
        <div className="grid grid-cols-2 gap-3">
          <Field name="cout" label={`Cut-out, ${pu}`} {...field} inputMode="decimal" />
          <Field name="cin" label={`Cut-in, ${pu}`} {...field} inputMode="decimal" />
        </div>
      </fieldset>
    </>
  );
}

/** A calculator field: the shared Field, bound to the typed values and their errors. */
function Field({
  name,
  label,
  values,
  errors,
  ...rest
}: {
  name: string;
  label: string;
  values: TypedValues;
  errors: FieldErrors;
} & React.InputHTMLAttributes<HTMLInputElement>) {
  return (
    <FieldPrimitive id={name} label={label} labelClassName="text-sm font-semibold" error={errors[name]?.[0]}>
      {(control) => (
        <input
          name={name}
          defaultValue={values[name] ?? ""}
          {...control}
          className={inputClass}
          autoComplete="off"
          {...rest}
        />
      )}
    </FieldPrimitive>
  );
}

function Select({
  name,
  label,
  value,
  options,
}: {
  name: string;
  label: string;
  value: string | undefined;
  options: [string, string][];
}) {
  return (
    <SelectPrimitive
      id={name}
      name={name}
      label={label}
      labelClassName="text-sm font-semibold"
      defaultValue={value}
      options={options}
    />
  );
}
