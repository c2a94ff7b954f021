import type { Ref } from "react";
import { Form } from "react-router";
import { FITTING_LABELS } from "~/domain";
import type { ModelFilters } from "~/catalogue/model-filters";
import type { filterOptions } from "~/catalogue/models-table.server";
import { buttonClass, cardClass } from "~/components/ui";

const select = "mt-1 block w-full rounded border border-stone-300 px-2 py-2 text-sm";

/** The filters over the tools table; every change reloads the table in place. */
export function ModelFilterForm({
  filters: f,
  options,
  formRef,
  onChange,
}: {
  filters: ModelFilters;
  options: Awaited<ReturnType<typeof filterOptions>>;
  formRef: Ref<HTMLFormElement>;
  onChange: () => void;
}) {
  return (
    <Form
      method="get"
      ref={formRef}
      onChange={onChange}
      className={cardClass("sm", "grid grid-cols-2 gap-3 sm:grid-cols-6")}
    >
      <label className="text-sm">
        Category
        <select name="category" defaultValue={f.category ?? ""} className={select}>
          <option value="">Any</option>
          {options.categories.map((c) => (
            <option key={c.slug} value={c.slug}>
              {c.name}
            </option>
          ))}
        </select>
      </label>
      <label className="text-sm">
        Shank or drive
        <select name="fitting" defaultValue={f.fitting ?? ""} className={select}>
          <option value="">Any</option>
          {Object.entries(FITTING_LABELS).map(([k, v]) => (
            <option key={k} value={k}>
              {v}
            </option>
          ))}
        </select>
      </label>
      <label className="col-span-2 text-sm">
        Success on the job
        <select name="job" defaultValue={f.job ?? ""} className={select}>
          <option value="">— pick a job —</option>
          {options.jobs.map((j) => (
            <option key={j.slug} value={j.slug}>
              {j.category}: {j.name}
            </option>
          ))}
        </select>
      </label>
      <label className="text-sm">
        Max price, $<input name="maxPrice" defaultValue={f.maxPrice ?? ""} inputMode="decimal" className={select} />
      </label>
      <label className="text-sm">
        Max weight, kg
        <input name="maxWeight" defaultValue={f.maxWeight ?? ""} inputMode="decimal" className={select} />
      </label>
      <label className="text-sm">
        At least … reports
        <input name="minReports" defaultValue={f.minReports ?? ""} inputMode="numeric" className={select} />
      </label>
      <input type="hidden" name="sort" value={f.sort ?? ""} />
      <input type="hidden" name="dir" value={f.dir ?? ""} />
      <noscript>
        <button type="submit" className={buttonClass("primary", "sm")}>
          Filter
        </button>
      </noscript>
    </Form>
  );
}
