// A list of bench runs: the tool, the rig, the protocol version, the day and the full-trigger figure.
import { Link } from "react-router";
import { formatBench } from "~/bench/terms";
import type { RunListItem } from "~/bench/runs.server";
import { formatDate, type Units } from "~/domain";
import { Card } from "../ui";

export function RunList({
  runs,
  units,
  show = ["tool", "rig"],
}: {
  runs: RunListItem[];
  units: Units;
  show?: ("tool" | "rig")[];
}) {
  if (runs.length === 0) return <p className="text-stone-600">No accepted runs yet.</p>;
  return (
    <Card as="ul" padding="none" className="divide-y divide-stone-100">
      {runs.map((r) => (
        <li key={r.id} className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-1 p-3">
          <div className="min-w-0">
            <Link to={`/bench/runs/${r.id}`} className="font-semibold text-bay-700 underline">
              {show.includes("tool") ? r.tool : `Run ${r.id}`}
            </Link>
            <p className="text-xs text-stone-600">
              {formatDate(r.run_on)}
              {show.includes("rig") ? ` · ${r.rig_name}` : ""} · {r.protocol_title}, version {r.protocol_version}
            </p>
          </div>
          <p className="text-sm">
            <span className="text-stone-600">full trigger, mean </span>
            <span className="font-semibold">{formatBench(r.quantity, r.full_trigger_mean, units)}</span>
          </p>
        </li>
      ))}
    </Card>
  );
}
