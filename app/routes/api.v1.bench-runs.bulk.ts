import { config } from "~/config.server";
import { readDb } from "~/db.server";
import { benchBulkResponse } from "~/feed/bench-bulk.server";
import { requireKeyCaller } from "~/feed/access.server";
import { callerContext } from "~/feed/context";
import { answer, readParams } from "~/feed/http.server";
import type { Route } from "./+types/api.v1.bench-runs.bulk";

// Every accepted bench run in one file: bench-runs.ndjson (a run a line) or bench-runs.csv (a trial a
// row). For API keys, as the report files are.
export async function loader({ request, context }: Route.LoaderArgs) {
  return answer(async () => {
    const url = new URL(request.url);
    readParams(url, {});
    requireKeyCaller(context.get(callerContext));
    const format = url.pathname.endsWith(".csv") ? "csv" : "ndjson";
    return benchBulkResponse(readDb, format, config.appOrigin, new Date().toISOString().slice(0, 10));
  });
}
