import { config } from "~/config.server";
import { readDb } from "~/db.server";
import { answer, CACHE, feedError, jsonResponse, readParams } from "~/feed/http.server";
import { idParam } from "~/feed/params";
import { reportById } from "~/feed/queries.server";
import type { Route } from "./+types/api.v1.reports.$id";

// One accepted report; anything else (a draft, a rejected report, no report) is a 404.
export async function loader({ request, params }: Route.LoaderArgs) {
  return answer(async () => {
    readParams(new URL(request.url), {});
    const id = idParam.safeParse(params.id);
    if (!id.success)
      throw feedError(
        400,
        "invalid_parameter",
        `"id" ${id.error.issues[0]?.message ?? "cannot be read"}: give a report number.`,
        "id",
      );
    const record = await reportById(readDb, config.appOrigin, id.data);
    if (!record) throw feedError(404, "not_found", `No accepted report has the number ${id.data}.`, "id");
    return jsonResponse(request, record, CACHE.record);
  });
}
