import { config } from "~/config.server";
import { openApi } from "~/feed/documents";
import { answer, CACHE, jsonResponse, readParams } from "~/feed/http.server";
import type { Route } from "./+types/api.v1.openapi";

// The feed's OpenAPI 3.1 document.
export async function loader({ request }: Route.LoaderArgs) {
  return answer(async () => {
    readParams(new URL(request.url), {});
    return jsonResponse(request, openApi(config.appOrigin, config.feed.keyLimit), CACHE.document);
  });
}
