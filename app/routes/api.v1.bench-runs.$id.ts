import { config } from "~/config.server";
import { readDb } from "~/db.server";
import { benchRunById } from "~/feed/bench-queries.server";
import { answer, CACHE, feedError, jsonResponse, readRecordId } from "~/feed/http.server";
import type { Route } from "./+types/api.v1.bench-runs.$id";

// One accepted bench run with its series and trials; a draft, a held, returned or rejected run, or
// no run at all, is a 404.
export async function loader({ request, params }: Route.LoaderArgs) {
  return answer(async () => {
    const id = readRecordId(request, params.id, "a bench run number");
    const record = await benchRunById(readDb, config.appOrigin, id);
    if (!record) throw feedError(404, "not_found", `No accepted bench run has the number ${id}.`, "id");
    return jsonResponse(request, record, CACHE.record);
  });
}
