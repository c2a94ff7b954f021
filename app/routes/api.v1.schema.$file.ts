import { config } from "~/config.server";
import { answer, CACHE, feedError, jsonResponse, readParams } from "~/feed/http.server";
import { isSchemaName, jsonSchema, SCHEMA_NAMES } from "~/feed/schemas";
import type { Route } from "./+types/api.v1.schema.$file";

// /api/v1/schema/<name>.json: the JSON Schema (2020-12) of one record or response type.
export async function loader({ request, params }: Route.LoaderArgs) {
  return answer(async () => {
    readParams(new URL(request.url), {});
    const name = params.file.replace(/\.json$/, "");
    if (!params.file.endsWith(".json") || !isSchemaName(name)) {
      throw feedError(
        404,
        "not_found",
        `No schema "${params.file}"; there are ${SCHEMA_NAMES.map((n) => `${n}.json`).join(", ")}.`,
      );
    }
    const response = jsonResponse(request, jsonSchema(name, config.appOrigin), CACHE.document);
    if (response.status === 200) response.headers.set("Content-Type", "application/schema+json; charset=utf-8");
    return response;
  });
}
