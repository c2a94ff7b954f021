import { config } from "~/config.server";
import { readDb } from "~/db.server";
import { benchRunById } from "~/feed/bench-queries.server";
import { answer, CACHE, feedError, jsonResponse, readParams } from "~/feed/http.server";
import { idParam } from "~/feed/params";
import type { Route } from "./+types/api.v1.bench-runs.$id";

// One accepted bench run with its series and trials; a draft, a held, returned or rejected run, or
// no run at all, is a 404.
export async function loader({ request, params }: Route.LoaderArgs) {
  return answer(async () => {
    readParams(new URL(request.url), {});
    const id = idParam.safeParse(params.id);
    if (!id.success)
      throw feedError(
        400,
        "invalid_parameter",
        `"id" ${id.error.issues[0]?.message ?? "cannot be read"}: give a bench run number.`,
        "id",
      );
    const record = await benchRunById(readDb, config.appOrigin, id.data);
    if (!record) throw feedError(404, "not_found", `No accepted bench run has the number ${id.data}.`, "id");
    return jsonResponse(request, record, CACHE.record);
  });
}
