import { redirect } from "react-router";
import { readDb } from "~/db.server";
import { publishedTraceKey } from "~/feed/bench-queries.server";
import { answer, feedError, readRecordId } from "~/feed/http.server";
import { presignGet } from "~/storage/s3.server";
import type { Route } from "./+types/api.v1.bench-traces.$id";

// The raw trace of one trial of an accepted bench run (the trial's trace_url): a redirect to a
// ten-minute link to the CSV. Trials of runs not accepted, and typed trials, answer 404.
export async function loader({ request, params }: Route.LoaderArgs) {
  return answer(async () => {
    const id = readRecordId(request, params.id, "the trial number of a trace_url");
    const key = await publishedTraceKey(readDb, id);
    if (!key) throw feedError(404, "not_found", `No published trace belongs to the trial ${id}.`, "id");
    return redirect(await presignGet(key, 600), { headers: { "Cache-Control": "private, max-age=300" } });
  });
}
