import { Link } from "react-router";
import { formatDuration } from "~/domain";
import { FEW_REPORTS } from "~/stats/cells";
import { IntervalBar, pct, plainLine } from "./intervals";

/** The figures of one stored cell that the table shows (components never import db/). */
interface CellFigures {
  n: number;
  successes: number;
  estimate: number;
  lower: number;
  upper: number;
  shrunk_estimate: number | null;
  time_n: number;
  time_median_s: number | null;
  time_lower_s: number | null;
  time_upper_s: number | null;
  adj_estimate: number | null;
  adj_lower: number | null;
  adj_upper: number | null;
  adj_reason: string | null;
  measured_share: number;
}

export type CellRow = CellFigures & {
  key: string;
  href: string;
  label: string;
  sub?: string;
  tag?: string;
};

/** The figures of stored cells: rate with its interval, time, pressure-adjusted rate, and the sentence. */
export function CellTable({ rows, firstColumn }: { rows: CellRow[]; firstColumn: string }) {
  return (
    <div className="overflow-x-auto rounded-lg border border-stone-200 bg-white">
      <table className="w-full min-w-[44rem] text-left text-sm">
        <caption className="sr-only">Success rates with 95 % intervals, times and pressure-adjusted rates</caption>
        <thead className="bg-stone-100 text-xs uppercase text-stone-600">
          <tr>
            <th className="px-3 py-2">{firstColumn}</th>
            <th className="px-3 py-2">Freed (95 % interval)</th>
            <th className="px-3 py-2">Median time when freed</th>
            <th className="px-3 py-2">At 90 psi inlet</th>
            <th className="px-3 py-2 text-right">Measured at inlet</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-stone-100 align-top">
          {rows.map((r) => (
            <tr key={r.key}>
              <td className="px-3 py-2">
                <Link to={r.href} className="font-semibold text-bay-700 hover:underline">{r.label}</Link>
                {r.sub && <div className="text-xs text-stone-500">{r.sub}</div>}
                {r.tag && <div className="text-xs font-semibold text-bay-700">{r.tag}</div>}
              </td>
              <td className="px-3 py-2">
                <div className="flex items-center gap-2">
                  <IntervalBar estimate={r.estimate} lower={r.lower} upper={r.upper} muted={r.n < FEW_REPORTS} />
                  <span>{pct(r.estimate)} <span className="text-stone-500">({pct(r.lower)}–{pct(r.upper)})</span></span>
                </div>
                <p className="mt-1 text-xs text-stone-600">
                  {r.n < FEW_REPORTS ? `${r.n} reports — too few to compare. ` : ""}{plainLine(r.successes, r.n, r.lower, r.upper)}
                  {r.shrunk_estimate != null ? ` Pooled with the other tools on this job: ${pct(r.shrunk_estimate)}.` : ""}
                </p>
              </td>
              <td className="px-3 py-2">
                {r.time_median_s == null ? <span className="text-stone-500">too few</span> : (
                  <>
                    {formatDuration(r.time_median_s)}
                    <div className="text-xs text-stone-500">{formatDuration(r.time_lower_s)}–{formatDuration(r.time_upper_s)}, bootstrap, n = {r.time_n}</div>
                  </>
                )}
              </td>
              <td className="px-3 py-2">
                {r.adj_estimate != null ? (
                  <>
                    {pct(r.adj_estimate)} <span className="text-stone-500">({pct(r.adj_lower!)}–{pct(r.adj_upper!)})</span>
                    <div className="text-xs text-stone-500">logistic fit on inlet pressure</div>
                  </>
                ) : <span className="text-xs text-stone-500">{r.adj_reason}</span>}
              </td>
              <td className="px-3 py-2 text-right">{pct(r.measured_share)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
