import { requireApiUser } from "~/auth/session.server";
import { db } from "~/db.server";
import { completeUpload, EvidenceError } from "~/reports/evidence.server";
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
    if (error instanceof EvidenceError) {
      return Response.json({ error: error.message }, { status: error.status, headers: error.status === 503 ? { "Retry-After": "60" } : {} });
    }
    throw error;
  }
}

export async function loader() {
  return Response.json({ error: "POST here once the upload has finished" }, { status: 405, headers: { Allow: "POST" } });
}
