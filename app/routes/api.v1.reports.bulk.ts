import { config } from "~/config.server";
import { readDb, readPool } from "~/db.server";
import { bulkResponse } from "~/feed/bulk.server";
import { requireKeyCaller } from "~/feed/access.server";
import { callerContext } from "~/feed/context";
import { answer, readParams } from "~/feed/http.server";
import type { Route } from "./+types/api.v1.reports.bulk";

// Every accepted report in one file (reports.ndjson or reports.csv), streamed. Bulk files are
// for API keys: they are free on any account, and keep one client from tying up the database.
export async function loader({ request, context }: Route.LoaderArgs) {
  return answer(async () => {
    const url = new URL(request.url);
    readParams(url, {});
    requireKeyCaller(context.get(callerContext));
    const format = url.pathname.endsWith(".csv") ? "csv" : "ndjson";
    return bulkResponse(readDb, readPool, request, format, config.appOrigin, new Date().toISOString().slice(0, 10));
  });
}
