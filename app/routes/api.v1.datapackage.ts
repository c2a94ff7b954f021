import { config } from "~/config.server";
import { readDb } from "~/db.server";
import { dataPackage } from "~/feed/documents";
import { answer, CACHE, jsonResponse, readParams } from "~/feed/http.server";
import { latestSnapshot } from "~/feed/snapshot.server";
import type { Route } from "./+types/api.v1.datapackage";

// The Frictionless Data Package descriptor of the bulk files, the latest daily snapshot first.
export async function loader({ request }: Route.LoaderArgs) {
  return answer(async () => {
    readParams(new URL(request.url), {});
    const snapshot = await latestSnapshot(readDb);
    return jsonResponse(
      request,
      dataPackage(config.appOrigin, new Date().toISOString().slice(0, 10), snapshot),
      CACHE.live,
    );
  });
}
