import { redirect } from "react-router";
import { readDb } from "~/db.server";
import { answer, feedError, readRecordId } from "~/feed/http.server";
import { presignGet } from "~/storage/s3.server";
import type { Route } from "./+types/api.v1.evidence.$id";

// A published evidence file of an accepted report: a redirect to a ten-minute link to it.
// Files the reporter did not publish answer 404, the same as files that do not exist.
export async function loader({ request, params }: Route.LoaderArgs) {
  return answer(async () => {
    const id = readRecordId(request, params.id, "an evidence file number");
    const file = await readDb
      .selectFrom("evidence as e")
      .innerJoin("reports as r", "r.id", "e.report_id")
      .select("e.object_key")
      .where("e.id", "=", id)
      .where("e.is_public", "=", true)
      .where("e.status", "in", ["uploaded", "verified"])
      .where("r.status", "=", "accepted")
      .executeTakeFirst();
    if (!file) throw feedError(404, "not_found", `No published evidence file has the number ${id}.`, "id");
    return redirect(await presignGet(file.object_key, 600), { headers: { "Cache-Control": "private, max-age=300" } });
  });
}
