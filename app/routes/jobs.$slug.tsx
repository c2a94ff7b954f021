import { db } from "~/db.server";
import { Link } from "react-router";
import { supplySchema } from "~/air/supply-form";
import { getUser } from "~/auth/session.server";
import { WhichToolPanel, type WhichToolRow } from "~/components/which-tool-panel";
import { atSupply } from "~/stats/which-tool";
import { CellTable } from "~/components/cell-table";
import { IntervalChart, IntervalsExplained } from "~/components/intervals";
import { ErrorPage } from "~/components/error-page";
import { Pager } from "~/components/pager";
import { ReportList } from "~/components/report-table";
import { SafetyCautions } from "~/components/safety-cautions";
import { FITTING_LABELS, formatPrice, toolName } from "~/domain";
import { acceptedReports, countAccepted, getJobBySlug } from "~/catalogue/queries.server";
import { FEW_REPORTS } from "~/stats/cells";
import { cellsForJob, type JobCell } from "~/stats/cells.server";
import { invariantResponse } from "~/utils/http";
import { parsePage, parseSlug } from "~/utils/params";
import type { Route } from "./+types/jobs.$slug";

const PER_PAGE = 20;

export async function loader({ params, request }: Route.LoaderArgs) {
  const slug = parseSlug(params.slug);
  const page = parsePage(request);
  const search = Object.fromEntries(new URL(request.url).searchParams);
  const job = await getJobBySlug(db, slug);
  invariantResponse(job, "No such job type", 404);
  const [models, reports, total] = await Promise.all([
    cellsForJob(db, job.id),
    acceptedReports(db, { jobId: job.id, limit: PER_PAGE, offset: (page - 1) * PER_PAGE }),
    countAccepted(db, { jobId: job.id }),
  ]);
  // The shopper's supply: read what parses, and say what did not rather than fail the page.
  let which: WhichToolRow[] | null = null;
  let note: string | null = null;
  if (search.reg !== undefined) {
    const supply = supplySchema.safeParse(search);
    if (!supply.success) note = `Could not use your supply: ${supply.error.issues.map((i) => i.message).join("; ")}.`;
    else {
      which = models.map((m) => {
        const r = atSupply({ slug: m.model_slug, fitting: m.fitting, ratedLps: m.rated_air_lps, fit: m.fit }, supply.data);
        return { slug: m.model_slug, label: toolName(m.maker_name, m.model_code), price: m.street_price_cents, weightKg: m.weight_kg, inletKpa: r.inletKpa, predicted: r.predicted, reason: m.adj_reason, needs: r.needs };
      }).sort((a, b) => (b.predicted?.lower ?? -1) - (a.predicted?.lower ?? -1));
    }
  }
  const user = await getUser(request);
  return { job, models, reports, page, pages: Math.max(1, Math.ceil(total / PER_PAGE)), which, note, search, pu: user?.pressureUnit ?? "psi" };
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

      <WhichToolPanel jobSlug={job.slug} percussive={job.category_action === "percussive"} values={loaderData.search} note={loaderData.note} rows={loaderData.which} pu={loaderData.pu} />

      <section aria-labelledby="tools-heading" className="space-y-3">
        <h2 id="tools-heading" className="text-lg font-semibold">Tools used on this job</h2>
        <IntervalsExplained />
        {models.length === 0 ? <p className="text-stone-600">No accepted reports yet.</p> : (
          <>
            <p className="text-sm text-stone-600">
              Ordered by the lower end of each 95 % interval — the rate each tool has shown at the least — not by its point.
              Tools whose interval overlaps the first one's cannot be told apart from it yet; tools with fewer than {FEW_REPORTS} reports are greyed.
            </p>
            <div className="rounded-lg border border-stone-200 bg-white p-3">
              <IntervalChart title={`Share of ${job.name.toLowerCase()} jobs freed, per tool, with 95 % intervals`} rows={chartRows(models)} />
            </div>
            {models.length >= 2 && (
              <p>
                <Link to={`/compare?job=${job.slug}&models=${models.slice(0, 3).map((m) => m.model_slug).join(",")}`} className="text-bay-700 underline">
                  Compare the first three side by side →
                </Link>
              </p>
            )}
            <CellTable
              firstColumn="Tool"
              rows={models.map((m, i) => ({
                key: m.model_slug, href: `/models/${m.model_slug}`, label: toolName(m.maker_name, m.model_code),
                sub: `${FITTING_LABELS[m.fitting]} · ${m.weight_kg} kg · ${formatPrice(m.street_price_cents)}`, tag: tagFor(models, i), ...m,
              }))}
            />
          </>
        )}
      </section>

      <section aria-labelledby="reports-heading">
        <h2 id="reports-heading" className="mb-2 text-lg font-semibold">Accepted reports</h2>
        <ReportList reports={reports} show={["tool"]} />
        <Pager page={page} pages={pages} basePath={`/jobs/${job.slug}`} />
      </section>
    </div>
  );
}

/** The first tool with enough reports leads; others overlapping its interval are not distinguishable from it. */
function tagFor(models: JobCell[], i: number): string | undefined {
  const m = models[i]!;
  if (m.n < FEW_REPORTS) return "too few to compare";
  const leader = models.find((x) => x.n >= FEW_REPORTS);
  if (!leader || leader === m) return undefined;
  return m.upper >= leader.lower ? "not distinguishable from the first" : undefined;
}

function chartRows(models: JobCell[]) {
  return models.map((m, i) => ({
    key: m.model_slug, label: toolName(m.maker_name, m.model_code), estimate: m.estimate, lower: m.lower, upper: m.upper, n: m.n,
    tag: tagFor(models, i), muted: m.n < FEW_REPORTS,
  }));
}

export function meta({ data }: Route.MetaArgs) {
  if (!data) return [{ title: "Not found — Bayproof" }];
  return [{ title: `${data.job.name} — Bayproof` }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
