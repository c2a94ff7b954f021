// The compare page's parts: the chooser, the pairs (the same rule as the job page), the tools
// against the top tool of the job, and the figures at a chosen inlet pressure worked out in the browser.
import { useState } from "react";
import { Form, Link } from "react-router";
import { formatDuration, psiToKpa } from "~/domain";
import { predictAt, type PooledCellFit } from "~/stats/predict";
import { MARK_LABELS, type Mark } from "~/stats/marks";
import { IntervalsExplained, pct, prob } from "./intervals";
import { PressureCurves, SurvivalCurves } from "./pressure-curves";
import { buttonClass } from "./ui";

export function ChooseJob({
  jobs,
  problem,
}: {
  jobs: { slug: string; name: string; accepted_reports: number }[];
  problem: string | null;
}) {
  return (
    <section className="space-y-3">
      <h1 className="text-2xl font-bold">Compare tools side by side</h1>
      {problem && (
        <p role="alert" className="text-amber-800">
          {problem}
        </p>
      )}
      <p className="text-stone-700">Pick the job first; then tick two to four of the tools reported on it.</p>
      <ul className="grid gap-2 sm:grid-cols-2">
        {jobs.map((j) => (
          <li key={j.slug}>
            <Link to={`/compare?job=${j.slug}`} className="text-bay-700 underline">
              {j.name}
            </Link>{" "}
            <span className="text-sm text-stone-500">({j.accepted_reports} reports)</span>
          </li>
        ))}
      </ul>
    </section>
  );
}

export function ChooseTools({
  job,
  tools,
  chosen,
  problem,
}: {
  job: { slug: string; name: string };
  tools: { slug: string; label: string; n: number }[];
  chosen: string[];
  problem: string | null;
}) {
  return (
    <section className="space-y-3">
      <p className="text-sm">
        <Link to={`/jobs/${job.slug}`} className="text-bay-700 underline">
          ← {job.name}
        </Link>
      </p>
      <h1 className="text-2xl font-bold">Compare on {job.name}</h1>
      {problem && (
        <p role="alert" className="text-amber-800">
          {problem}
        </p>
      )}
      {tools.length < 2 ? (
        <p className="text-stone-700">
          Fewer than two tools have accepted reports on this job, so there is nothing to compare yet.
        </p>
      ) : (
        <Form method="get" className="space-y-2">
          <input type="hidden" name="job" value={job.slug} />
          <fieldset className="grid gap-1 sm:grid-cols-2">
            <legend className="mb-1 font-semibold">Tick two to four tools</legend>
            {tools.map((t) => (
              <label key={t.slug} className="flex items-center gap-2 py-1">
                <input
                  type="checkbox"
                  name="models"
                  value={t.slug}
                  defaultChecked={chosen.includes(t.slug)}
                  className="h-5 w-5"
                />{" "}
                {t.label} <span className="text-xs text-stone-500">({t.n} reports)</span>
              </label>
            ))}
          </fieldset>
          <button type="submit" className="rounded bg-bay-700 px-4 py-2 font-semibold text-white">
            Compare
          </button>
        </Form>
      )}
    </section>
  );
}

export interface CompareTool {
  slug: string;
  label: string;
  colour: string;
  n: number;
  reporters: number;
  estimate: number;
  lower: number;
  upper: number;
  mark: Mark;
  km: { median: number | null; lower: number | null; upper: number | null };
  steps: { time: number; survival: number }[] | null;
  fit: PooledCellFit | null;
  adjReason: string | null;
}

export interface ComparePair {
  a: string;
  b: string;
  distinguishable: boolean;
  difference: { estimate: number; lower: number; upper: number };
  chanceAFreesMore: number;
}

