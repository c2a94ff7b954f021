import { useEffect } from "react";
import { data, Link } from "react-router";
import { z } from "zod";
import { requireUser } from "~/auth/session.server";
import { ErrorPage } from "~/components/error-page";
import { UnreadNotices } from "~/components/my-reports/notices";
import { ReportGroups } from "~/components/my-reports/report-groups";
import { db } from "~/db.server";
import { EvidenceError, publishableFiles, setEvidencePublic } from "~/reports/evidence.server";
import { markNoticesRead, recentNotices } from "~/reports/notices.server";
import { offlineDraftKey } from "~/reports/offline-draft";
import { listOwnReports } from "~/reports/reports.server";
import { formValues, readForm } from "~/utils/forms";
import { idField, parseIdSearchParam } from "~/utils/params";
import type { Route } from "./+types/me.reports";

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const url = new URL(request.url);
  const submitted = parseIdSearchParam(request, "submitted");
  const [reports, notices, files] = await Promise.all([
    listOwnReports(db, user.id),
    recentNotices(db, user.id),
    publishableFiles(db, user.id),
  ]);
  return { reports, notices, files, submitted, withdrawn: url.searchParams.has("withdrawn") };
}

const myReportsForm = z.discriminatedUnion("intent", [
  z.object({ intent: z.literal("publish-evidence"), evidenceId: idField(), publish: z.enum(["yes", "no"]) }),
  z.object({ intent: z.literal("read-notices") }),
]);

export async function action({ request }: Route.ActionArgs) {
  const user = await requireUser(request);
  const parsed = myReportsForm.safeParse(formValues(await readForm(request)));
  if (!parsed.success) {
    throw data(
      parsed.error.issues[0]?.path[0] === "intent" ? "Unknown request" : "Say which file, and whether to publish it",
      { status: 400 },
    );
  }
  const input = parsed.data;
  if (input.intent === "read-notices") {
    await markNoticesRead(db, user.id);
    return { ok: true };
  }
  try {
    await setEvidencePublic(db, user.id, input.evidenceId, input.publish === "yes");
  } catch (error) {
    if (error instanceof EvidenceError) throw data(error.message, { status: error.status });
    throw error;
  }
  return { ok: true };
}

export default function MyReports({ loaderData }: Route.ComponentProps) {
  const { reports, notices, files, submitted, withdrawn } = loaderData;
  const unread = notices.filter((n) => !n.read_at);
  useEffect(() => {
    if (!submitted) return;
    localStorage.removeItem(offlineDraftKey(null));
    localStorage.removeItem(offlineDraftKey(submitted));
  }, [submitted]);
  return (
    <div className="space-y-6">
      <header className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-bold">Your reports</h1>
        <Link to="/reports/new" className="rounded bg-bay-700 px-4 py-3 font-semibold text-white">
          File a new report
        </Link>
      </header>
      {submitted && (
        <p role="status" className="rounded bg-bay-100 px-3 py-2">
          Report #{submitted} is submitted. A moderator will check the evidence.
        </p>
      )}
      {withdrawn && (
        <p role="status" className="rounded bg-bay-100 px-3 py-2">
          The report is withdrawn.
        </p>
      )}
      {unread.length > 0 && <UnreadNotices unread={unread} />}
      {reports.length === 0 && <p className="text-stone-600">No reports yet.</p>}
      <ReportGroups reports={reports} files={files} />
    </div>
  );
}

export function meta() {
  return [{ title: "Your reports — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
