import { z } from "zod";
import { requireApiUser } from "~/auth/session.server";
import { createCertificateUpload } from "~/bench/certificate-uploads.server";
import { db } from "~/db.server";
import { failureAnswer } from "~/utils/errors";
import { readJson } from "~/utils/forms";
import { postOnly } from "~/utils/http";
import type { Route } from "./+types/api.bench.certificates";

const body = z.object({
  rigId: z.number().int().positive().max(2_147_483_647),
  type: z.string().max(100),
  size: z.number().int().positive().max(Number.MAX_SAFE_INTEGER),
});

// POST: a presigned PUT for one calibration certificate, for the owner of the rig it belongs to.
export async function action({ request }: Route.ActionArgs) {
  const user = await requireApiUser(request);
  const parsed = body.safeParse(await readJson(request));
  if (!parsed.success)
    return Response.json({ error: "Send the rig's id, the file's type and its size in bytes" }, { status: 400 });
  try {
    const { rigId, type, size } = parsed.data;
    return Response.json(await createCertificateUpload(db, user.id, rigId, { type, size }));
  } catch (error) {
    return failureAnswer(error, "api");
  }
}

export const loader = postOnly("POST the rig's id and the certificate's type and size to get an upload URL");
