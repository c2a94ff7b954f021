import { config } from "~/config.server";
import { readDb } from "~/db.server";
import { filtersDigest, walkAnswer } from "~/feed/cursor.server";
import { answer, feedError, readParams } from "~/feed/http.server";
import { cursorParam, instantParam, limitParam, slugParam } from "~/feed/params";
import { newHorizon, reportPage, resolveSlugs } from "~/feed/queries.server";
import type { Route } from "./+types/api.v1.reports";

const params = {
  model: slugParam,
  job: slugParam,
  category: slugParam,
  accepted_since: instantParam,
  accepted_until: instantParam,
  limit: limitParam,
  cursor: cursorParam,
};

// Accepted reports, oldest accepted first, a page at a time. The first page fixes the walk's
// horizon; its cursors carry it, so a walk sees every report once while new ones are accepted.
export async function loader({ request }: Route.LoaderArgs) {
  return answer(async () => {
    const url = new URL(request.url);
    const { limit, cursor, ...filters } = readParams(url, params);
    if (filters.accepted_since && filters.accepted_until && filters.accepted_since >= filters.accepted_until) {
      throw feedError(
        400,
        "invalid_parameter",
        `"accepted_until" must be later than "accepted_since".`,
        "accepted_until",
      );
    }
    const ids = await resolveSlugs(readDb, filters);
    const digest = filtersDigest({
      ...filters,
      accepted_since: filters.accepted_since?.toISOString(),
      accepted_until: filters.accepted_until?.toISOString(),
    });
    return walkAnswer(request, readDb, {
      url,
      origin: config.appOrigin,
      cursor,
      digest,
      horizon: () => newHorizon(readDb),
      page: (asOf, after) =>
        reportPage(
          readDb,
          config.appOrigin,
          { ...ids, accepted_since: filters.accepted_since, accepted_until: filters.accepted_until },
          limit,
          asOf,
          after,
        ),
    });
  });
}
