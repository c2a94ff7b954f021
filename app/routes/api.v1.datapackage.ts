import { config } from "~/config.server";
import { dataPackage } from "~/feed/documents";
import { answer, CACHE, jsonResponse, readParams } from "~/feed/http.server";
import type { Route } from "./+types/api.v1.datapackage";

// The Frictionless Data Package descriptor of the bulk files.
export async function loader({ request }: Route.LoaderArgs) {
  return answer(async () => {
    readParams(new URL(request.url), {});
    return jsonResponse(request, dataPackage(config.appOrigin, new Date().toISOString().slice(0, 10)), CACHE.document);
  });
}
