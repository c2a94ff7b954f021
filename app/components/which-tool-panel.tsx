import { Form, useSubmit } from "react-router";
import { useRef } from "react";
import { COUPLER_LABELS, COUPLER_PROFILES, DEFAULT_COUPLER_PROFILE, type Units } from "~/domain";
import {
  CRITERION_LABELS,
  DEFAULT_WEIGHTS,
  SHORTLIST_CRITERIA,
  shortlistUnits,
  WEIGHT_CHOICES,
  weightParam,
} from "~/exposure/shortlist-form";
import type { JobShortlist } from "~/exposure/shortlist.server";
import { controlProps, FieldError } from "./field";
import { ShortlistResults } from "./shortlist/shortlist-results";
import { buttonClass } from "./ui";

const input = "mt-1 block w-full rounded border border-stone-300 px-3 py-2 aria-[invalid]:border-red-600";

/**
 * "Which tool, on your air?": the shopper's supply, limits, day and priorities in one GET form (the
 * shortlist lives in the address, so it works without JavaScript and can be shared); with JavaScript it
 * updates as the shopper changes a choice. Then the tools that pass and what they trade off.
 */
export function WhichToolPanel({
  jobSlug,
  percussive,
  values,
  data,
  units,
}: {
  jobSlug: string;
  percussive: boolean;
  values: Record<string, string>;
  data: JobShortlist;
  units: Units;
}) {
  const submit = useSubmit();
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const u = shortlistUnits(data.ask.system);
  const errors: Record<string, string> = data.errors;
  // A number field: label, the typed text kept, its message tied to it.
  const num = (name: string, label: string, placeholder = "") => (
    <div className="text-sm">
      <label htmlFor={`sl-${name}`} className="font-semibold">
        {label}
      </label>
      <input
        name={name}
        defaultValue={values[name] ?? ""}
        placeholder={placeholder}
        inputMode="decimal"
        className={input}
        {...controlProps(`sl-${name}`, errors[name])}
      />
      <FieldError id={`sl-${name}`} message={errors[name]} />
    </div>
  );
  return (
    <section aria-labelledby="which-heading" className="space-y-3 rounded-lg border border-bay-600 bg-white p-4">
      <h2 id="which-heading" className="text-lg font-semibold">
        Which tool, on your air?
      </h2>
      <Form
        method="get"
        action={`/jobs/${jobSlug}`}
        preventScrollReset
        className="space-y-3"
        onChange={(e) => {
          // Live with JavaScript: a choice re-asks the page after a short pause in typing.
          const form = e.currentTarget;
          if (timer.current) clearTimeout(timer.current);
          timer.current = setTimeout(() => void submit(form, { replace: true, preventScrollReset: true }), 600);
        }}
      >
        <input type="hidden" name="u" value={data.ask.system} />
        <fieldset className="grid grid-cols-2 gap-3 sm:grid-cols-6">
          <legend className="mb-1 text-sm font-semibold text-stone-700">Your air</legend>
          {num("reg", "Regulator, psi", "100")}
          {num("hid", "Hose ID, in", "3/8")}
          {num("hlen", "Hose length, ft", "50")}
          {num("cc", "Couplers", "2")}
          <div className="text-sm">
            <label htmlFor="sl-cp" className="font-semibold">
              Coupler style
            </label>
            <select id="sl-cp" name="cp" defaultValue={values.cp ?? DEFAULT_COUPLER_PROFILE} className={input}>
              {COUPLER_PROFILES.map((code) => (
                <option key={code} value={code}>
                  {COUPLER_LABELS[code]}
                </option>
              ))}
            </select>
          </div>
          {num("comp", `Compressor delivers, ${u.flow}`)}
        </fieldset>
        <fieldset className="grid grid-cols-2 gap-3 sm:grid-cols-6">
          <legend className="mb-1 text-sm font-semibold text-stone-700">Your limits</legend>
          {percussive && (
            <div className="text-sm">
              <label htmlFor="sl-bits" className="font-semibold">
                Bits you own
              </label>
              <select
                name="bits"
                defaultValue={values.bits ?? ""}
                className={input}
                {...controlProps("sl-bits", errors.bits)}
              >
                <option value="">none yet</option>
                <option value="shank-0.401">0.401 in shank</option>
                <option value="shank-0.498">0.498 in shank</option>
              </select>
              <FieldError id="sl-bits" message={errors.bits} />
            </div>
          )}
          {num("maxw", `Most weight, ${u.weight}`)}
          {num("maxl", `Most length, ${u.length}`)}
          {num("maxp", "Most price, $")}
          {num("minc", "Least chance at your air, %")}
        </fieldset>
        <fieldset className="grid grid-cols-2 gap-3 sm:grid-cols-6">
          <legend className="mb-1 text-sm font-semibold text-stone-700">Your day</legend>
          {num("jobs", "Jobs a day", "1")}
          {num("maxv", "Most of the vibration action value, %")}
          <div className="col-span-2 text-sm">
            <label htmlFor="sl-vb" className="font-semibold">
              Vibration figure
            </label>
            <select id="sl-vb" name="vb" defaultValue={values.vb ?? "declared"} className={input}>
              <option value="declared">maker's declared value</option>
              <option value="in-use">in-use estimate (declared × factor)</option>
            </select>
          </div>
        </fieldset>
        <fieldset className="grid grid-cols-2 gap-3 sm:grid-cols-5">
          <legend className="mb-1 text-sm font-semibold text-stone-700">How much each counts for your best pick</legend>
          {SHORTLIST_CRITERIA.map((c) => (
            <div key={c} className="text-sm">
              <label htmlFor={`sl-${weightParam(c)}`} className="font-semibold">
                {CRITERION_LABELS[c]}
              </label>
              <select
                name={weightParam(c)}
                defaultValue={values[weightParam(c)] ?? String(DEFAULT_WEIGHTS[c])}
                className={input}
                {...controlProps(`sl-${weightParam(c)}`, errors[weightParam(c)])}
              >
                {WEIGHT_CHOICES.map((w) => (
                  <option key={w.value} value={w.value}>
                    {w.label}
                  </option>
                ))}
              </select>
              <FieldError id={`sl-${weightParam(c)}`} message={errors[weightParam(c)]} />
            </div>
          ))}
        </fieldset>
        <details className="text-sm">
          <summary className="cursor-pointer text-stone-700">Simulation seed</summary>
          <div className="mt-2 max-w-xs">{num("seed", "Seed (a whole number)", "1")}</div>
        </details>
        <button type="submit" className={buttonClass("primary", "md", "w-full sm:w-auto")}>
          Show tools at my air
        </button>
      </Form>
      {data.supplyNote && (
        <p role="alert" className="text-sm text-amber-800">
          {data.supplyNote}
        </p>
      )}
      {Object.keys(errors).length > 0 && (
        <p role="alert" className="text-sm text-amber-800">
          Left out of the shortlist: {Object.values(errors).join("; ")}.
        </p>
      )}
      <ShortlistResults jobSlug={jobSlug} data={data} units={units} />
    </section>
  );
}
