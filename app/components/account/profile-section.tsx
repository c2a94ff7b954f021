import { Form } from "react-router";
import { buttonClass, cardClass } from "~/components/ui";
import { Field, inputClass, Select } from "~/components/field";
import type { FieldErrors } from "~/utils/forms";

/** One system for every figure you read and type; metric readers may keep bar for pressure. */
const UNIT_CHOICES = [
  ["us", "US customary: psi, 3/8 in, ft, SCFM, gal, lbf"],
  ["metric", "Metric: kPa, mm, m, l/s, l, N"],
  ["metric-bar", "Metric with bar: bar, mm, m, l/s, l, N"],
] as const;

/** The public handle and the choice of units, with the e-mail address kept private. */
export function ProfileSection({
  user,
  errors,
  values,
  busy,
}: {
  user: { handle: string; email: string; units: string };
  errors: FieldErrors;
  values: Record<string, unknown>;
  busy: boolean;
}) {
  const typed = (k: string, fallback: string) =>
    values.intent === "profile" && typeof values[k] === "string" ? values[k] : fallback;
  return (
    <section className={cardClass()} aria-labelledby="profile-heading">
      <h2 id="profile-heading" className="mb-2 text-lg font-semibold">
        Profile
      </h2>
      <p className="mb-3 text-sm text-stone-600">
        Your handle is the only name shown publicly. Your e-mail ({user.email}) is never shown or shared.
      </p>
      <Form method="post" className="grid gap-3 sm:grid-cols-2">
        <input type="hidden" name="intent" value="profile" />
        <Field id="handle" label="Public handle" error={errors.handle?.[0]} className="sm:col-span-2">
          {(control) => (
            <input name="handle" defaultValue={typed("handle", user.handle)} {...control} className={inputClass} />
          )}
        </Field>
        <Select
          id="units"
          name="units"
          label="Units for every figure"
          options={UNIT_CHOICES}
          defaultValue={typed("units", user.units)}
          className="sm:col-span-2"
        />
        <div className="sm:col-span-2">
          <button type="submit" disabled={busy} className={buttonClass("primary")}>
            Save profile
          </button>
        </div>
      </Form>
    </section>
  );
}
