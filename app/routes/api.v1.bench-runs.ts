import { config } from "~/config.server";
import { readDb } from "~/db.server";
import { benchHorizon, benchRunPage, resolveBenchFilters } from "~/feed/bench-queries.server";
import { decodeCursor, encodeCursor, filtersDigest } from "~/feed/cursor.server";
import { answer, CACHE, jsonResponse, readParams } from "~/feed/http.server";
import { cursorParam, idParam, limitParam, slugParam } from "~/feed/params";
import { microsToIso } from "~/feed/queries.server";
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
    const state = cursor ? await decodeCursor(readDb, cursor, digest) : null;
    const asOf = state?.asOfMicros ?? (await benchHorizon(readDb));
    const page = await benchRunPage(
      readDb,
      config.appOrigin,
      resolved,
      limit,
      asOf,
      state ? { micros: state.afterMicros, id: state.afterId } : undefined,
    );
    const nextCursor = page.next
      ? await encodeCursor(readDb, {
          afterMicros: page.next.micros,
          afterId: page.next.id,
          asOfMicros: asOf,
          filters: digest,
        })
      : null;
    const headers: Record<string, string> = {};
    if (nextCursor) {
      const next = new URL(`${config.appOrigin}/api/v1/bench-runs`);
      for (const [k, v] of url.searchParams) if (k !== "cursor") next.searchParams.set(k, v);
      next.searchParams.set("cursor", nextCursor);
      headers.Link = `<${next.toString()}>; rel="next"`;
    }
    return jsonResponse(
      request,
      { data: page.records, next_cursor: nextCursor, as_of: microsToIso(asOf) },
      CACHE.live,
      headers,
    );
  });
}
