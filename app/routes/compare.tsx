import { toolName } from "~/domain";
import { data } from "react-router";
import { readDb } from "~/db.server";
import { ErrorPage } from "~/components/error-page";
import { ChooseJob, ChooseTools, type CompareTool, Comparison } from "~/components/compare-view";
import { CURVE_COLOURS } from "~/components/pressure-curves";
import { compareBench } from "~/bench/figures-read.server";
import { CompareBench } from "~/components/bench-figures/compare-bench";
import { CompareDerived } from "~/components/bench-figures/compare-derived";
import { unitsFor } from "~/auth/units.server";
import { getJobBySlug, listJobs } from "~/catalogue/queries.server";
import { compareOnJob } from "~/stats/cells.server";
import { CompareExposurePanel } from "~/components/exposure/compare-exposure";
import { compareExposure } from "~/exposure/pages.server";
import { readCompareQuery } from "~/stats/compare-query";
import { invariantResponse } from "~/utils/http";
import type { Route } from "./+types/compare";

// No job: a chooser of jobs. A job and fewer than two usable tools: a chooser of its tools (400 when
// tools were asked for and could not be used). Otherwise the comparison, by the job page's own rule.
export async function loader({ request }: Route.LoaderArgs) {
  const q = readCompareQuery(new URL(request.url).searchParams);
  if (!q.job) {
    const jobs = await listJobs(readDb);
    return data({ view: "jobs" as const, jobs, problem: q.problem }, { status: q.problem ? 400 : 200 });
  }
  const job = await getJobBySlug(readDb, q.job);
  invariantResponse(job, "No such job type", 404);
  const c = await compareOnJob(readDb, job.id, q.models);
  const label = (cell: { maker_name: string; model_code: string }) => toolName(cell.maker_name, cell.model_code);
  if (q.problem || c.chosen.length < 2) {
    const problem =
      q.problem ?? (q.models.length ? "Pick at least two tools with accepted reports on this job." : null);
    const tools = c.rows.map((r) => ({ slug: r.cell.model_slug, label: label(r.cell), n: r.cell.n }));
    return data({ view: "tools" as const, job, tools, chosen: q.models, problem }, { status: problem ? 400 : 200 });
  }
  const tools: CompareTool[] = c.chosen.map(({ cell, mark }, i) => ({
    slug: cell.model_slug,
    label: label(cell),
    colour: CURVE_COLOURS[i]!,
    n: cell.n,
    reporters: cell.reporters,
    estimate: cell.estimate,
    lower: cell.lower,
    upper: cell.upper,
    mark,
    fit: cell.fit,
    adjReason: cell.adj_reason,
    km: { median: cell.km_median_s, lower: cell.km_lower_s, upper: cell.km_upper_s },
    steps: c.steps.get(cell.tool_model_id) ?? null,
  }));
  const [bench, units] = await Promise.all([
    compareBench(
      readDb,
      tools.map((t) => t.slug),
    ),
    unitsFor(request),
  ]);
  return {
    view: "compare" as const,
    bench,
    units,
    job,
    psi: q.psi,
    tools,
    pairs: c.pairs,
    topLabel: c.top ? label(c.top) : null,
    basis: c.basis,
    exposure: await compareExposure(readDb, job.id, tools, new URL(request.url)),
  };
}

export default function Compare({ loaderData }: Route.ComponentProps) {
  if (loaderData.view === "jobs") return <ChooseJob jobs={loaderData.jobs} problem={loaderData.problem} />;
  if (loaderData.view === "tools")
    return (
      <ChooseTools
        job={loaderData.job}
        tools={loaderData.tools}
        chosen={loaderData.chosen}
        problem={loaderData.problem}
      />
    );
  const { exposure, bench, units, ...comparison } = loaderData;
  return (
    <div className="space-y-6">
      <Comparison {...comparison} />
      <CompareBench tools={comparison.tools} bench={bench} units={units} />
      <CompareDerived tools={comparison.tools} bench={bench} units={units} />
      <CompareExposurePanel exposure={exposure} job={comparison.job} psi={comparison.psi} />
    </div>
  );
}

export function meta({ data }: Route.MetaArgs) {
  return [{ title: data && "job" in data ? `Compare on ${data.job.name} — Bayproof` : "Compare — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
