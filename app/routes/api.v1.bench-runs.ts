import { config } from "~/config.server";
import { readDb } from "~/db.server";
import { benchHorizon, benchRunPage, resolveBenchFilters } from "~/feed/bench-queries.server";
import { filtersDigest, walkAnswer } from "~/feed/cursor.server";
import { answer, readParams } from "~/feed/http.server";
import { cursorParam, idParam, limitParam, slugParam } from "~/feed/params";
import type { Route } from "./+types/api.v1.bench-runs";

const params = {
  model: slugParam,
  rig: idParam.optional(),
  protocol: slugParam,
  limit: limitParam,
  cursor: cursorParam,
};

// Accepted bench runs, oldest accepted first, a page at a time, walked as /api/v1/reports is: the
// first page fixes the horizon, and the cursors (signed, bound to these filters) carry it.
export async function loader({ request }: Route.LoaderArgs) {
  return answer(async () => {
    const url = new URL(request.url);
    const { limit, cursor, ...filters } = readParams(url, params);
    const resolved = await resolveBenchFilters(readDb, filters);
    // The endpoint's name in the digest: a report walk's cursor is refused here, and the other way round.
    const digest = filtersDigest({ endpoint: "bench-runs", ...filters });
    return walkAnswer(request, readDb, {
      url,
      origin: config.appOrigin,
      cursor,
      digest,
      horizon: () => benchHorizon(readDb),
      page: (asOf, after) => benchRunPage(readDb, config.appOrigin, resolved, limit, asOf, after),
    });
  });
}
