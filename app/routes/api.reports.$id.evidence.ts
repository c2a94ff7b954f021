import { z } from "zod";
import { requireApiUser } from "~/auth/session.server";
import { db } from "~/db.server";
import { createUpload, EvidenceError } from "~/reports/evidence.server";
import type { Route } from "./+types/api.reports.$id.evidence";

const body = z.object({ type: z.string().max(100), size: z.number().int().positive().max(Number.MAX_SAFE_INTEGER) });

// POST: a presigned PUT for one evidence file on the signed-in user's own draft.
export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireApiUser(request);
  const reportId = z.coerce.number().int().positive().safeParse(params.id);
  if (!reportId.success) return Response.json({ error: "No such report" }, { status: 404 });
  const parsed = body.safeParse(await request.json().catch(() => null));
  if (!parsed.success) return Response.json({ error: "Send the file's type and size in bytes" }, { status: 400 });
  try {
    return Response.json(await createUpload(db, user.id, reportId.data, parsed.data));
  } catch (error) {
    if (error instanceof EvidenceError) return Response.json({ error: error.message }, { status: error.status });
    throw error;
  }
}

export async function loader() {
  return Response.json({ error: "POST the file's type and size to get an upload URL" }, { status: 405, headers: { Allow: "POST" } });
}
