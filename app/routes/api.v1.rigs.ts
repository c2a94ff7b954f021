import { readDb } from "~/db.server";
import { rigRecords } from "~/feed/bench-queries.server";
import { answer, CACHE, jsonResponse, readParams } from "~/feed/http.server";
import type { Route } from "./+types/api.v1.rigs";

// Every rig with its sensor, its latest calibration and its standing today, and its check standard.
export async function loader({ request }: Route.LoaderArgs) {
  return answer(async () => {
    readParams(new URL(request.url), {});
    return jsonResponse(request, { data: await rigRecords(readDb) }, CACHE.live);
  });
}
