import { requireApiUser } from "~/auth/session.server";
import { db } from "~/db.server";
import { completeUpload } from "~/reports/evidence.server";
import { failureAnswer } from "~/utils/errors";
import { postOnly } from "~/utils/http";
import { isId } from "~/utils/params";
import type { Route } from "./+types/api.evidence.$id.complete";

// POST after the browser's upload: check the bytes, hash, record. A refused file is deleted.
// Storage out of reach answers 503 with a message for the uploader; the upload stays pending.
export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireApiUser(request);
  if (!isId(params.id)) return Response.json({ error: "No such upload" }, { status: 404 });
  try {
    return Response.json(await completeUpload(db, user.id, Number(params.id)));
  } catch (error) {
    const answer = failureAnswer(error, "api");
    if (answer.status === 503) answer.headers.set("Retry-After", "60");
    return answer;
  }
}

export const loader = postOnly("POST here once the upload has finished");
