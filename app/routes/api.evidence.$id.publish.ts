import { z } from "zod";
import { requireApiUser } from "~/auth/session.server";
import { db } from "~/db.server";
import { setEvidencePublic } from "~/reports/evidence.server";
import { failureAnswer } from "~/utils/errors";
import { readJson } from "~/utils/forms";
import { postOnly } from "~/utils/http";
import { isId } from "~/utils/params";
import type { Route } from "./+types/api.evidence.$id.publish";

const body = z.object({ public: z.boolean() });

// POST { public: true | false }: the reporter publishes one of their files with the open data.
export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireApiUser(request);
  if (!isId(params.id)) return Response.json({ error: "No such file" }, { status: 404 });
  const parsed = body.safeParse(await readJson(request));
  if (!parsed.success)
    return Response.json({ error: 'Send { "public": true } or { "public": false }' }, { status: 400 });
  try {
    return Response.json(await setEvidencePublic(db, user.id, Number(params.id), parsed.data.public));
  } catch (error) {
    return failureAnswer(error, "api");
  }
}

export const loader = postOnly('POST { "public": true } or { "public": false } here');
