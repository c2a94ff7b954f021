// The bench panel on a tool model's page: its accepted runs, on how many rigs, and the spread of
// their full-trigger figures (shown as they are; combining rigs is a method of its own).
import { Link } from "react-router";
import { formatBench } from "~/bench/terms";
import type { RunListItem } from "~/bench/runs.server";
import type { Units } from "~/domain";
import { RunList } from "./run-list";
import type { ModelAcrossRigs } from "~/bench/figures-read.server";
import { AcrossRigsPanel } from "../bench-figures/across-rigs-panel";

export function ModelBenchPanel({
  runs,
  units,
  acrossRigs,
}: {
  runs: RunListItem[];
  units: Units;
  acrossRigs?: ModelAcrossRigs;
}) {
  const means = runs.flatMap((r) => (r.full_trigger_mean == null ? [] : [r.full_trigger_mean]));
  const rigs = new Set(runs.map((r) => r.rig_id)).size;
  const quantity = runs[0]?.quantity;
  return (
    <section aria-labelledby="bench-heading" className="space-y-2">
      <h2 id="bench-heading" className="text-lg font-semibold">
        On the bench
      </h2>
      {runs.length === 0 || !quantity ? (
        <p className="text-stone-600">
          No accepted bench runs yet.{" "}
          <Link to="/bench" className="text-bay-700 underline">
            What a bench run is
          </Link>
          .
        </p>
      ) : (
        <>
          <p className="text-sm">
            {runs.length} accepted run{runs.length === 1 ? "" : "s"} on {rigs} rig{rigs === 1 ? "" : "s"}
            {means.length > 0 &&
              `; full-trigger means from ${formatBench(quantity, Math.min(...means), units)} to ${formatBench(quantity, Math.max(...means), units)}`}
            . Each run's page gives its trial means with their interval.{" "}
            <Link to="/bench" className="text-bay-700 underline">
              About bench runs
            </Link>
          </p>
          <RunList runs={runs} units={units} show={["rig"]} />
          {acrossRigs && <AcrossRigsPanel data={acrossRigs} units={units} />}
        </>
      )}
    </section>
  );
}
