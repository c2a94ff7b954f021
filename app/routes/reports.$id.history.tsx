import { hasRole, requireUser } from "~/auth/session.server";
import { LogList } from "~/components/decision-log";
import { ErrorPage } from "~/components/error-page";
import { db } from "~/db.server";
import { reportLog } from "~/moderation/decide.server";
import { moderatorsMaySee } from "~/moderation/visibility";
import { parseIdParam } from "~/utils/params";
import type { Route } from "./+types/reports.$id.history";
import { refuse } from "~/utils/http";

// A report's moderation log, for its reporter and for moderators.
export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const id = parseIdParam(params.id, "No such report");
  const report = await db
    .selectFrom("reports")
    .select(["id", "reporter_id", "status", "version"])
    .where("id", "=", id)
    .executeTakeFirst();
  const own = report?.reporter_id === user.id;
  if (!report || (!own && !(hasRole(user, "moderator") && moderatorsMaySee(report.status))))
    refuse("No such report among yours", 404);
  return { report, log: await reportLog(db, id) };
}

export default function ReportHistory({ loaderData }: Route.ComponentProps) {
  return (
    <div className="space-y-3">
      <h1 className="text-2xl font-bold">History of report #{loaderData.report.id}</h1>
      <p className="text-sm text-stone-600">
        Status {loaderData.report.status}, version {loaderData.report.version}. Every claim, evidence check and decision
        is kept; nothing here can be edited.
      </p>
      <LogList log={loaderData.log} />
    </div>
  );
}

export function meta({ data }: Route.MetaArgs) {
  return [{ title: data ? `History of report #${data.report.id} — Bayproof` : "Report history — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
