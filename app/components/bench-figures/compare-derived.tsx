// The derived bench figures of each compared tool on /compare, worked out as on its model page: force
// per kg, per 100 mm of length and per $100 of street price from the pooled force, and the trigger
// control range, each with its interval and never folded into a total. On a phone the table scrolls
// inside its frame, not the page.
import { formatBench, formatDerived, TRIGGER_LABELS } from "~/bench/terms";
import type { CompareBenchRow } from "~/bench/figures-read.server";
import type { FromSeries, Interval } from "~/bench/derived-figures";
import type { Units } from "~/domain";
import { DataTable } from "../ui";

type Derived = NonNullable<CompareBenchRow["derived"]>;

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? "" : "s"}`;

/** "5 runs on 3 rigs". */
export const runsOnRigs = (f: { runs: number; rigs: number }) => `${plural(f.runs, "run")} on ${plural(f.rigs, "rig")}`;

/** Why a tool has no derived figures: no pooled figure at all, or none in the headline series. */
export const noBenchText = (row: CompareBenchRow | undefined) =>
  row?.benchFigures ? "No full-trigger series regulated at the tool yet" : "No bench runs yet";

export function CompareDerived({
  tools,
  bench,
  units,
}: {
  tools: { slug: string; label: string }[];
  bench: CompareBenchRow[];
  units: Units;
}) {
  return (
    <section aria-labelledby="compare-derived-heading" className="space-y-2">
      <h2 id="compare-derived-heading" className="text-lg font-semibold">
        Bench figures for size and price
      </h2>
      <p className="text-sm text-stone-700">
        Each figure stands alone with its 95 % interval; none is added to another or to the field figures.
      </p>
      <DataTable
        label="Derived bench figures of the compared tools"
        minWidth="40rem"
        head={
          <tr>
            <th className="px-3 py-2">Tool</th>
            <th className="px-3 py-2">Per kg of tool</th>
            <th className="px-3 py-2">Per 100 mm of length</th>
            <th className="px-3 py-2">Per $100 of street price</th>
            <th className="px-3 py-2">Trigger control range</th>
          </tr>
        }
      >
        {tools.map((t) => {
          const row = bench.find((r) => r.slug === t.slug);
          const d = row?.derived;
          return (
            <tr key={t.slug} data-testid={`derived-${t.slug}`} className="border-t border-stone-100 align-top">
              <th scope="row" className="px-3 py-2 font-normal">
                {t.label}
                {d && (
                  <span className="block text-xs text-stone-600">
                    From “{d.pooled.series}”, {runsOnRigs(d.pooled)}
                  </span>
                )}
              </th>
              {d ? (
                <>
                  <Ratio v={d.perKg} d={d} units={units} />
                  <Ratio v={d.per100mm} d={d} units={units} />
                  {d.perHundredDollars ? (
                    <Ratio v={d.perHundredDollars} d={d} units={units} />
                  ) : (
                    <td className="px-3 py-2 text-stone-600">No street price on record</td>
                  )}
                  <Range range={d.triggerRange} d={d} units={units} />
                </>
              ) : (
                <td colSpan={4} className="px-3 py-2 text-stone-600">
                  {noBenchText(row)}
                </td>
              )}
            </tr>
          );
        })}
      </DataTable>
      <details className="text-sm">
        <summary className="cursor-pointer text-bay-700">How this is worked out</summary>
        <p className="mt-2 text-stone-700">
          As on each model's page: the pooled force is the full-trigger series regulated at the tool with the most runs,
          combined over every accepted run by a random-effects model. Dividing it and both ends of its 95 % interval by
          the tool's weight, length or street price (taken as exact) gives the first three figures. The trigger control
          range is each run's full minus {TRIGGER_LABELS.lightest_steady.toLowerCase()} figure, pooled the same way: how
          far the trigger turns the force down from full.
        </p>
      </details>
    </section>
  );
}

function Ratio({ v, d, units }: { v: Interval; d: Derived; units: Units }) {
  const p = formatDerived(v, d.quantity, units);
  return (
    <td className="px-3 py-2">
      {p.estimate} {p.unit}
      <span className="block text-xs text-stone-600">
        {p.lower} to {p.upper} {p.unit}
      </span>
    </td>
  );
}

function Range({ range, d, units }: { range: FromSeries | null; d: Derived; units: Units }) {
  if (!range) return <td className="px-3 py-2 text-stone-600">No lightest-steady series yet</td>;
  const f = (v: number) => formatBench(d.quantity, v, units);
  return (
    <td className="px-3 py-2">
      {f(range.estimate)}
      <span className="block text-xs text-stone-600">
        {f(range.lower)} to {f(range.upper)}; {runsOnRigs(range)}
      </span>
    </td>
  );
}
