import { z } from "zod";
import { requireApiUser } from "~/auth/session.server";
import { db } from "~/db.server";
import { EvidenceError, setEvidencePublic } from "~/reports/evidence.server";
import { readJson } from "~/utils/forms";
import { isId } from "~/utils/params";
import type { Route } from "./+types/api.evidence.$id.publish";

const body = z.object({ public: z.boolean() });

// POST { public: true | false }: the reporter publishes one of their files with the open data.
export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireApiUser(request);
  if (!isId(params.id)) return Response.json({ error: "No such file" }, { status: 404 });
  const parsed = body.safeParse(await readJson(request));
  if (!parsed.success) return Response.json({ error: "Send { \"public\": true } or { \"public\": false }" }, { status: 400 });
  try {
    return Response.json(await setEvidencePublic(db, user.id, Number(params.id), parsed.data.public));
  } catch (error) {
    if (error instanceof EvidenceError) return Response.json({ error: error.message }, { status: error.status });
    throw error;
  }
}

export async function loader() {
  return Response.json({ error: "POST { \"public\": true } or { \"public\": false } here" }, { status: 405, headers: { Allow: "POST" } });
}
