import { scaleLinear } from "d3-scale";
import { area, line } from "d3-shape";
import { useEffect, useState } from "react";
import { data, Form, Link, useFetcher } from "react-router";
import { z } from "zod";
import { kpaToPsi, psiToKpa, slugField, toolName } from "~/domain";
import { ErrorPage } from "~/components/error-page";
import { IntervalsExplained, pct } from "~/components/intervals";
import { getJobBySlug } from "~/catalogue/queries.server";
import { db } from "~/db.server";
import { differenceInterval, probabilityGreater } from "~/stats";
import { predictAt } from "~/stats/cells";
import { cellBySlugs } from "~/stats/cells.server";
import type { Route } from "./+types/compare";

const slug = slugField();
const querySchema = z.object({
  job: slug,
  models: z.string().max(400).transform((s) => [...new Set(s.split(",").map((x) => x.trim()).filter(Boolean))]).pipe(z.array(slug).min(2, "Pick two to four tools").max(4, "At most four tools")),
  psi: z.coerce.number().min(40).max(200).default(90),
});

export async function loader({ request }: Route.LoaderArgs) {
  const parsed = querySchema.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!parsed.success) throw data(parsed.error.issues[0]?.message ?? "Give a job and two to four tools", { status: 400 });
  const { job: jobSlug, models, psi } = parsed.data;
  const job = await getJobBySlug(db, jobSlug);
  if (!job) throw data("No such job type", { status: 404 });
  const cells = (await Promise.all(models.map((m) => cellBySlugs(db, m, jobSlug)))).filter((c) => c != null);
  if (cells.length < 2) throw data("At least two of these tools need accepted reports on this job", { status: 404 });
  const pairs = cells.flatMap((a, i) => cells.slice(i + 1).map((b) => ({
    a: a.model_slug, b: b.model_slug,
    pAbeatsB: probabilityGreater(a.successes, a.n, b.successes, b.n),
    diff: differenceInterval(a.successes, a.n, b.successes, b.n),
  })));
  const atKpa = psiToKpa(psi);
  return {
    job, psi, pairs,
    cells: cells.map((c) => ({
      slug: c.model_slug, label: toolName(c.maker_name, c.model_code), n: c.n, successes: c.successes, estimate: c.estimate, lower: c.lower, upper: c.upper,
      fit: c.fit, adjReason: c.adj_reason, at: c.fit ? predictAt(c.fit, atKpa) : null,
    })),
  };
}

const COLOURS = ["#2f6b5f", "#b45309", "#1d4ed8", "#7c3aed"];

