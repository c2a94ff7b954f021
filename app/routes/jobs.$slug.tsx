import { readDb } from "~/db.server";
import { unitsFor } from "~/auth/units.server";
import type { Units } from "~/domain";
import { sharedPageRead } from "~/http-cache/serve.server";
import { WhichToolPanel } from "~/components/which-tool-panel";
import { JobTools } from "~/components/job-tools";
import { ErrorPage } from "~/components/error-page";
import { Pager } from "~/components/pager";
import { ReportList } from "~/components/report-table";
import { SafetyCautions } from "~/components/safety-cautions";
import { jobForce } from "~/bench/figures-read.server";
import { ForceCurvePanel } from "~/components/bench-figures/force-curve";
import { acceptedReports, countAccepted, getJobBySlug } from "~/catalogue/queries.server";
import { jobShortlist } from "~/exposure/shortlist.server";
import { jobStandings } from "~/stats/cells.server";
import { invariantResponse } from "~/utils/http";
import { parsePage, parseSlug } from "~/utils/params";
import type { Route } from "./+types/jobs.$slug";

const PER_PAGE = 20;

export async function loader({ params, request }: Route.LoaderArgs) {
  const units = await unitsFor(request);
  // The same for every viewer with these units: shared until the next change (app/http-cache).
  return sharedPageRead("jobs/:slug", request, units, () => jobPageData(params.slug, request, units));
}

async function jobPageData(slugParam: string | undefined, request: Request, units: Units) {
  const slug = parseSlug(slugParam);
  const page = parsePage(request);
  const search = Object.fromEntries(new URL(request.url).searchParams);
  const job = await getJobBySlug(readDb, slug);
  invariantResponse(job, "No such job type", 404);
  const [standings, reports, total, force] = await Promise.all([
    jobStandings(readDb, job.id),
    acceptedReports(readDb, { jobId: job.id, limit: PER_PAGE, offset: (page - 1) * PER_PAGE }),
    countAccepted(readDb, { jobId: job.id }),
    jobForce(readDb, job.id),
  ]);
  // The shopper's supply and shortlist: read what parses, and say what did not rather than fail the page.
  const shortlist = await jobShortlist(readDb, standings, search, units);
  return {
    job,
    force,
    standings,
    reports,
    page,
    pages: Math.max(1, Math.ceil(total / PER_PAGE)),
    shortlist,
    search,
    units,
  };
}

export default function JobPage({ loaderData }: Route.ComponentProps) {
  const { job, standings, reports, page, pages } = loaderData;
  return (
    <div className="space-y-6">
      <header>
        <p className="text-sm text-stone-600">{job.category_name}</p>
        <h1 className="text-2xl font-bold">{job.name}</h1>
        <p className="text-stone-700">{job.description}</p>
      </header>

      <SafetyCautions action={job.category_action} />

      <WhichToolPanel
        jobSlug={job.slug}
        percussive={job.category_action === "percussive"}
        values={loaderData.search}
        data={loaderData.shortlist}
        units={loaderData.units}
      />

      <JobTools
        job={job}
        basis={standings.basis}
        rows={standings.rows}
        fit={standings.fit}
        setAside={standings.setAside}
        units={loaderData.units}
      />

      <ForceCurvePanel data={loaderData.force} units={loaderData.units} />

      <section aria-labelledby="reports-heading">
        <h2 id="reports-heading" className="mb-2 text-lg font-semibold">
          Accepted reports
        </h2>
        <ReportList reports={reports} units={loaderData.units} show={["tool"]} />
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
