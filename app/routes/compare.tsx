import { toolName } from "~/domain";
import { useState } from "react";
import { data, Form, Link } from "react-router";
import { db } from "~/db.server";
import { ErrorPage } from "~/components/error-page";
import { IntervalsExplained } from "~/components/intervals";
import {
  AgainstTop,
  AtPressureTable,
  ChooseJob,
  ChooseTools,
  type CompareTool,
  PairsTable,
} from "~/components/compare-view";
import { CURVE_COLOURS, PressureCurves, SurvivalCurves } from "~/components/pressure-curves";
import { getJobBySlug, listJobs } from "~/catalogue/queries.server";
import { compareOnJob } from "~/stats/cells.server";
import { readCompareQuery } from "~/stats/compare-query";
import { invariantResponse } from "~/utils/http";
import { buttonClass } from "~/components/ui";
import type { Route } from "./+types/compare";

// No job: a chooser of jobs. A job and fewer than two usable tools: a chooser of its tools (400 when
// tools were asked for and could not be used). Otherwise the comparison, by the job page's own rule.
export async function loader({ request }: Route.LoaderArgs) {
  const q = readCompareQuery(new URL(request.url).searchParams);
  if (!q.job) {
    const jobs = await listJobs(db);
    return data({ view: "jobs" as const, jobs, problem: q.problem }, { status: q.problem ? 400 : 200 });
  }
  const job = await getJobBySlug(db, q.job);
  invariantResponse(job, "No such job type", 404);
  const c = await compareOnJob(db, job.id, q.models);
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
    steps: cell.km_steps ?? null,
  }));
  return {
    view: "compare" as const,
    job,
    psi: q.psi,
    tools,
    pairs: c.pairs,
    topLabel: c.top ? label(c.top) : null,
    basis: c.basis,
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
  return <Comparison {...loaderData} />;
}

type ComparisonData = Extract<Route.ComponentProps["loaderData"], { view: "compare" }>;

function Comparison({ job, tools, pairs, topLabel, psi: initialPsi }: ComparisonData) {
  const [psi, setPsi] = useState(initialPsi);
  const label = (s: string) => tools.find((t) => t.slug === s)!.label;
  return (
    <div className="space-y-5">
      <header>
        <p className="text-sm">
          <Link to={`/jobs/${job.slug}`} className="text-bay-700 underline">
            ← {job.name}
          </Link>
        </p>
        <h1 className="text-2xl font-bold">Side by side: {job.name}</h1>
      </header>
      <IntervalsExplained />
      <section aria-labelledby="top-heading" className="space-y-2">
        <h2 id="top-heading" className="text-lg font-semibold">
          Against the top tool on this job
        </h2>
        <AgainstTop tools={tools} topLabel={topLabel} />
      </section>
      <PairsTable pairs={pairs} label={label} topLabel={topLabel} />

      <section aria-labelledby="time-heading" className="space-y-2">
        <h2 id="time-heading" className="text-lg font-semibold">
          Median time to free it, counting give-ups
        </h2>
        <SurvivalCurves
          tools={tools.map((t) => ({ slug: t.slug, label: t.label, steps: t.steps, colour: t.colour }))}
        />
      </section>

      <section aria-labelledby="pressure-heading" className="space-y-2">
        <h2 id="pressure-heading" className="text-lg font-semibold">
          Success against inlet pressure
        </h2>
        <Form method="get" className="flex flex-wrap items-end gap-2">
          <input type="hidden" name="job" value={job.slug} />
          <input type="hidden" name="models" value={tools.map((t) => t.slug).join(",")} />
          <label className="block text-sm">
            <span className="font-semibold">Pressure at your tool inlet, psi</span>
            <select
              name="psi"
              value={psi}
              onChange={(e) => setPsi(Number(e.target.value))}
              className="mt-1 block rounded border border-stone-300 px-3 py-2"
            >
              {[...new Set([70, 80, 90, 100, 110, initialPsi])]
                .sort((a, b) => a - b)
                .map((v) => (
                  <option key={v} value={v}>
                    {v}
                  </option>
                ))}
            </select>
          </label>
          <noscript>
            <button type="submit" className={buttonClass("primary", "sm")}>
              Show
            </button>
          </noscript>
        </Form>
        <AtPressureTable tools={tools} psi={psi} />
        <PressureCurves tools={tools} psi={psi} />
      </section>
    </div>
  );
}

export function meta({ data }: Route.MetaArgs) {
  return [{ title: data && "job" in data ? `Compare on ${data.job.name} — Bayproof` : "Compare — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
