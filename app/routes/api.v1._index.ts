import { config } from "~/config.server";
import { answer, CACHE, jsonResponse, readParams } from "~/feed/http.server";
import { SCHEMA_NAMES } from "~/feed/schemas";
import type { Route } from "./+types/api.v1._index";

// What the feed offers, as links.
export async function loader({ request }: Route.LoaderArgs) {
  return answer(async () => {
    readParams(new URL(request.url), {});
    const at = (p: string) => `${config.appOrigin}/api/v1/${p}`;
    return jsonResponse(
      request,
      {
        documentation: `${config.appOrigin}/data`,
        openapi: at("openapi.json"),
        datapackage: at("datapackage.json"),
        reports: at("reports"),
        reports_ndjson: at("reports.ndjson"),
        reports_csv: at("reports.csv"),
        models: at("models"),
        job_types: at("job-types"),
        stats: at("stats"),
        bench_runs: at("bench-runs"),
        bench_runs_ndjson: at("bench-runs.ndjson"),
        bench_runs_csv: at("bench-runs.csv"),
        rigs: at("rigs"),
        bench_protocols: at("bench-protocols"),
        bench_figures: at("bench-figures"),
        schemas: Object.fromEntries(SCHEMA_NAMES.map((n) => [n, at(`schema/${n}.json`)])),
        licence: "CC-BY-4.0",
      },
      CACHE.document,
    );
  });
}
