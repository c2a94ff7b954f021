// The /air page's logic, shared by its loader (the plain GET form) and the browser (live figures):
// which values to start from, and what a set of typed values works out to. Pure.
import { z } from "zod";
import { type LengthUnit, type PressureUnit, toolName } from "~/domain";
import type { FieldErrors } from "~/utils/forms";
import { type AirAnalysis, type AirInput, analyseAir } from "./analysis";
import { CALCULATOR_DEFAULTS, calculatorSchema, toAirInput } from "./calculator-form";
import type { RunningAirSource, ToolAir } from "./line";

/** A catalogue tool the reader can pick instead of typing its air use. */
export interface CalculatorTool {
  slug: string;
  label: string;
  ratedLps: number;
  runningLps: number | null;
  runningSource: RunningAirSource | null;
  runningFactor: number | null;
}

export type CalculatorOutcome =
  | {
      ok: true;
      input: AirInput;
      result: AirAnalysis;
      toolFrom: "catalogue" | "typed";
      pressureUnit: PressureUnit;
      metric: boolean;
    }
  | { ok: false; errors: FieldErrors };

export type TypedValues = Record<string, string>;

export function calculatorTools(
  models: {
    slug: string;
    maker_name: string;
    model_code: string;
    category_name: string;
    rated_air_lps: number;
    running_air_lps: number | null;
    running_air_source: string | null;
    running_air_factor: number | null;
  }[],
): CalculatorTool[] {
  return models.map((m) => ({
    slug: m.slug,
    label: `${toolName(m.maker_name, m.model_code)} (${m.category_name})`,
    ratedLps: m.rated_air_lps,
    runningLps: m.running_air_lps,
    runningSource: runningSourceOf(m.running_air_source),
    runningFactor: m.running_air_factor,
  }));
}

const RUNNING_SOURCES: readonly RunningAirSource[] = ["maker_sheet", "measured", "estimated"];
const runningSourceOf = (s: string | null) =>
  (RUNNING_SOURCES as readonly (string | null)[]).includes(s) ? (s as RunningAirSource) : null;

/** A catalogue tool's two air figures, as the line model takes them. */
export const toolAir = (t: CalculatorTool): ToolAir => ({
  ratedLps: t.ratedLps,
  runningLps: t.runningLps,
  runningSource: t.runningSource,
  runningFactor: t.runningFactor,
});

/** The address's values over the defaults of the reader's system (and their pressure unit, when signed in). */
export function startingValues(
  params: TypedValues,
  prefs: { pressureUnit: PressureUnit; lengthUnit: LengthUnit } | null,
): TypedValues {
  const metric = (params.lu ?? (prefs?.lengthUnit === "mm" ? "mm" : "in")) === "mm";
  const defaults = {
    ...CALCULATOR_DEFAULTS[metric ? "mm" : "in"],
    ...(prefs && !params.pu ? { pu: prefs.pressureUnit } : {}),
  };
  return { ...defaults, ...params };
}

/** The form's values after an edit; switching systems starts from that system's defaults rather than misreading the numbers. */
export function editedValues(previous: TypedValues, next: TypedValues): TypedValues {
  if (next.lu === previous.lu) return next;
  return {
    ...next,
    ...CALCULATOR_DEFAULTS[next.lu === "mm" ? "mm" : "in"],
    lu: next.lu ?? "in",
    tool: next.tool ?? "",
  };
}

/** Parse the typed values, then analyse the air. */
export function evaluateCalculator(values: TypedValues, tools: CalculatorTool[]): CalculatorOutcome {
  const parsed = calculatorSchema.safeParse(values);
  if (!parsed.success) return { ok: false, errors: z.flattenError(parsed.error).fieldErrors };
  const tool = parsed.data.tool ? tools.find((t) => t.slug === parsed.data.tool) : null;
  if (parsed.data.tool && !tool) return { ok: false, errors: { tool: ["No such tool in the catalogue"] } };
  const input = toAirInput(parsed.data, tool ? toolAir(tool) : null);
  return {
    ok: true,
    input,
    result: analyseAir(input),
    toolFrom: tool ? "catalogue" : "typed",
    pressureUnit: parsed.data.pu,
    metric: parsed.data.lu === "mm",
  };
}
