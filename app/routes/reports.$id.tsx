import { Link } from "react-router";
import { unitsFor } from "~/auth/units.server";
import { ErrorPage } from "~/components/error-page";
import { EvidenceGallery } from "~/components/evidence-gallery";
import { ReportFacts } from "~/components/public-report";
import { OutcomeBadge } from "~/components/report-table";
import { db } from "~/db.server";
import { formatDate, toolName } from "~/domain";
import { publicReport } from "~/reports/public.server";
import { invariantResponse } from "~/utils/http";
import { parseIdParam } from "~/utils/params";
import type { Route } from "./+types/reports.$id";

// An accepted report's own page, open to anyone. Any other report — draft, submitted, returned,
// rejected, withdrawn — answers 404, whoever asks: its reporter follows it at /reports/:id/history.
export async function loader({ params, request }: Route.LoaderArgs) {
  const id = parseIdParam(params.id, "No such report");
  const [found, units] = await Promise.all([publicReport(db, id), unitsFor(request)]);
  invariantResponse(found, "No such report", 404);
  return { ...found, units };
}

export default function PublicReportPage({ loaderData }: Route.ComponentProps) {
  const { report, files, units } = loaderData;
  const tool = toolName(report.maker_name, report.model_code);
  return (
    <div className="space-y-6">
      <header>
        <p className="text-sm text-stone-600">
          Report {report.id} · accepted {formatDate(report.accepted_at)} · by {report.reporter_handle}
        </p>
        <h1 className="text-2xl font-bold">
          {report.job_name} with the {tool}
        </h1>
        <p className="mt-1">
          <OutcomeBadge outcome={report.outcome} />
        </p>
        <p className="mt-2 text-sm">
          <Link to={`/models/${report.model_slug}`} className="text-bay-700 underline">
            {tool}
          </Link>{" "}
          ·{" "}
          <Link to={`/jobs/${report.job_slug}`} className="text-bay-700 underline">
            {report.job_name}
          </Link>{" "}
          ·{" "}
          <Link to={`/api/v1/reports/${report.id}`} className="text-bay-700 underline" reloadDocument>
            this report in the open data (JSON)
          </Link>
        </p>
      </header>
      <ReportFacts report={report} units={units} />
      <EvidenceGallery files={files} title="Published videos and photos" showReportLinks={false} />
      {files.length === 0 && (
        <p className="text-sm text-stone-600">The reporter published no files with this report.</p>
      )}
    </div>
  );
}

export function meta({ data }: Route.MetaArgs) {
  if (!data) return [{ title: "Not found — Bayproof" }];
  const r = data.report;
  return [{ title: `Report ${r.id}: ${r.job_name}, ${toolName(r.maker_name, r.model_code)} — Bayproof` }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
