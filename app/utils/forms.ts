import { data } from "react-router";
import { z } from "zod";

export type FieldErrors = Record<string, string[] | undefined>;

/**
 * Parses a submitted form with its zod schema. On failure the caller returns `invalid(...)`:
 * a 400 with the field errors and every value the user typed, so nothing is lost.
 */
export function parseForm<S extends z.ZodType>(schema: S, formData: FormData) {
  const values = Object.fromEntries([...formData.keys()].map((k) => {
    const all = formData.getAll(k).filter((v): v is string => typeof v === "string");
    return [k, all.length > 1 ? all : all[0] ?? ""];
  }));
  const parsed = schema.safeParse(values);
  if (parsed.success) return { ok: true as const, data: parsed.data as z.output<S>, values };
  return { ok: false as const, errors: z.flattenError(parsed.error).fieldErrors as FieldErrors, values };
}

export function invalid(errors: FieldErrors, values: Record<string, unknown>, formError?: string) {
  return data({ ok: false as const, errors, values, formError }, { status: 400 });
}
