import { readDb } from "~/db.server";
import { answer, CACHE, jsonResponse, readParams } from "~/feed/http.server";
import { slugParam } from "~/feed/params";
import { jobTypeRecords, resolveSlugs } from "~/feed/queries.server";
import type { Route } from "./+types/api.v1.job-types";

// Every job type, by category.
export async function loader({ request }: Route.LoaderArgs) {
  return answer(async () => {
    const { category } = readParams(new URL(request.url), { category: slugParam });
    const { categoryId } = await resolveSlugs(readDb, { category });
    return jsonResponse(request, { data: await jobTypeRecords(readDb, categoryId) }, CACHE.record);
  });
}