export default function Compare({ loaderData }: Route.ComponentProps) {
  const { job, cells, pairs } = loaderData;
  const [psi, setPsi] = useState(loaderData.psi);
  const label = (s: string) => cells.find((c) => c.slug === s)!.label;
  return (
    <div className="space-y-5">
      <header>
        <p className="text-sm"><Link to={`/jobs/${job.slug}`} className="text-bay-700 underline">← {job.name}</Link></p>
        <h1 className="text-2xl font-bold">Side by side: {job.name}</h1>
      </header>
      <IntervalsExplained />

      <section aria-labelledby="beats-heading">
        <h2 id="beats-heading" className="mb-2 text-lg font-semibold">Which frees it more often?</h2>
        <div className="overflow-x-auto rounded-lg border border-stone-200 bg-white">
          <table className="w-full min-w-[36rem] text-left text-sm">
            <thead className="bg-stone-100 text-xs uppercase text-stone-600">
              <tr><th className="px-3 py-2">Pair</th><th className="px-3 py-2">Chance the first frees it more often</th><th className="px-3 py-2">Difference in rate (95 %)</th></tr>
            </thead>
            <tbody className="divide-y divide-stone-100">
              {pairs.map((p) => (
                <tr key={`${p.a}-${p.b}`}>
                  <td className="px-3 py-2">{label(p.a)} vs {label(p.b)}</td>
                  <td className="px-3 py-2">{pct(p.pAbeatsB)}</td>
                  <td className="px-3 py-2">
                    {pct(p.diff.estimate)} ({pct(p.diff.lower)} to {pct(p.diff.upper)})
                    {p.diff.lower <= 0 && p.diff.upper >= 0 && <span className="ml-2 text-xs text-stone-500">includes no difference</span>}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <p className="mt-1 text-xs text-stone-600">Chance from Beta posteriors with uniform priors (exact sum); difference by Newcombe's hybrid score method.</p>
      </section>

      <section aria-labelledby="pressure-heading" className="space-y-2">
        <h2 id="pressure-heading" className="text-lg font-semibold">Success against inlet pressure</h2>
        <Form method="get" className="flex flex-wrap items-end gap-2">
          <input type="hidden" name="job" value={job.slug} />
          <input type="hidden" name="models" value={cells.map((c) => c.slug).join(",")} />
          <label className="block text-sm">
            <span className="font-semibold">Pressure at your tool inlet, psi</span>
            <select name="psi" value={psi} onChange={(e) => setPsi(Number(e.target.value))} className="mt-1 block rounded border border-stone-300 px-3 py-2">
              {[70, 80, 90, 100, 110].map((v) => <option key={v} value={v}>{v}</option>)}
            </select>
          </label>
          <noscript><button type="submit" className="rounded bg-bay-700 px-3 py-2 text-white">Show</button></noscript>
        </Form>
        <div className="overflow-x-auto rounded-lg border border-stone-200 bg-white">
          <table className="w-full text-left text-sm">
            <thead className="bg-stone-100 text-xs uppercase text-stone-600"><tr><th className="px-3 py-2">Tool</th><th className="px-3 py-2">All reports</th><th className="px-3 py-2">At {psi} psi</th></tr></thead>
            <tbody className="divide-y divide-stone-100">
              {cells.map((c, i) => <AtPressureRow key={c.slug} cell={c} job={job.slug} psi={psi} initialPsi={loaderData.psi} colour={COLOURS[i]!} />)}
            </tbody>
          </table>
        </div>
        <PressureCurves cells={cells} psi={psi} />
      </section>
    </div>
  );
}

type CompareCell = Route.ComponentProps["loaderData"]["cells"][number];

/** Refetches the cell's figure at the chosen pressure from /api/stats/cell when it changes. */
function AtPressureRow({ cell, job, psi, initialPsi, colour }: { cell: CompareCell; job: string; psi: number; initialPsi: number; colour: string }) {
  const fetcher = useFetcher<{ at_inlet: { estimate: number; lower: number; upper: number; extrapolating: boolean } | null }>();
  useEffect(() => {
    if (psi !== initialPsi && cell.fit) fetcher.load(`/api/stats/cell?model=${cell.slug}&job=${job}&inlet_kpa=${psiToKpa(psi).toFixed(1)}`);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [psi]);
  const at = psi === initialPsi ? cell.at : fetcher.data?.at_inlet ?? null;
  return (
    <tr>
      <td className="px-3 py-2"><span className="mr-2 inline-block h-3 w-3 rounded-full" style={{ background: colour }} aria-hidden />{cell.label}</td>
      <td className="px-3 py-2">{pct(cell.estimate)} ({pct(cell.lower)}–{pct(cell.upper)}), n = {cell.n}</td>
      <td className="px-3 py-2" data-testid={`at-${cell.slug}`}>
        {!cell.fit ? <span className="text-xs text-stone-500">{cell.adjReason}</span>
          : fetcher.state === "loading" ? "…"
            : at ? <>{pct(at.estimate)} ({pct(at.lower)}–{pct(at.upper)}){at.extrapolating && <span className="ml-1 text-xs text-amber-700">beyond the reports' pressures</span>}</> : "—"}
      </td>
    </tr>
  );
}

function PressureCurves({ cells, psi }: { cells: CompareCell[]; psi: number }) {
  const fitted = cells.map((c, i) => ({ c, colour: COLOURS[i]! })).filter((x) => x.c.fit);
  if (fitted.length === 0) return <p className="text-sm text-stone-600">None of these tools has enough reports over a wide enough pressure range for a curve.</p>;
  const W = 560, H = 260, m = { l: 44, r: 12, t: 10, b: 36 };
  const x = scaleLinear().domain([60, 130]).range([m.l, W - m.r]);
  const y = scaleLinear().domain([0, 1]).range([H - m.b, m.t]);
  return (
    <figure className="rounded-lg border border-stone-200 bg-white p-3">
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-labelledby="curves-title" className="h-auto w-full">
        <title id="curves-title">Predicted share freed against inlet pressure, with 95 % bands over the pressures reported</title>
        {y.ticks(5).map((t) => <g key={t}><line x1={m.l} x2={W - m.r} y1={y(t)} y2={y(t)} stroke="#e7e5e4" /><text x={m.l - 6} y={y(t)} textAnchor="end" dominantBaseline="middle" fontSize="11" fill="#57534e">{pct(t)}</text></g>)}
        {x.ticks(7).map((t) => <text key={t} x={x(t)} y={H - m.b + 16} textAnchor="middle" fontSize="11" fill="#57534e">{t}</text>)}
        <text x={(m.l + W - m.r) / 2} y={H - 4} textAnchor="middle" fontSize="12" fill="#44403c">inlet pressure (psi)</text>
        <line x1={x(psi)} x2={x(psi)} y1={m.t} y2={H - m.b} stroke="#dc2626" strokeDasharray="5 4" />
        {fitted.map(({ c, colour }) => {
          const lo = Math.max(60, kpaToPsi(c.fit!.minKpa)), hi = Math.min(130, kpaToPsi(c.fit!.maxKpa));
          const pts = Array.from({ length: 30 }, (_, i) => lo + ((hi - lo) * i) / 29).map((p) => ({ p, ...predictAt(c.fit!, psiToKpa(p)) }));
          const band = area<(typeof pts)[number]>().x((d) => x(d.p)).y0((d) => y(d.lower)).y1((d) => y(d.upper));
          const mid = line<(typeof pts)[number]>().x((d) => x(d.p)).y((d) => y(d.estimate));
          return (
            <g key={c.slug}>
              <path d={band(pts) ?? ""} fill={colour} opacity={0.15} />
              <path d={mid(pts) ?? ""} fill="none" stroke={colour} strokeWidth={2.5} />
            </g>
          );
        })}
      </svg>
      <figcaption className="mt-1 text-xs text-stone-600">Each curve spans only the inlet pressures its reports cover (logistic fit, Wald band on the logit scale). The red line is the pressure chosen above.</figcaption>
    </figure>
  );
}

export function meta({ data }: Route.MetaArgs) {
  return [{ title: data ? `Compare on ${data.job.name} — Bayproof` : "Compare — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
