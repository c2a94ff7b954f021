import { readDb } from "~/db.server";
import { answer, CACHE, jsonResponse, readParams } from "~/feed/http.server";
import { slugParam } from "~/feed/params";
import { modelRecords, resolveSlugs } from "~/feed/queries.server";
import type { Route } from "./+types/api.v1.models";

// Every tool model with its specs (SI units) and count of accepted reports.
export async function loader({ request }: Route.LoaderArgs) {
  return answer(async () => {
    const { category } = readParams(new URL(request.url), { category: slugParam });
    const { categoryId } = await resolveSlugs(readDb, { category });
    return jsonResponse(request, { data: await modelRecords(readDb, categoryId) }, CACHE.record);
  });
}
