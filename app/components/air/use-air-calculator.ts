import { useMemo, useState } from "react";
import { type CalculatorTool, editedValues, evaluateCalculator, type TypedValues } from "~/air/calculator";
import type { PressureUnit } from "~/domain";
import type { FieldErrors } from "~/utils/forms";

/**
 * The calculator's state in the browser: the typed values, worked out on every edit. Until the
 * reader edits, the errors shown are the server's (the plain GET form's).
 */
export function useAirCalculator(initial: TypedValues, tools: CalculatorTool[], serverErrors: FieldErrors) {
  const [values, setValues] = useState<TypedValues>(initial);
  const [touched, setTouched] = useState(false);
  const outcome = useMemo(() => evaluateCalculator(values, tools), [values, tools]);
  const errors: FieldErrors = outcome.ok ? {} : touched ? outcome.errors : serverErrors;

  function onChange(event: React.FormEvent<HTMLFormElement>) {
    const form = new FormData(event.currentTarget);
    setTouched(true);
    setValues(
      editedValues(values, Object.fromEntries([...form].map(([k, v]) => [k, typeof v === "string" ? v : v.name]))),
    );
  }

  return { values, outcome, errors, onChange, metric: values.lu === "mm", pu: (values.pu ?? "psi") as PressureUnit };
}
