import { z } from "zod";
import { requireApiUser } from "~/auth/session.server";
import { createTraceUpload } from "~/bench/trace-uploads.server";
import { db } from "~/db.server";
import { failureAnswer } from "~/utils/errors";
import { readJson } from "~/utils/forms";
import { postOnly } from "~/utils/http";
import type { Route } from "./+types/api.bench.traces";

const body = z.object({
  rigId: z.number().int().positive().max(2_147_483_647),
  size: z.number().int().positive().max(Number.MAX_SAFE_INTEGER),
});

// POST: a presigned PUT for one trace CSV, for the owner of the rig it was recorded on.
export async function action({ request }: Route.ActionArgs) {
  const user = await requireApiUser(request);
  const parsed = body.safeParse(await readJson(request));
  if (!parsed.success)
    return Response.json({ error: "Send the rig's id and the file's size in bytes" }, { status: 400 });
  try {
    return Response.json(await createTraceUpload(db, user.id, parsed.data.rigId, parsed.data.size));
  } catch (error) {
    return failureAnswer(error, "api");
  }
}

export const loader = postOnly("POST the rig's id and the trace file's size to get an upload URL");
