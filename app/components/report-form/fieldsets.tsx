// The report form's sections. Each takes the conform fields it fills; units follow the account.
import { getTextareaProps } from "@conform-to/react";
import { type ReactNode, useEffect, useRef, useState } from "react";
import {
  CORROSION_LEVELS,
  COUPLER_LABELS,
  COUPLER_PROFILES,
  formatHoseId,
  formatHoseLength,
  formatPressure,
  INLET_SOURCE_CHOICES,
  type LengthUnit,
  OUTCOME_CHOICES,
  parseMeasure,
  pressureToKpa,
  type PressureUnit,
  toSi,
  VEHICLE_CLASSES,
  VEHICLE_LABELS,
} from "~/domain";
import { Field, inputClass } from "~/components/field";
import { cx } from "~/components/ui";
import { SafetyCautions } from "~/components/safety-cautions";
import { aboveRatedInlet } from "~/moderation/flags";
import { groupBy } from "~/utils/group";
import { RadioField, SelectField, TextField } from "./conform-fields";
import type { ReportFields } from "./hooks";
import { type ToolChoice, ToolPicker } from "./tool-picker";

/** A radio choice the whole width of a gloved thumb: the label is the target, at least 48 px tall. */
const PICKED =
  "cursor-pointer rounded border border-stone-300 has-[:checked]:border-bay-700 has-[:checked]:bg-bay-50 has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-bay-700 [&_input]:h-6 [&_input]:w-6 [&_input]:shrink-0 [&_input]:accent-bay-700";
const CHOICE = cx(PICKED, "flex min-h-12 items-center gap-3 px-3 py-2");
/** One of five ratings in a row: the number under its radio, so five fit across a phone. */
const RATING = cx(PICKED, "flex min-h-14 min-w-0 flex-1 flex-col items-center justify-center gap-1 py-1");

export function Section({ legend, children }: { legend: string; children: ReactNode }) {
  return (
    <fieldset className="min-w-0 space-y-4 rounded-lg border border-stone-200 bg-white p-4">
      <legend className="px-1 text-lg font-semibold">{legend}</legend>
      {children}
    </fieldset>
  );
}

interface Job {
  slug: string;
  name: string;
  category_slug: string;
  category_name: string;
}

export function ToolAndJob({
  fields,
  tool,
  jobs,
  metric,
  onPick,
}: {
  fields: ReportFields;
  tool: ToolChoice | null;
  jobs: Job[];
  metric: boolean;
  onPick: (tool: ToolChoice | null) => void;
}) {
  const jobGroups = [
    ...groupBy(
      jobs.filter((j) => !tool?.categorySlug || j.category_slug === tool.categorySlug),
      (j) => j.category_name,
    ),
  ].map(([label, list]) => ({ label, options: list.map((j) => [j.slug, j.name] as const) }));
  return (
    <Section legend="Tool and job">
      <ToolPicker initial={tool} error={fields.toolModel.errors?.[0]} onPick={onPick} />
      <SelectField
        key={`job-${tool?.categorySlug ?? "all"}`}
        field={fields.jobType}
        label="Job"
        options={[["", "— pick the job —"], ...jobGroups]}
      />
      <div className="grid grid-cols-2 gap-3">
        <SelectField
          field={fields.vehicleClass}
          label="Vehicle"
          options={[["", "—"], ...VEHICLE_CLASSES.map((v) => [v, VEHICLE_LABELS[v] ?? v] as const)]}
        />
        <SelectField
          field={fields.corrosion}
          label="Corrosion"
          options={[["", "—"], ...CORROSION_LEVELS.map((c) => [c, c] as const)]}
        />
      </div>
      <OptionalFold
        summary="The part's age and the bit or socket"
        members={[fields.componentAge, fields.attachment, fields.attachmentLength]}
      >
        <div className="grid grid-cols-2 gap-3">
          <TextField label="Part age, years" field={fields.componentAge} inputMode="numeric" />
          <TextField
            label={`Bit or socket length, ${metric ? "mm" : "in"}`}
            field={fields.attachmentLength}
            inputMode="decimal"
          />
        </div>
        <TextField label="Bit or socket used" field={fields.attachment} placeholder="e.g. pickle fork, tapered punch" />
      </OptionalFold>
      {tool?.action === "percussive" && <SafetyCautions action="percussive" />}
    </Section>
  );
}

type Supply = Record<
  "regulator" | "hoseId" | "hoseLength" | "couplerProfile" | "couplerCount" | "compressor" | "tank",
  string
>;

interface SupplyProps {
  fields: ReportFields;
  pu: PressureUnit;
  lu: LengthUnit;
  supplies: Supply[];
  inletTyped: string;
  tool: ToolChoice | null;
  onReuse: (supply: Supply) => void;
}

