// The queue week by week: reports that arrived and reports decided, as pairs of bars scaled to the
// busiest week (numbers on the bars, a legend above), and the queue left at each week's end with
// its change. The queue's size moves little from week to week, so it is a number, not a bar that
// would look full every week.
import { DataTable } from "~/components/ui";

interface Week {
  week: string;
  submitted: number;
  decided: number;
  backlog: number;
}

const SUBMITTED = "bg-amber-600";
const DECIDED = "bg-bay-600";

function Bar({ value, max, color, label }: { value: number; max: number; color: string; label: string }) {
  const pct = max > 0 ? (100 * value) / max : 0;
  return (
    <div className="flex items-center gap-2" title={`${label}: ${value}`}>
      <div className="h-4 flex-1">
        <div className={`h-4 rounded-sm ${color}`} style={{ width: `${pct}%`, minWidth: value > 0 ? 3 : 0 }} />
      </div>
      <span className="w-8 text-right tabular-nums">{value}</span>
    </div>
  );
}

export function WorkloadWeeks({ weeks }: { weeks: Week[] }) {
  const max = Math.max(1, ...weeks.map((w) => Math.max(w.submitted, w.decided)));
  return (
    <div className="space-y-2">
      <ul className="flex flex-wrap gap-x-5 gap-y-1 text-sm" aria-label="Legend">
        <li className="flex items-center gap-2">
          <span className={`inline-block h-3 w-5 rounded-sm ${SUBMITTED}`} aria-hidden="true" />
          Arrived (submitted)
        </li>
        <li className="flex items-center gap-2">
          <span className={`inline-block h-3 w-5 rounded-sm ${DECIDED}`} aria-hidden="true" />
          Decided
        </li>
        <li className="text-stone-600">
          Bars are scaled to the busiest week ({max}); the queue shrinks in a week where the green bar is the longer.
        </li>
      </ul>
      <DataTable
        label="Queue by week"
        head={
          <tr>
            <th className="px-3 py-2 text-left">Week of</th>
            <th className="w-1/2 px-3 py-2 text-left">Arrived and decided</th>
            <th className="px-3 py-2 text-right">Waiting at week's end</th>
          </tr>
        }
      >
        {weeks.map((w, i) => {
          const change = i === 0 ? null : w.backlog - weeks[i - 1]!.backlog;
          return (
            <tr key={w.week}>
              <td className="whitespace-nowrap px-3 py-1.5 align-top">{w.week}</td>
              <td className="px-3 py-1.5">
                <Bar value={w.submitted} max={max} color={SUBMITTED} label="Arrived" />
                <Bar value={w.decided} max={max} color={DECIDED} label="Decided" />
              </td>
              <td className="whitespace-nowrap px-3 py-1.5 text-right align-top tabular-nums">
                {w.backlog}
                {change !== null && (
                  <span className="block text-xs text-stone-600">
                    {change === 0 ? "no change" : `${change > 0 ? "+" : "−"}${Math.abs(change)}`}
                  </span>
                )}
              </td>
            </tr>
          );
        })}
      </DataTable>
    </div>
  );
}
