import { Link } from "react-router";
import { getUser, hasRole } from "~/auth/session.server";
import { unitsFor } from "~/auth/units.server";
import { getProtocolById } from "~/bench/protocols.server";
import { getRun, runFigures } from "~/bench/runs.server";
import { traceDrawings } from "~/bench/traces.server";
import { BenchSafetyCautions } from "~/components/bench/bench-safety";
import { RunSeries } from "~/components/bench/run-view";
import { ErrorPage } from "~/components/error-page";
import { Card } from "~/components/ui";
import { db } from "~/db.server";
import { formatDate } from "~/domain";
import { invariantResponse } from "~/utils/http";
import { parseIdParam } from "~/utils/params";
import type { Route } from "./+types/bench.runs.$id";

export async function loader({ params, request }: Route.LoaderArgs) {
  const id = parseIdParam(params.id, "No such bench run");
  const [detail, user, units] = await Promise.all([getRun(db, id), getUser(request), unitsFor(request)]);
  // Accepted runs are public; any other state only to its filer and to moderators (never a draft to them).
  const maySee =
    detail != null &&
    (detail.run.status === "accepted" ||
      detail.run.filed_by === user?.id ||
      (hasRole(user, "moderator") && detail.run.status !== "draft"));
  invariantResponse(maySee, "No such bench run", 404);
  const protocol = await getProtocolById(db, detail.run.protocol_id);
  const traces = await traceDrawings(
    detail.series.flatMap((s) => s.trials),
    { capacity: detail.run.sensor_capacity, discardBlows: protocol?.blows_discarded ?? 0 },
  );
  return { detail, figures: runFigures(detail), traces, units, own: detail.run.filed_by === user?.id };
}

export default function RunPage({ loaderData }: Route.ComponentProps) {
  const { detail, figures, traces, units, own } = loaderData;
  const { run } = detail;
  return (
    <div className="space-y-6">
      <header>
        <p className="text-sm">
          <Link to="/bench" className="inline-flex min-h-11 items-center text-bay-700 underline">
            Bench runs
          </Link>
        </p>
        <h1 className="text-2xl font-bold">
          <Link to={`/models/${run.model_slug}`} className="underline">
            {run.tool}
          </Link>{" "}
          on the bench
        </h1>
        <p className="text-stone-700">
          {formatDate(run.run_on)} ·{" "}
          <Link to={`/bench/rigs/${run.rig_id}`} className="text-bay-700 underline">
            {run.rig_name}
          </Link>{" "}
          ·{" "}
          <Link to={`/bench/protocols/${run.protocol_slug}`} className="text-bay-700 underline">
            {run.protocol_title}, version {run.protocol_version}
          </Link>
        </p>
        {run.status !== "accepted" && (
          <p className="mt-1 text-sm font-semibold text-amber-900">
            This run is {run.status}; its figures are not published until a moderator accepts it.
          </p>
        )}
        {own && (run.status === "draft" || run.status === "returned") && (
          <p className="mt-1">
            <Link
              to={`/bench/runs/${run.id}/edit`}
              className="inline-flex min-h-11 items-center text-bay-700 underline"
            >
              Edit this run
            </Link>
          </p>
        )}
      </header>
      <Card as="section" aria-labelledby="unit-heading">
        <h2 id="unit-heading" className="mb-1 font-semibold">
          The unit and the session
        </h2>
        <p className="text-sm">
          Serial {run.unit_serial},{" "}
          {run.unit_condition === "new" ? "new" : `used (${run.unit_hours ?? "unknown"} hours)`}. Operator{" "}
          {run.operator}; ambient {run.ambient_c.toFixed(1)} °C.
          {run.flags.includes("check_standard_out_of_control") &&
            " The rig's check standard fell outside its limits that session."}
        </p>
      </Card>
      <RunSeries detail={detail} figures={figures} traces={traces} units={units} />
      <BenchSafetyCautions />
    </div>
  );
}

export function meta({ data }: Route.MetaArgs) {
  return [{ title: data ? `${data.detail.run.tool} on the bench — Bayproof` : "Bench run not found — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
