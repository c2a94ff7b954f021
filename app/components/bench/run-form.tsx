// The bench run form: a plain HTML form that works without JavaScript for typed peaks; with
// JavaScript each trial can take a trace CSV, previewed in the browser before it is submitted.
import { Form } from "react-router";
import type { BenchEditorData } from "~/bench/editor.server";
import { fieldName } from "~/bench/run-form";
import { benchUnit } from "~/bench/terms";
import { toolName, type Units } from "~/domain";
import { Field, inputClass, RadioChoices, Select } from "../field";
import { buttonClass, Card, cardClass } from "../ui";
import { SeriesLine } from "./protocol";
import { TraceUpload } from "./trace-upload";

type Errors = Record<string, string[] | undefined>;

export function RunChooser({
  rigs,
  protocols,
  rigId,
}: Pick<BenchEditorData, "rigs" | "protocols"> & { rigId: number | null }) {
  return (
    <Form method="get" className="space-y-4">
      <Select
        id="rig"
        name="rig"
        label="Rig"
        defaultValue={rigId == null ? undefined : String(rigId)}
        options={rigs.map((r) => [String(r.id), r.name] as const)}
      />
      <Select
        id="protocol"
        name="protocol"
        label="Protocol version"
        hint="A run follows one version; the newest of each is listed."
        options={protocols.map((p) => [`${p.slug}@${p.version}`, `${p.title}, version ${p.version}`] as const)}
      />
      <button type="submit" className={buttonClass()}>
        Continue
      </button>
    </Form>
  );
}

export function BenchRunForm({
  rig,
  protocol,
  models,
  units,
  values,
  errors,
  formError,
  runId,
}: {
  runId: number | null;
  rig: NonNullable<BenchEditorData["rig"]>;
  protocol: NonNullable<BenchEditorData["protocol"]>;
  models: BenchEditorData["models"];
  units: Units;
  values: Record<string, string>;
  errors: Errors;
  formError?: string;
}) {
  const err = (name: string) => errors[name]?.[0];
  const { label: unit } = benchUnit(protocol.quantity, units);
  const ref = `${protocol.slug}@${protocol.version}`;
  // Spelled out so the server and the browser write the same address (the query keeps a 400 on this form).
  const action =
    runId != null ? `/bench/runs/${runId}/edit` : `/bench/runs/new?rig=${rig.id}&protocol=${encodeURIComponent(ref)}`;
  const text = (name: string, label: string, hint?: string, type = "text") => (
    <Field id={name} label={label} hint={hint} error={err(name)}>
      {(control) => (
        <input name={name} type={type} defaultValue={values[name] ?? ""} className={inputClass} {...control} />
      )}
    </Field>
  );
  return (
    <Form method="post" action={action} className="space-y-6" noValidate>
      <input type="hidden" name="rig" value={rig.id} />
      <input type="hidden" name="protocol" value={ref} />
      {formError && (
        <p role="alert" className="rounded border border-red-700 bg-red-50 p-3 text-red-900">
          {formError}
        </p>
      )}
      <Card as="section" aria-labelledby="unit-heading" className="space-y-4">
        <h2 id="unit-heading" className="font-semibold">
          {rig.name} · {protocol.title}, version {protocol.version}
        </h2>
        <Select
          id="toolModelId"
          name="toolModelId"
          label="Tool"
          error={err("toolModelId")}
          defaultValue={values.toolModelId}
          options={models.map((m) => [String(m.id), toolName(m.maker_name, m.model_code)] as const)}
        />
        {text("unitSerial", "Unit serial number")}
        <RadioChoices
          id="unitCondition"
          name="unitCondition"
          legend="The unit is"
          choices={{ new: "New", used: "Used" }}
          defaultValue={values.unitCondition ?? "new"}
          error={err("unitCondition")}
        />
        {text("unitHours", "Hours in use (used units)", "Leave empty for a new unit.")}
        {text("runOn", "Day of the run", "YYYY-MM-DD", "date")}
        {text("operator", "Operator", "Who ran the rig.")}
        {text("ambientC", "Room temperature (°C)")}
      </Card>
      {protocol.series.map((s) => (
        <fieldset key={s.id} className={cardClass("md", "space-y-4")}>
          <legend className="px-1">
            <SeriesLine s={s} units={units} />
          </legend>
          <div className="grid gap-3 sm:grid-cols-2">
            {text(fieldName.staticKpa(s.position), `Inlet standing (${units.pressure})`)}
            {text(fieldName.runningKpa(s.position), `Inlet while running (${units.pressure})`)}
          </div>
          {Array.from({ length: protocol.trials_per_series }, (_, i) => i + 1).map((t) => {
            const peaks = fieldName.peaks(s.position, t);
            const trace = fieldName.trace(s.position, t);
            return (
              <div key={t} className="space-y-2 border-t border-stone-100 pt-3">
                <Field
                  id={peaks}
                  label={`Trial ${t}: peak of each blow (${unit})`}
                  hint="Numbers separated by spaces, commas or new lines; or upload the trace below."
                  error={err(peaks)}
                >
                  {(control) => (
                    <textarea
                      name={peaks}
                      rows={2}
                      defaultValue={values[peaks] ?? ""}
                      className={inputClass}
                      {...control}
                    />
                  )}
                </Field>
                <TraceUpload
                  name={trace}
                  label={`Trial ${t} trace (CSV)`}
                  rigId={rig.id}
                  capacity={rig.sensor_capacity}
                  discardBlows={protocol.blows_discarded}
                  quantity={protocol.quantity}
                  units={units}
                  initialKey={values[trace] ?? ""}
                  error={err(trace)}
                />
              </div>
            );
          })}
        </fieldset>
      ))}
      <Field id="notes" label="Notes (optional)" error={err("notes")}>
        {(control) => (
          <textarea name="notes" rows={3} defaultValue={values.notes ?? ""} className={inputClass} {...control} />
        )}
      </Field>
      <div className="flex flex-wrap gap-3">
        <button type="submit" name="intent" value="submit" className={buttonClass()}>
          Submit for review
        </button>
        <button type="submit" name="intent" value="draft" className={buttonClass("plain")}>
          Save as draft
        </button>
      </div>
    </Form>
  );
}
