import { Link } from "react-router";
import { readDb as db } from "~/db.server";
import { ErrorPage } from "~/components/error-page";
import { CellTable } from "~/components/cell-table";
import { IntervalsExplained } from "~/components/intervals";
import { Pager } from "~/components/pager";
import { ModelSpecs } from "~/components/catalogue/model-specs";
import { EvidenceGallery, ReportList } from "~/components/report-table";
import { SafetyCautions } from "~/components/safety-cautions";
import { buttonClass } from "~/components/ui";
import { unitsFor } from "~/auth/units.server";
import { toolName, type Units } from "~/domain";
import { sharedPageRead } from "~/http-cache/serve.server";
import { acceptedReports, countAccepted, getModelBySlug, publishedEvidenceForModel } from "~/catalogue/queries.server";
import { cellsForModel } from "~/stats/cells.server";
import { ModelExposurePanel } from "~/components/exposure/model-exposure-panel";
import { modelExposure } from "~/exposure/pages.server";
import { benchForModel } from "~/bench/figures-read.server";
import { ModelBenchPanel } from "~/components/bench/model-panel";
import { invariantResponse } from "~/utils/http";
import { parsePage, parseSlug } from "~/utils/params";
import type { Route } from "./+types/models.$slug";

const PER_PAGE = 20;

export async function loader({ params, request }: Route.LoaderArgs) {
  const units = await unitsFor(request);
  // The same for every viewer with these units: shared until the next change (app/http-cache).
  return sharedPageRead("models/:slug", request, units, () => modelPageData(params.slug, request, units));
}

async function modelPageData(slugParam: string | undefined, request: Request, units: Units) {
  const page = parsePage(request);
  const model = await getModelBySlug(db, parseSlug(slugParam));
  invariantResponse(model, "No such tool model", 404);
  const [jobs, reports, total, published, exposure, bench] = await Promise.all([
    cellsForModel(db, model.id),
    acceptedReports(db, { modelId: model.id, limit: PER_PAGE, offset: (page - 1) * PER_PAGE }),
    countAccepted(db, { modelId: model.id }),
    publishedEvidenceForModel(db, model.id),
    modelExposure(db, model.id, new URL(request.url)),
    benchForModel(db, model.id),
  ]);
  return {
    model,
    jobs,
    reports,
    units,
    page,
    pages: Math.max(1, Math.ceil(total / PER_PAGE)),
    exposure,
    published,
    bench,
  };
}

export default function ModelPage({ loaderData }: Route.ComponentProps) {
  const { model, jobs, reports, units, page, pages } = loaderData;

  return (
    <div className="space-y-6">
      <header>
        <p className="text-sm text-stone-600">
          {model.category_name} · {model.maker_name}
        </p>
        <h1 className="text-2xl font-bold">{toolName(model.maker_name, model.model_code)}</h1>
        <p className="text-stone-700">{model.name}</p>
      </header>

      <ModelSpecs model={model} units={units} />

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

      <ModelBenchPanel runs={loaderData.bench.runs} acrossRigs={loaderData.bench.acrossRigs} units={units} />
      <ModelExposurePanel exposure={loaderData.exposure} modelSlug={model.slug} />
      <SafetyCautions action={model.category_action} />
      <EvidenceGallery files={loaderData.published} />

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