export function AirSupply({ fields, pu, lu, supplies, inletTyped, tool, onReuse }: SupplyProps) {
  const metric = lu === "mm";
  const inletKpa = Number(inletTyped) > 0 ? pressureToKpa(Number(inletTyped), pu) : 0;
  const overRated = tool != null && aboveRatedInlet(inletKpa, tool.maxInletKpa);
  return (
    <Section legend="Air supply">
      {supplies.length > 0 && (
        <div>
          <p className="text-sm font-semibold">Your recent supplies — tap to reuse</p>
          <div className="mt-1 flex flex-wrap gap-2">
            {supplies.map((s, i) => (
              <button
                key={i}
                type="button"
                onClick={() => onReuse(s)}
                className="min-h-11 rounded-full border border-bay-700 px-4 py-2 text-sm text-bay-700"
              >
                {formatPressure(pressureToKpa(parseMeasure(s.regulator), pu), pu)} ·{" "}
                {formatHoseId(toSi("bore", parseMeasure(s.hoseId), lu), lu)} ×{" "}
                {formatHoseLength(toSi("hose", parseMeasure(s.hoseLength), lu), lu)}
                {s.couplerCount ? ` · ${s.couplerCount} couplers` : ""}
              </button>
            ))}
          </div>
        </div>
      )}
      <div className="grid grid-cols-2 gap-3">
        <TextField label={`Regulator, ${pu}`} field={fields.regulator} inputMode="decimal" />
        <TextField label={`At the tool inlet, ${pu}`} field={fields.inlet} inputMode="decimal" />
      </div>
      <RadioField
        field={fields.inletSource}
        legend="How did you get the inlet pressure?"
        choices={INLET_SOURCE_CHOICES}
        choiceClassName={CHOICE}
      />
      {overRated && (
        <p role="alert" className="rounded border-l-4 border-red-600 bg-red-50 p-3 text-sm">
          That is above this tool's rated inlet pressure. Running a tool over its rating can break bits, retainers and
          the tool itself: follow the maker's instructions. The report will be flagged for the moderators.
        </p>
      )}
      <div className="grid grid-cols-2 gap-3">
        <TextField
          label={`Hose inside diameter, ${metric ? "mm" : "in"}`}
          field={fields.hoseId}
          placeholder={metric ? "9.5" : "3/8"}
        />
        <TextField label={`Hose length, ${metric ? "m" : "ft"}`} field={fields.hoseLength} inputMode="decimal" />
        <TextField label="How many couplers" field={fields.couplerCount} inputMode="numeric" />
      </div>
      <OptionalFold
        summary="Coupler profile, compressor and tank"
        members={[fields.couplerProfile, fields.compressor, fields.tank]}
      >
        <SelectField
          field={fields.couplerProfile}
          label="Coupler profile"
          options={[["", "— profile —"], ...COUPLER_PROFILES.map((k) => [k, COUPLER_LABELS[k]] as const)]}
        />
        <div className="grid grid-cols-2 gap-3">
          <TextField
            label={`Compressor delivery, ${metric ? "l/s" : "SCFM"}`}
            field={fields.compressor}
            inputMode="decimal"
          />
          <TextField label={`Tank, ${metric ? "l" : "gal"}`} field={fields.tank} inputMode="decimal" />
        </div>
      </OptionalFold>
    </Section>
  );
}

const TRIGGER_RATINGS = { 1: "1", 2: "2", 3: "3", 4: "4", 5: "5" };

export function Result({ fields }: { fields: ReportFields }) {
  return (
    <Section legend="Result">
      <RadioField
        field={fields.outcome}
        legend="How did it end?"
        choices={OUTCOME_CHOICES}
        className="mt-1 grid gap-2"
        choiceClassName={CHOICE}
      />
      <div className="grid grid-cols-2 gap-3">
        <TextField label="Time to result" field={fields.time} placeholder="45 s, 3 min, 1:30" />
        <TextField label="Attempts" field={fields.attempts} inputMode="numeric" />
      </div>
      <RadioField
        field={fields.triggerControl}
        legend="Trigger control (1 = hard to feather, 5 = easy)"
        choices={TRIGGER_RATINGS}
        className="mt-1 flex gap-2"
        choiceClassName={RATING}
      />
    </Section>
  );
}

export function Notes({ fields }: { fields: ReportFields }) {
  return (
    <Section legend="Notes">
      <Field id={fields.notes.id} label="Notes" labelClassName="sr-only" error={fields.notes.errors?.[0]}>
        {(control) => (
          <textarea
            {...getTextareaProps(fields.notes)}
            {...control}
            rows={4}
            className={inputClass}
            placeholder="Penetrant, heat, anything a moderator should know"
          />
        )}
      </Field>
    </Section>
  );
}

type Member = ReportFields[keyof ReportFields];

/**
 * Fields not every report needs, folded away so the first screen holds what does. Open from the
 * start when one of them is filled in, and opened whenever one of them has an error to show.
 */
function OptionalFold({ summary, members, children }: { summary: string; members: Member[]; children: ReactNode }) {
  const ref = useRef<HTMLDetailsElement>(null);
  const [filled] = useState(() => members.some((f) => typeof f.initialValue === "string" && f.initialValue !== ""));
  const failing = members.some((f) => f.errors?.length);
  useEffect(() => {
    if (failing && ref.current) ref.current.open = true;
  }, [failing]);
  return (
    <details ref={ref} open={filled} className="group rounded border border-stone-200">
      <summary className="flex min-h-12 cursor-pointer list-none items-center gap-2 px-3 py-2 font-semibold text-bay-700 [&::-webkit-details-marker]:hidden">
        <span aria-hidden className="inline-block transition-transform group-open:rotate-90">
          ▸
        </span>
        {summary} <span className="font-normal text-stone-600">(optional)</span>
      </summary>
      <div className="space-y-4 border-t border-stone-200 p-3">{children}</div>
    </details>
  );
}
