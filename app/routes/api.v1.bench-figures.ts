import { readDb } from "~/db.server";
import { benchFigureRecords, resolveBenchFilters } from "~/feed/bench-queries.server";
import { answer, CACHE, feedError, jsonResponse, readParams } from "~/feed/http.server";
import { idParam, slugParam } from "~/feed/params";
import type { Route } from "./+types/api.v1.bench-figures";

// The stored bench figures across rigs, per tool model and protocol series, with the pressure lines.
export async function loader({ request }: Route.LoaderArgs) {
  return answer(async () => {
    const { model, protocol, series } = readParams(new URL(request.url), {
      model: slugParam,
      protocol: slugParam,
      series: idParam.optional(),
    });
    const { modelId } = await resolveBenchFilters(readDb, { model, protocol });
    if (series !== undefined) {
      const known = await readDb
        .selectFrom("bench_protocol_series")
        .select("id")
        .where("id", "=", series)
        .executeTakeFirst();
      if (!known)
        throw feedError(
          400,
          "unknown_value",
          `"series": no protocol series has the id ${series} (see the series of /api/v1/bench-protocols).`,
          "series",
        );
    }
    return jsonResponse(request, { data: await benchFigureRecords(readDb, { modelId, protocol, series }) }, CACHE.live);
  });
}
