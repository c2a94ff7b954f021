import { Link } from "react-router";
import { formatDuration, formatPressure } from "~/catalogue/format";

export interface CountRow {
  key: string;
  href: string;
  label: string;
  sublabel?: string;
  n: number;
  freed: number;
  median_time_s: number | null;
  median_inlet_kpa: number | null;
}

/** Fewer reports than this and a share is shown as "too few to compare". */
export const FEW_REPORTS = 10;

/**
 * Raw counts of accepted reports with a bar for the freed share. Deliberately no ranking:
 * rows keep the order given (most reports first) and small samples say so.
 */
export function CountsTable({ rows, firstColumn }: { rows: CountRow[]; firstColumn: string }) {
  return (
    <div className="overflow-x-auto rounded-lg border border-stone-200 bg-white">
      <table className="w-full min-w-[36rem] text-left text-sm">
        <thead className="bg-stone-100 text-xs uppercase text-stone-600">
          <tr>
            <th className="px-3 py-2">{firstColumn}</th>
            <th className="px-3 py-2 text-right">Reports</th>
            <th className="px-3 py-2">Freed</th>
            <th className="px-3 py-2 text-right">Median time when freed</th>
            <th className="px-3 py-2 text-right">Median inlet</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-stone-100">
          {rows.map((r) => (
            <tr key={r.key}>
              <td className="px-3 py-2">
                <Link to={r.href} className="font-semibold text-bay-700 hover:underline">{r.label}</Link>
                {r.sublabel && <div className="text-xs text-stone-500">{r.sublabel}</div>}
              </td>
              <td className="px-3 py-2 text-right">{r.n}</td>
              <td className="px-3 py-2">
                {r.n === 0 ? <span className="text-stone-500">no reports</span>
                  : r.n < FEW_REPORTS ? <span className="text-stone-600">{r.freed} of {r.n} — too few to compare</span>
                    : <ShareBar freed={r.freed} n={r.n} />}
              </td>
              <td className="px-3 py-2 text-right">{formatDuration(r.median_time_s)}</td>
              <td className="px-3 py-2 text-right">{formatPressure(r.median_inlet_kpa)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function ShareBar({ freed, n }: { freed: number; n: number }) {
  const share = freed / n;
  return (
    <div className="flex items-center gap-2">
      <div className="h-2 w-24 rounded bg-stone-200" aria-hidden>
        <div className="h-2 rounded bg-bay-600" style={{ width: `${Math.round(share * 100)}%` }} />
      </div>
      <span>{freed} of {n}</span>
    </div>
  );
}