export function PairsTable({
  pairs,
  label,
  topLabel,
}: {
  pairs: ComparePair[];
  label: (slug: string) => string;
  topLabel: string | null;
}) {
  return (
    <section aria-labelledby="beats-heading" className="space-y-2">
      <h2 id="beats-heading" className="text-lg font-semibold">
        Which frees it more often?
      </h2>
      <ul className="space-y-2">
        {pairs.map((p) => (
          <li
            key={`${p.a}-${p.b}`}
            data-testid="pair"
            data-a={p.a}
            data-b={p.b}
            data-told={String(p.distinguishable)}
            className="rounded-lg border border-stone-200 bg-white p-3 text-sm"
          >
            <p className="font-semibold">
              {label(p.a)} vs {label(p.b)}
            </p>
            <p>
              {!p.distinguishable
                ? "Can't be told apart yet."
                : `${label(p.difference.estimate > 0 ? p.a : p.b)} frees it more often.`}{" "}
              Difference {pct(p.difference.estimate)} ({pct(p.difference.lower)} to {pct(p.difference.upper)}); chance
              the first frees it more often {prob(p.chanceAFreesMore)}.
            </p>
          </li>
        ))}
      </ul>
      <details className="text-xs text-stone-700">
        <summary className="cursor-pointer text-bay-700">How this is worked out</summary>
        <p className="mt-1">
          Two tools are told apart when the 95 % interval of the difference of their rates leaves out zero (Newcombe's
          hybrid score method, each rate's Wilson limits at its effective sample size n / design effect, reports
          clustered by reporter). The job page marks each tool against {topLabel ?? "its top tool"} by the same rule.
          The chance is from Beta posteriors with uniform priors (exact sum); it does not decide anything.
        </p>
      </details>
    </section>
  );
}

export function AgainstTop({ tools, topLabel }: { tools: CompareTool[]; topLabel: string | null }) {
  return (
    <ul className="space-y-1 text-sm" aria-label="Against the top tool on this job">
      {tools.map((t) => (
        <li key={t.slug} data-testid="vs-top" data-slug={t.slug} data-mark={MARK_LABELS[t.mark]}>
          <span className="mr-2 inline-block h-3 w-3 rounded-full" style={{ background: t.colour }} aria-hidden />
          <span className="font-semibold">{t.label}</span>: {pct(t.estimate)} ({pct(t.lower)}–{pct(t.upper)}) from{" "}
          {t.reporters} reporter{t.reporters === 1 ? "" : "s"} — {MARK_LABELS[t.mark]}
          {t.mark !== "top" && topLabel ? ` (${topLabel})` : ""}; median time to free it, counting give-ups:{" "}
          {t.km.median == null ? "not reached" : formatDuration(t.km.median)}
        </li>
      ))}
    </ul>
  );
}

/** Each tool's chance at the chosen pressure, from its stored share of the job's fit (no round trip). */
export function AtPressureTable({ tools, psi }: { tools: CompareTool[]; psi: number }) {
  return (
    <ul className="space-y-1 text-sm">
      {tools.map((t) => {
        const at = t.fit ? predictAt(t.fit, psiToKpa(psi)) : null;
        return (
          <li key={t.slug} data-testid={`at-${t.slug}`}>
            <span className="mr-2 inline-block h-3 w-3 rounded-full" style={{ background: t.colour }} aria-hidden />
            {t.label} at {psi} psi:{" "}
            {at ? (
              <>
                {prob(at.estimate)} ({prob(at.lower)}–{prob(at.upper)})
                {at.extrapolating && (
                  <span className="ml-1 text-xs text-amber-700">
                    beyond the 10th–90th percentile of its reports' pressures
                  </span>
                )}
              </>
            ) : (
              <span className="text-xs text-stone-500">{t.adjReason ?? "no pressure fit"}</span>
            )}
          </li>
        );
      })}
    </ul>
  );
}

interface ComparisonData {
  job: { slug: string; name: string };
  psi: number;
  tools: CompareTool[];
  pairs: ComparePair[];
  topLabel: string | null;
}

export function Comparison({ job, tools, pairs, topLabel, psi: initialPsi }: ComparisonData) {
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
