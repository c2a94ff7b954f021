// Bench figures beside field figures on /compare: each tool's share of reports that freed the job
// and its pooled full-trigger bench force, side by side and never combined.
import { formatBench } from "~/bench/terms";
import type { CompareBenchRow } from "~/bench/figures-read.server";
import { formatChance, type Units } from "~/domain";
import { DataTable } from "../ui";
import { noBenchText, runsOnRigs } from "./compare-derived";

interface Tool {
  slug: string;
  label: string;
  estimate: number;
  lower: number;
  upper: number;
}

export function CompareBench({ tools, bench, units }: { tools: Tool[]; bench: CompareBenchRow[]; units: Units }) {
  return (
    <section aria-labelledby="compare-bench-heading" className="space-y-2">
      <h2 id="compare-bench-heading" className="text-lg font-semibold">
        Field and bench side by side
      </h2>
      <DataTable
        label="Field and bench figures of the compared tools"
        head={
          <tr>
            <th className="px-3 py-2">Tool</th>
            <th className="px-3 py-2">Freed the job (field)</th>
            <th className="px-3 py-2">Bench force across rigs</th>
          </tr>
        }
      >
        {tools.map((t) => {
          const row = bench.find((r) => r.slug === t.slug);
          const d = row?.derived;
          return (
            <tr key={t.slug} className="border-t border-stone-100 align-top">
              <th scope="row" className="px-3 py-2 font-normal">
                {t.label}
              </th>
              <td className="px-3 py-2">
                {formatChance(t.estimate)}
                <span className="block text-xs text-stone-600">
                  {formatChance(t.lower)} to {formatChance(t.upper)}
                </span>
              </td>
              <td className="px-3 py-2">
                {d ? (
                  <>
                    {formatBench(d.quantity, d.pooled.estimate, units)}
                    <span className="block text-xs text-stone-600">
                      {formatBench(d.quantity, d.pooled.lower, units)} to{" "}
                      {formatBench(d.quantity, d.pooled.upper, units)}; {runsOnRigs(d.pooled)}
                    </span>
                  </>
                ) : (
                  noBenchText(row)
                )}
              </td>
            </tr>
          );
        })}
      </DataTable>
      <details className="text-sm">
        <summary className="cursor-pointer text-bay-700">How this is worked out</summary>
        <p className="mt-2 text-stone-700">
          The field figure is the job's own (above). The bench figure is the full-trigger series regulated at the tool,
          pooled over every accepted run by a random-effects model with its 95 % interval (the model page gives the
          spread between rigs). The two answer different questions and are shown apart, not added up.
        </p>
      </details>
    </section>
  );
}
