import { config } from "~/config.server";
import { readDb } from "~/db.server";
import { benchBulkResponse } from "~/feed/bench-bulk.server";
import { callerContext } from "~/feed/context";
import { answer, feedError, readParams } from "~/feed/http.server";
import type { Route } from "./+types/api.v1.bench-runs.bulk";

// Every accepted bench run in one file: bench-runs.ndjson (a run a line) or bench-runs.csv (a trial a
// row). For API keys, as the report files are.
export async function loader({ request, context }: Route.LoaderArgs) {
  return answer(async () => {
    const url = new URL(request.url);
    readParams(url, {});
    if (context.get(callerContext)?.tier !== "key") {
      throw feedError(
        401,
        "api_key_required",
        'The bulk files need an API key: sign in, create one on your account page, and send it as "Authorization: Bearer <key>".',
        undefined,
        { "WWW-Authenticate": 'Bearer realm="bayproof-feed"' },
      );
    }
    const format = url.pathname.endsWith(".csv") ? "csv" : "ndjson";
    return benchBulkResponse(readDb, format, config.appOrigin, new Date().toISOString().slice(0, 10));
  });
}
