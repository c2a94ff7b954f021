// Registering a rig: a plain HTML form that works without JavaScript. Capacities are typed in the
// reader's unit for the rig's kind; the server converts them to SI.
import { Form } from "react-router";
import { RIG_KIND_LABELS, type RigKind } from "~/bench/terms";
import { rigUnit } from "~/bench/rig-form";
import type { Units } from "~/domain";
import { ErrorSummary } from "../error-summary";
import { Field, inputClass, Select } from "../field";
import { buttonClass, Card } from "../ui";

type Errors = Record<string, string[] | undefined>;

export const RIG_FIELD_LABELS = {
  name: "Name of the rig",
  kind: "What it measures",
  capacity: "Sensor capacity",
  sampleRateHz: "Sample rate (Hz)",
  fixture: "Anvil or fixture",
  checkToolModelId: "Check-standard tool",
  checkIntervalMonths: "A calibration counts for (months)",
} as const;

export function RigRegisterForm({
  tools,
  units,
  values,
  errors,
  formError,
}: {
  tools: { id: number; name: string; category: string }[];
  units: Units;
  values: Record<string, string>;
  errors: Errors;
  formError?: string;
}) {
  const err = (name: string) => errors[name]?.[0];
  const force = rigUnit("percussive_force", units).label;
  const torque = rigUnit("impact_torque", units).label;
  const text = (name: keyof typeof RIG_FIELD_LABELS, hint?: string, inputMode?: "decimal" | "numeric") => (
    <Field id={name} label={RIG_FIELD_LABELS[name]} hint={hint} error={err(name)}>
      {(control) => (
        <input
          name={name}
          type="text"
          inputMode={inputMode}
          defaultValue={values[name] ?? ""}
          className={inputClass}
          {...control}
        />
      )}
    </Field>
  );
  const group = (slug: string, label: string) => ({
    label,
    options: tools.filter((t) => t.category === slug).map((t) => [String(t.id), t.name] as const),
  });
  return (
    <Form method="post" action="/bench/rigs/new" className="space-y-6" noValidate>
      <ErrorSummary errors={errors} labels={RIG_FIELD_LABELS} />
      {formError && !Object.keys(RIG_FIELD_LABELS).some((k) => errors[k]?.length) && (
        <p role="alert" className="rounded border border-red-700 bg-red-50 p-3 text-red-900">
          {formError}
        </p>
      )}
      <Card as="section" aria-labelledby="rig-form-heading" className="space-y-4">
        <h2 id="rig-form-heading" className="font-semibold">
          The rig
        </h2>
        {text("name", "As your shop calls it, e.g. “East bay drop-anvil rig”.")}
        <Select
          id="kind"
          name="kind"
          label={RIG_FIELD_LABELS.kind}
          hint="A force rig reads a load cell; a torque fixture reads a torque transducer."
          error={err("kind")}
          defaultValue={values.kind ?? "percussive_force"}
          options={(Object.keys(RIG_KIND_LABELS) as RigKind[]).map((k) => [k, RIG_KIND_LABELS[k]] as const)}
        />
        {text("capacity", `In ${force} for a force rig, in ${torque} for a torque fixture.`, "decimal")}
        {text("sampleRateHz", "How many samples a second the sensor's logger records (100 to 100,000).", "numeric")}
        <Field
          id="fixture"
          label={RIG_FIELD_LABELS.fixture}
          hint="What the tool strikes or turns: the anvil's mass and mounting, or the fixture and its socket."
          error={err("fixture")}
        >
          {(control) => (
            <textarea name="fixture" rows={3} defaultValue={values.fixture ?? ""} className={inputClass} {...control} />
          )}
        </Field>
        <Select
          id="checkToolModelId"
          name="checkToolModelId"
          label={RIG_FIELD_LABELS.checkToolModelId}
          hint="The reference tool measured at the start of every session: an air hammer for a force rig, an impact wrench for a torque fixture."
          error={err("checkToolModelId")}
          defaultValue={values.checkToolModelId ?? ""}
          options={[
            ["", "None named yet"] as const,
            group("air-hammer", "Air hammers"),
            group("impact-wrench", "Impact wrenches"),
          ]}
        />
        {text(
          "checkIntervalMonths",
          "After this many months the rig is recalibrated (1 to 36; 12 is usual).",
          "numeric",
        )}
      </Card>
      <button type="submit" className={buttonClass()}>
        Register the rig
      </button>
    </Form>
  );
}
