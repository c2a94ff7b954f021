import { Link } from "react-router";
import { db } from "~/db.server";
import { ErrorPage } from "~/components/error-page";
import { CellTable } from "~/components/cell-table";
import { IntervalsExplained } from "~/components/intervals";
import { Pager } from "~/components/pager";
import { ReportList } from "~/components/report-table";
import { SafetyCautions } from "~/components/safety-cautions";
import { buttonClass, Card } from "~/components/ui";
import { unitsFor } from "~/auth/units.server";
import {
  FITTING_LABELS,
  formatFlow,
  formatLength,
  formatPressure,
  formatPrice,
  formatTorque,
  formatWeight,
  RATED_INLET_KPA,
  toolName,
} from "~/domain";
import { acceptedReports, countAccepted, getModelBySlug } from "~/catalogue/queries.server";
import { cellsForModel } from "~/stats/cells.server";
import { benchForModel } from "~/bench/figures-read.server";
import { ModelBenchPanel } from "~/components/bench/model-panel";
import { invariantResponse } from "~/utils/http";
import { parsePage, parseSlug } from "~/utils/params";
import type { Route } from "./+types/models.$slug";

const PER_PAGE = 20;

export async function loader({ params, request }: Route.LoaderArgs) {
  const slug = parseSlug(params.slug);
  const page = parsePage(request);
  const model = await getModelBySlug(db, slug);
  invariantResponse(model, "No such tool model", 404);
  const [jobs, reports, total, units, bench] = await Promise.all([
    cellsForModel(db, model.id),
    acceptedReports(db, { modelId: model.id, limit: PER_PAGE, offset: (page - 1) * PER_PAGE }),
    countAccepted(db, { modelId: model.id }),
    unitsFor(request),
    benchForModel(db, model.id),
  ]);
  return { model, jobs, reports, units, bench, page, pages: Math.max(1, Math.ceil(total / PER_PAGE)) };
}

export default function ModelPage({ loaderData }: Route.ComponentProps) {
  const { model, jobs, reports, units, bench, page, pages } = loaderData;
  const measured = new Set(model.measured_specs);
  const spec = (label: string, field: string, value: string | null) =>
    value == null ? null : { label, value, source: measured.has(field) ? "measured" : "maker sheet" };
  const specs = [
    { label: "Fitting", value: FITTING_LABELS[model.fitting] ?? model.fitting, source: "maker sheet" },
    spec("Bore", "bore_mm", model.bore_mm == null ? null : formatLength(model.bore_mm, units)),
    spec("Stroke", "stroke_mm", model.stroke_mm == null ? null : formatLength(model.stroke_mm, units)),
    spec("Blows per minute", "blows_per_minute", model.blows_per_minute?.toLocaleString("en-US") ?? null),
    spec(
      "Free speed",
      "free_speed_rpm",
      model.free_speed_rpm == null ? null : `${model.free_speed_rpm.toLocaleString("en-US")} rpm`,
    ),
    spec(
      "Maker's max torque",
      "max_torque_nm",
      model.max_torque_nm == null ? null : formatTorque(model.max_torque_nm, units),
    ),
    spec("Weight", "weight_kg", formatWeight(model.weight_kg, units)),
    spec("Length", "length_mm", formatLength(model.length_mm, units)),
    spec(
      "Rated air use",
      "rated_air_lps",
      `${formatFlow(model.rated_air_lps, units)} at ${formatPressure(RATED_INLET_KPA, units)}`,
    ),
    { label: "Air inlet", value: model.air_inlet, source: "maker sheet" },
    { label: "Maximum inlet pressure", value: formatPressure(model.max_inlet_kpa, units), source: "maker sheet" },
    { label: "Street price", value: formatPrice(model.street_price_cents), source: "typical" },
  ].filter((s) => s != null);

  return (
    <div className="space-y-6">
      <header>
        <p className="text-sm text-stone-600">
          {model.category_name} · {model.maker_name}
        </p>
        <h1 className="text-2xl font-bold">{toolName(model.maker_name, model.model_code)}</h1>
        <p className="text-stone-700">{model.name}</p>
      </header>

      <Card as="section" aria-labelledby="specs-heading">
        <h2 id="specs-heading" className="mb-2 font-semibold">
          Specifications
        </h2>
        <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-2">
          {specs.map((s) => (
            <div key={s.label} className="flex justify-between gap-3 border-b border-stone-100 py-1 text-sm">
              <dt className="text-stone-600">{s.label}</dt>
              <dd className="text-right">
                {s.value} <span className="text-xs text-stone-600">({s.source})</span>
              </dd>
            </div>
          ))}
        </dl>
      </Card>

      <section aria-labelledby="jobs-heading">
        <h2 id="jobs-heading" className="mb-1 text-lg font-semibold">
          On the job
        </h2>
        <IntervalsExplained />
        {jobs.length === 0 ? (
          <p className="mt-2 text-stone-600">No accepted reports yet.</p>
        ) : (
          <div className="mt-2">
            <CellTable
              firstColumn="Job"
              rows={jobs.map((j) => ({ key: j.job_slug, href: `/jobs/${j.job_slug}`, label: j.job_name, ...j }))}
            />
          </div>
        )}
      </section>

      <p>
        <Link to={`/air?tool=${model.slug}`} className={buttonClass("secondary", "md", "inline-block")}>
          Will my air supply feed this tool? →
        </Link>
      </p>

      <ModelBenchPanel runs={bench.runs} acrossRigs={bench.acrossRigs} units={units} />

      <SafetyCautions action={model.category_action} />

      <section aria-labelledby="reports-heading">
        <h2 id="reports-heading" className="mb-2 text-lg font-semibold">
          Accepted reports
        </h2>
        <ReportList reports={reports} units={units} show={["job"]} />
        <Pager page={page} pages={pages} basePath={`/models/${model.slug}`} />
      </section>
    </div>
  );
}

export function meta({ data }: Route.MetaArgs) {
  if (!data) return [{ title: "Not found — Bayproof" }];
  return [{ title: `${toolName(data.model.maker_name, data.model.model_code)} — Bayproof` }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
