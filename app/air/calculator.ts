// The /air page's logic, shared by its loader (the plain GET form) and the browser (live figures):
// which values to start from, and what a set of typed values works out to. Pure.
import { z } from "zod";
import { type LengthUnit, type PressureUnit, toolName } from "~/domain";
import type { FieldErrors } from "~/utils/forms";
import { CALCULATOR_DEFAULTS, calculatorSchema, toSupplyInput } from "./calculator-form";
import { analyseSupply, type SupplyAnalysis, type SupplyInput } from "./supply";

/** A catalogue tool the reader can pick instead of typing its air use. */
export interface CalculatorTool {
  slug: string;
  label: string;
  ratedLps: number;
}

export type CalculatorOutcome =
  | { ok: true; input: SupplyInput; result: SupplyAnalysis; pressureUnit: PressureUnit; metric: boolean }
  | { ok: false; errors: FieldErrors };

export type TypedValues = Record<string, string>;

export function calculatorTools(
  models: { slug: string; maker_name: string; model_code: string; category_name: string; rated_air_lps: number }[],
): CalculatorTool[] {
  return models.map((m) => ({ slug: m.slug, label: `${toolName(m.maker_name, m.model_code)} (${m.category_name})`, ratedLps: m.rated_air_lps }));
}

/** The address's values over the defaults of the reader's system (and their pressure unit, when signed in). */
export function startingValues(params: TypedValues, prefs: { pressureUnit: PressureUnit; lengthUnit: LengthUnit } | null): TypedValues {
  const metric = (params.lu ?? (prefs?.lengthUnit === "mm" ? "mm" : "in")) === "mm";
  const defaults = { ...CALCULATOR_DEFAULTS[metric ? "mm" : "in"], ...(prefs && !params.pu ? { pu: prefs.pressureUnit } : {}) };
  return { ...defaults, ...params };
}

/** The form's values after an edit; switching systems starts from that system's defaults rather than misreading the numbers. */
export function editedValues(previous: TypedValues, next: TypedValues): TypedValues {
  if (next.lu === previous.lu) return next;
  return { ...next, ...CALCULATOR_DEFAULTS[next.lu === "mm" ? "mm" : "in"], lu: next.lu ?? "in", tool: next.tool ?? "" };
}

/** Parse the typed values, then analyse the supply. */
export function evaluateCalculator(values: TypedValues, tools: CalculatorTool[]): CalculatorOutcome {
  const parsed = calculatorSchema.safeParse(values);
  if (!parsed.success) return { ok: false, errors: z.flattenError(parsed.error).fieldErrors as FieldErrors };
  const tool = parsed.data.tool ? tools.find((t) => t.slug === parsed.data.tool) : null;
  if (parsed.data.tool && !tool) return { ok: false, errors: { tool: ["No such tool in the catalogue"] } };
  const input = toSupplyInput(parsed.data, tool?.ratedLps ?? null);
  return { ok: true, input, result: analyseSupply(input), pressureUnit: parsed.data.pu, metric: parsed.data.lu === "mm" };
}
