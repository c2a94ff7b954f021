import { Link } from "react-router";
import { unitsFor } from "~/auth/units.server";
import { getRig } from "~/bench/rigs.server";
import { runsOnRig } from "~/bench/runs.server";
import { BenchSafetyCautions } from "~/components/bench/bench-safety";
import { RigView } from "~/components/bench/rig-view";
import { RunList } from "~/components/bench/run-list";
import { ErrorPage } from "~/components/error-page";
import { db } from "~/db.server";
import { invariantResponse } from "~/utils/http";
import { parseIdParam } from "~/utils/params";
import type { Route } from "./+types/bench.rigs.$id";

export async function loader({ params, request }: Route.LoaderArgs) {
  const id = parseIdParam(params.id, "No such rig");
  const [detail, runs, units] = await Promise.all([getRig(db, id), runsOnRig(db, id), unitsFor(request)]);
  invariantResponse(detail, "No such rig", 404);
  return { detail, runs, units };
}

export default function RigPage({ loaderData }: Route.ComponentProps) {
  const { detail, runs, units } = loaderData;
  return (
    <div className="space-y-6">
      <header>
        <p className="text-sm">
          <Link to="/bench" className="inline-flex min-h-11 items-center text-bay-700 underline">
            Bench runs
          </Link>
        </p>
        <h1 className="text-2xl font-bold">{detail.rig.name}</h1>
      </header>
      <RigView detail={detail} units={units} />
      <section aria-labelledby="rig-runs" className="space-y-2">
        <h2 id="rig-runs" className="text-lg font-semibold">
          Accepted runs on this rig
        </h2>
        <RunList runs={runs} units={units} show={["tool"]} />
      </section>
      <BenchSafetyCautions />
    </div>
  );
}

export function meta({ data }: Route.MetaArgs) {
  return [{ title: data ? `${data.detail.rig.name} — Bayproof` : "Rig not found — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
