import { readDb } from "~/db.server";
import { benchProtocolRecords } from "~/feed/bench-queries.server";
import { answer, CACHE, jsonResponse, readParams } from "~/feed/http.server";
import type { Route } from "./+types/api.v1.bench-protocols";

// Every version of every bench protocol, with its series.
export async function loader({ request }: Route.LoaderArgs) {
  return answer(async () => {
    readParams(new URL(request.url), {});
    return jsonResponse(request, { data: await benchProtocolRecords(readDb) }, CACHE.live);
  });
}
