// The report form's wording for its choices.
import type { INLET_SOURCES, OUTCOMES } from "~/reports/form-schema";

export const INLET_SOURCE_LABELS: Record<(typeof INLET_SOURCES)[number], string> = {
  measured_at_inlet: "Measured at the tool inlet while it ran",
  read_at_regulator: "Read at the regulator",
  estimated: "Estimated",
};
export const OUTCOME_LABELS: Record<(typeof OUTCOMES)[number], string> = {
  freed: "Freed it",
  freed_with_help: "Freed with help (heat, another tool)",
  not_freed: "Did not free it",
};
