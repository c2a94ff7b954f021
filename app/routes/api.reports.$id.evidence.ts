import { z } from "zod";
import { requireApiUser } from "~/auth/session.server";
import { db } from "~/db.server";
import { createUpload } from "~/reports/evidence.server";
import { failureAnswer } from "~/utils/errors";
import { readJson } from "~/utils/forms";
import { postOnly } from "~/utils/http";
import { isId } from "~/utils/params";
import { plainText } from "~/utils/text";
import type { Route } from "./+types/api.reports.$id.evidence";

const body = z.object({ type: plainText().max(100), size: z.number().int().positive().max(Number.MAX_SAFE_INTEGER) });

// POST: a presigned PUT for one evidence file on the signed-in user's own draft.
export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireApiUser(request);
  if (!isId(params.id)) return Response.json({ error: "No such report" }, { status: 404 });
  const parsed = body.safeParse(await readJson(request));
  if (!parsed.success) return Response.json({ error: "Send the file's type and size in bytes" }, { status: 400 });
  try {
    return Response.json(await createUpload(db, user.id, Number(params.id), parsed.data));
  } catch (error) {
    return failureAnswer(error, "api");
  }
}

export const loader = postOnly("POST the file's type and size to get an upload URL");
