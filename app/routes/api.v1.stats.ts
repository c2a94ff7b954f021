import { readDb } from "~/db.server";
import { answer, CACHE, jsonResponse, readParams } from "~/feed/http.server";
import { slugParam } from "~/feed/params";
import { resolveSlugs, statRecords } from "~/feed/queries.server";
import type { Route } from "./+types/api.v1.stats";

// The stored stats cells: success with its Wilson interval, and pressure-adjusted where shown.
export async function loader({ request }: Route.LoaderArgs) {
  return answer(async () => {
    const filters = readParams(new URL(request.url), { model: slugParam, job: slugParam, category: slugParam });
    return jsonResponse(request, { data: await statRecords(readDb, await resolveSlugs(readDb, filters)) }, CACHE.live);
  });
}
