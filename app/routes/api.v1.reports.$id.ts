import { config } from "~/config.server";
import { readDb } from "~/db.server";
import { answer, CACHE, feedError, jsonResponse, readRecordId } from "~/feed/http.server";
import { reportById } from "~/feed/queries.server";
import type { Route } from "./+types/api.v1.reports.$id";

// One accepted report; anything else (a draft, a rejected report, no report) is a 404.
export async function loader({ request, params }: Route.LoaderArgs) {
  return answer(async () => {
    const id = readRecordId(request, params.id, "a report number");
    const record = await reportById(readDb, config.appOrigin, id);
    if (!record) throw feedError(404, "not_found", `No accepted report has the number ${id}.`, "id");
    return jsonResponse(request, record, CACHE.record);
  });
}
