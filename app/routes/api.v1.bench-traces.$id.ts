import { redirect } from "react-router";
import { readDb } from "~/db.server";
import { publishedTraceKey } from "~/feed/bench-queries.server";
import { answer, feedError, readParams } from "~/feed/http.server";
import { idParam } from "~/feed/params";
import { presignGet } from "~/storage/s3.server";
import type { Route } from "./+types/api.v1.bench-traces.$id";

// The raw trace of one trial of an accepted bench run (the trial's trace_url): a redirect to a
// ten-minute link to the CSV. Trials of runs not accepted, and typed trials, answer 404.
export async function loader({ request, params }: Route.LoaderArgs) {
  return answer(async () => {
    readParams(new URL(request.url), {});
    const id = idParam.safeParse(params.id);
    if (!id.success)
      throw feedError(
        400,
        "invalid_parameter",
        `"id" ${id.error.issues[0]?.message ?? "cannot be read"}: give the trial number of a trace_url.`,
        "id",
      );
    const key = await publishedTraceKey(readDb, id.data);
    if (!key) throw feedError(404, "not_found", `No published trace belongs to the trial ${id.data}.`, "id");
    return redirect(await presignGet(key, 600), { headers: { "Cache-Control": "private, max-age=300" } });
  });
}
