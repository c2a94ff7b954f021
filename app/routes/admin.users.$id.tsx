import { data, Form, Link, useNavigation } from "react-router";
import { z } from "zod";
import { BAN_REASON_MAX, BAN_REASON_MIN, changeBan, userForAdmin } from "~/auth/bans.server";
import { requireRole } from "~/auth/session.server";
import { formatDate } from "~/domain";
import { ErrorPage } from "~/components/error-page";
import { buttonClass, Card, cardClass } from "~/components/ui";
import { db } from "~/db.server";
import { failureAnswer } from "~/utils/errors";
import { parseForm } from "~/utils/forms";
import { invariantResponse } from "~/utils/http";
import type { Route } from "./+types/admin.users.$id";

const idSchema = z.coerce.number().int().positive().max(2_147_483_647);

export async function loader({ request, params }: Route.LoaderArgs) {
  const admin = await requireRole(request, "admin");
  const id = idSchema.safeParse(params.id);
  invariantResponse(id.success, "No such user", 404);
  const found = await userForAdmin(db, id.data);
  invariantResponse(found, "No such user", 404);
  return { ...found, self: found.user.id === admin.id };
}

const banSchema = z.object({
  intent: z.enum(["ban", "unban"], { error: "Choose ban or unban" }),
  reason: z
    .string()
    .trim()
    .min(BAN_REASON_MIN, `Say why, in at least ${BAN_REASON_MIN} characters`)
    .max(BAN_REASON_MAX, `Keep the reason under ${BAN_REASON_MAX} characters`),
});

export async function action({ request, params }: Route.ActionArgs) {
  const admin = await requireRole(request, "admin");
  const id = idSchema.safeParse(params.id);
  invariantResponse(id.success, "No such user", 404);
  const form = parseForm(banSchema, await request.formData());
  if (!form.ok) {
    const message = form.errors.reason?.[0] ?? form.errors.intent?.[0] ?? "That change is not valid";
    return data({ ok: false as const, message, reason: String(form.values.reason ?? "") }, { status: 400 });
  }
  try {
    const changed = await changeBan(db, admin.id, id.data, form.data.intent, form.data.reason);
    const done =
      form.data.intent === "ban"
        ? "Banned: every session ended and every API key revoked."
        : "Unbanned: they may sign in again.";
    return { ok: true as const, message: changed ? `${done} Logged.` : "Nothing to change.", reason: "" };
  } catch (error) {
    return failureAnswer(error, "form", { reason: form.data.reason });
  }
}

export default function AdminUser({ loaderData, actionData }: Route.ComponentProps) {
  const { user, bans, sessions, activeKeys, self } = loaderData;
  const busy = useNavigation().state !== "idle";
  const banned = user.banned_at !== null;
  return (
    <div className="space-y-6">
      <p className="text-sm">
        <Link to="/admin/users" className="text-bay-700 underline">
          ← Users and roles
        </Link>
      </p>
      <header>
        <h1 className="text-2xl font-bold">{user.handle}</h1>
        <p className="text-sm text-stone-600">
          {user.email} · joined {formatDate(user.created_at)} ·{" "}
          {banned ? `banned since ${formatDate(user.banned_at)}` : "in good standing"} · {sessions} session
          {sessions === 1 ? "" : "s"} · {activeKeys} active API key{activeKeys === 1 ? "" : "s"}
        </p>
      </header>
      {actionData && (
        <p
          role={actionData.ok ? "status" : "alert"}
          className={`rounded px-3 py-2 ${actionData.ok ? "bg-bay-100" : "bg-red-100 text-red-900"}`}
        >
          {actionData.message}
        </p>
      )}
      {self ? (
        <p className="text-stone-600">This is your own account; another admin would have to ban it.</p>
      ) : (
        <Form method="post" className={cardClass("md", "space-y-3")}>
          <h2 className="font-semibold">{banned ? "Lift the ban" : "Ban this account"}</h2>
          <p className="text-sm text-stone-600">
            {banned
              ? "They may sign in again; their old sessions and keys stay ended."
              : "Every session ends now and every API key is revoked. Their reports stay."}
          </p>
          <label className="block">
            <span className="font-semibold">Reason (kept in the log)</span>
            <textarea
              name="reason"
              required
              minLength={3}
              maxLength={500}
              rows={3}
              defaultValue={actionData?.ok ? "" : actionData?.reason}
              className="mt-1 block w-full rounded border border-stone-300 px-3 py-2"
            />
          </label>
          <button
            type="submit"
            name="intent"
            value={banned ? "unban" : "ban"}
            disabled={busy}
            className={buttonClass(banned ? "primary" : "danger")}
          >
            {banned ? "Unban" : "Ban"}
          </button>
        </Form>
      )}
      <section aria-labelledby="bans-heading">
        <h2 id="bans-heading" className="mb-2 text-lg font-semibold">
          Bans and unbans
        </h2>
        {bans.length === 0 ? (
          <p className="text-stone-600">None.</p>
        ) : (
          <Card as="ul" padding="none" className="text-sm">
            {bans.map((b) => (
              <li key={b.id} className="border-b border-stone-100 px-3 py-2 last:border-0">
                {formatDate(b.created_at)}: {b.actor_handle ?? "someone"} {b.change === "ban" ? "banned" : "unbanned"} —{" "}
                {b.reason}
              </li>
            ))}
          </Card>
        )}
      </section>
    </div>
  );
}

export function meta({ data }: Route.MetaArgs) {
  return [{ title: data ? `${data.user.handle} — Users — Bayproof` : "User — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
