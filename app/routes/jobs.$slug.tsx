import { db } from "~/db.server";
import { CountsTable } from "~/components/job-counts";
import { ErrorPage } from "~/components/error-page";
import { Pager } from "~/components/pager";
import { ReportList } from "~/components/report-table";
import { SafetyCautions } from "~/components/safety-cautions";
import { FITTING_LABELS, formatPrice } from "~/catalogue/format";
import { acceptedReports, countAccepted, getJobBySlug } from "~/catalogue/queries.server";
import { modelSummaryForJob } from "~/stats/counts.server";
import { invariantResponse } from "~/utils/http";
import { parsePage, parseSlug } from "~/utils/params";
import type { Route } from "./+types/jobs.$slug";

const PER_PAGE = 20;

export async function loader({ params, request }: Route.LoaderArgs) {
  const slug = parseSlug(params.slug);
  const page = parsePage(request);
  const job = await getJobBySlug(db, slug);
  invariantResponse(job, "No such job type", 404);
  const [models, reports, total] = await Promise.all([
    modelSummaryForJob(db, job.id),
    acceptedReports(db, { jobId: job.id, limit: PER_PAGE, offset: (page - 1) * PER_PAGE }),
    countAccepted(db, { jobId: job.id }),
  ]);
  return { job, models, reports, page, pages: Math.max(1, Math.ceil(total / PER_PAGE)) };
}

export default function JobPage({ loaderData }: Route.ComponentProps) {
  const { job, models, reports, page, pages } = loaderData;
  return (
    <div className="space-y-6">
      <header>
        <p className="text-sm text-stone-600">{job.category_name}</p>
        <h1 className="text-2xl font-bold">{job.name}</h1>
        <p className="text-stone-700">{job.description}</p>
      </header>

      <SafetyCautions action={job.category_action} />

      <section aria-labelledby="tools-heading">
        <h2 id="tools-heading" className="mb-1 text-lg font-semibold">Tools used on this job</h2>
        <p className="mb-2 text-sm text-stone-600">Listed by number of accepted reports, not ranked. Pressure matters: compare the median inlet pressure too.</p>
        <CountsTable
          firstColumn="Tool"
          rows={models.map((m) => ({
            key: m.slug, href: `/models/${m.slug}`, label: `${m.maker_name} ${m.model_code}`,
            sublabel: `${FITTING_LABELS[m.fitting]} · ${m.weight_kg} kg · ${formatPrice(m.street_price_cents)}`,
            ...m,
          }))}
        />
      </section>

      <section aria-labelledby="reports-heading">
        <h2 id="reports-heading" className="mb-2 text-lg font-semibold">Accepted reports</h2>
        <ReportList reports={reports} show={["tool"]} />
        <Pager page={page} pages={pages} basePath={`/jobs/${job.slug}`} />
      </section>
    </div>
  );
}

export function meta({ data }: Route.MetaArgs) {
  if (!data) return [{ title: "Not found — Bayproof" }];
  return [{ title: `${data.job.name} — Bayproof` }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
