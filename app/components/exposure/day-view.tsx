// The day calculator: rows of tool, job and jobs per day (a GET form, so the day lives in the URL and
// works without JavaScript), then the day's vibration and noise with intervals and the pictures.
import { Form, Link } from "react-router";
import { formatDuration, formatVibration } from "~/domain";
import { MAX_DAY_ROWS, type DayRowInput } from "~/exposure";
import type { DayCalculator } from "~/exposure/pages.server";
import { Field, inputClass, Select } from "../field";
import { BasisChoice, BasisNote } from "./basis-fields";
import { ExposureCautions } from "./cautions";
import { DayFigures, shareText, TIME_FROM, withInterval } from "./figures";

const EXAMPLE =
  "/day?tool=brackwater-bh-150&job=ball-joint-separation&n=6&tool=brackwater-bh-150&job=tie-rod-end-release&n=4";

function groupBy<T extends { category_name: string }>(
  items: readonly T[],
  option: (t: T) => readonly [string, string],
) {
  const groups = new Map<string, (readonly [string, string])[]>();
  for (const item of items) groups.set(item.category_name, [...(groups.get(item.category_name) ?? []), option(item)]);
  return [...groups].map(([label, options]) => ({ label, options }));
}

export function DayView({ tools, jobs, rows, basis, errors, worked, day }: DayCalculator) {
  const toolOptions = [["", "Pick a tool"] as const, ...groupBy(tools, (t) => [t.slug, t.label] as const)];
  const jobOptions = [["", "Pick a job"] as const, ...groupBy(jobs, (j) => [j.slug, j.name] as const)];
  const shown: DayRowInput[] = rows.length < MAX_DAY_ROWS ? [...rows, { tool: "", job: "", n: "", min: "" }] : rows;
  const problems = Object.keys(errors).length;
  return (
    <div className="space-y-6">
      <header className="space-y-1">
        <h1 className="text-2xl font-bold">A day on the tools</h1>
        <p className="text-stone-700">
          Put together a working day — which tool, which job, how many a day — and see what it adds up to for your hands
          and ears, from the makers' declared figures and the times technicians report.
        </p>
        {rows.length === 0 && (
          <p className="text-sm">
            <Link to={EXAMPLE} className="text-bay-700 underline">
              Try an example day: six ball joints and four tie rod ends with one hammer
            </Link>
          </p>
        )}
      </header>

      {/* Keyed by what it was filled from: the fields take their values as defaults, and a select keeps
          its first default, so a day reached by a link or a submit with JavaScript starts a fresh form. */}
      <Form
        key={JSON.stringify([rows, basis])}
        method="get"
        className="space-y-4"
        aria-describedby={problems ? "day-problems" : undefined}
      >
        {problems > 0 && (
          <p id="day-problems" role="alert" className="text-red-700">
            {problems === 1 ? "One thing needs" : `${problems} things need`} changing before the day can be worked out.
            {errors.rows ? ` ${errors.rows}.` : ""}
          </p>
        )}
        <ol className="space-y-4">
          {shown.map((row, i) => (
            <li key={i} className="rounded-lg border border-stone-200 p-3">
              <fieldset className="grid gap-3 sm:grid-cols-2">
                <legend className="font-semibold">
                  {i < rows.length ? `Row ${i + 1}` : rows.length === 0 ? "Row 1" : "Add a row"}
                </legend>
                <Select
                  id={`tool-${i}`}
                  name="tool"
                  label="Tool"
                  options={toolOptions}
                  defaultValue={row.tool}
                  error={errors[`tool-${i}`]}
                />
                <Select
                  id={`job-${i}`}
                  name="job"
                  label="Job"
                  options={jobOptions}
                  defaultValue={row.job}
                  error={errors[`job-${i}`]}
                />
                <Field id={`n-${i}`} label="Jobs a day" error={errors[`n-${i}`]}>
                  {(control) => (
                    <input {...control} name="n" inputMode="numeric" defaultValue={row.n} className={inputClass} />
                  )}
                </Field>
                <Field
                  id={`min-${i}`}
                  label="Minutes per job (optional)"
                  hint="Blank: the median time to free it from reports"
                  error={errors[`min-${i}`]}
                >
                  {(control) => (
                    <input {...control} name="min" inputMode="decimal" defaultValue={row.min} className={inputClass} />
                  )}
                </Field>
              </fieldset>
            </li>
          ))}
        </ol>
        <BasisChoice basis={basis} />
        {errors.vib && <p className="text-sm text-red-700">{errors.vib}</p>}
        <button type="submit" className="rounded bg-bay-700 px-4 py-3 font-semibold text-white">
          Work out the day
        </button>
      </Form>

      {worked.length > 0 && (
        <section aria-labelledby="rows-heading" className="space-y-2">
          <h2 id="rows-heading" className="text-lg font-semibold">
            Row by row
          </h2>
          <ul className="space-y-2 text-sm">
            {worked.map((w) => (
              <li key={w.index} className="border-b border-stone-100 pb-2">
                <strong>
                  {w.jobsPerDay} × {w.jobName}
                </strong>{" "}
                with {w.toolLabel} ({formatVibration(w.item.ahv)}, {w.item.lpa} dB):{" "}
                {withInterval(w.minutes, (m) => formatDuration(m * 60))} a job
                {` (${TIME_FROM[w.timeFrom]}${w.timeFrom === "typed" ? "" : `; ${w.reports} reports`})`};{" "}
                {shareText(w.own.shareOfActionValue.estimate)} of the action dose.
              </li>
            ))}
          </ul>
        </section>
      )}

      {day && (
        <section aria-labelledby="day-heading" className="space-y-3">
          <h2 id="day-heading" className="text-lg font-semibold">
            The whole day
          </h2>
          <DayFigures day={day} />
          <BasisNote basis={basis} />
        </section>
      )}
      <ExposureCautions headingLevel={2} />
    </div>
  );
}
