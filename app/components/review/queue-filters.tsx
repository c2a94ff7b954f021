// The queue's filters as a GET form: what is picked goes into the address, so the filtered queue
// can be shared, reloaded and walked back through with the browser's back button.
import { Form, Link } from "react-router";
import { FLAG_EXPLANATIONS } from "~/moderation/flags";
import { QUEUE_AGES, QUEUE_SORTS, queueQuery, type QueueFilter } from "~/moderation/queue-filter";
import { TRUST_LABELS } from "~/moderation/trust";
import { buttonClass, cardClass } from "~/components/ui";

type Job = { slug: string; name: string; category_slug: string; category_name: string };

const control = "mt-1 block min-h-11 w-full rounded border border-stone-300 bg-white px-2 py-2 text-base";

function Choice({
  name,
  label,
  value,
  options,
  any,
}: {
  name: string;
  label: string;
  value?: string;
  options: [string, string][];
  any?: string;
}) {
  return (
    <label className="block text-sm font-semibold">
      {label}
      <select name={name} defaultValue={value ?? ""} className={control}>
        {any && <option value="">{any}</option>}
        {options.map(([v, text]) => (
          <option key={v} value={v}>
            {text}
          </option>
        ))}
      </select>
    </label>
  );
}

export function QueueFilters({ filter, jobs }: { filter: QueueFilter; jobs: Job[] }) {
  const categories = [...new Map(jobs.map((j) => [j.category_slug, j.category_name])).entries()];
  const set = (["flag", "category", "job", "reporter", "age", "second"] as const).filter(
    (k) => filter[k] !== undefined,
  ).length;
  const summary = `Filter and sort · ${QUEUE_SORTS[filter.sort ?? "oldest"].toLowerCase()}${set ? ` · ${set} ${set === 1 ? "filter" : "filters"} on` : ""}`;
  // Folded while nothing is filtered, so on a phone the queue itself comes first. The key resets
  // the uncontrolled fields (and the fold) when the address changes: back button, "Clear".
  return (
    <details key={queueQuery(filter)} open={set > 0} className={cardClass("none", "group")}>
      <summary className="flex min-h-11 cursor-pointer items-center px-3 font-semibold text-bay-700">{summary}</summary>
      <Form method="get" className="space-y-3 border-t border-stone-100 p-3" aria-label="Filter the queue">
        <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
          <Choice name="sort" label="Order" value={filter.sort} options={Object.entries(QUEUE_SORTS)} />
          <Choice
            name="flag"
            label="Flag"
            value={filter.flag}
            any="Any flags"
            options={Object.keys(FLAG_EXPLANATIONS).map((f) => [f, f.replaceAll("_", " ")])}
          />
          <Choice name="category" label="Category" value={filter.category} any="Any category" options={categories} />
          <Choice name="job" label="Job" value={filter.job} any="Any job" options={jobs.map((j) => [j.slug, j.name])} />
          <Choice
            name="reporter"
            label="Reporter's record"
            value={filter.reporter}
            any="Any reporter"
            options={Object.entries(TRUST_LABELS)}
          />
          <Choice name="age" label="Waiting" value={filter.age} any="Any time" options={Object.entries(QUEUE_AGES)} />
        </div>
        <div className="flex flex-wrap items-center gap-3">
          <label className="flex min-h-11 items-center gap-3 rounded border border-stone-300 px-3">
            <input type="checkbox" name="second" value="1" defaultChecked={filter.second === "1"} className="h-5 w-5" />
            Needs a second look (accepted once)
          </label>
          <button type="submit" className={buttonClass("primary", "md", "min-h-11")}>
            Show
          </button>
          {set > 0 && (
            <Link to={`/review${queueQuery({ sort: filter.sort })}`} className={buttonClass("plain", "md", "min-h-11")}>
              Clear filters
            </Link>
          )}
        </div>
      </Form>
    </details>
  );
}

/** Straight to one report by its number, staying in the same filtered queue for "next report". */
export function JumpToReport({
  filter,
  value,
  error,
}: {
  filter: QueueFilter;
  value: string | null;
  error: string | null;
}) {
  return (
    <Form method="get" role="search" aria-label="Open a report by number" className="flex flex-wrap items-end gap-2">
      {Object.entries(filter).map(([k, v]) =>
        k === "page" || v === undefined ? null : <input key={k} type="hidden" name={k} value={String(v)} />,
      )}
      <label className="text-sm font-semibold" htmlFor="jump-report">
        Open report #
        <input
          id="jump-report"
          name="report"
          inputMode="numeric"
          autoComplete="off"
          defaultValue={value ?? ""}
          placeholder="1042"
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? "jump-report-error" : undefined}
          className="mt-1 block min-h-11 w-32 rounded border border-stone-300 px-2 py-2 text-base aria-[invalid]:border-red-600"
        />
      </label>
      <button type="submit" className={buttonClass("secondary", "md", "min-h-11")}>
        Open
      </button>
      {error && (
        <p id="jump-report-error" className="w-full text-sm text-red-700">
          {error}
        </p>
      )}
    </Form>
  );
}
