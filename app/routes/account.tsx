import { useNavigation } from "react-router";
import { endOtherSessions, endSession, listSessions } from "~/auth/account.server";
import { countActiveKeys, createApiKey, listApiKeys, MAX_KEYS_PER_USER, revokeApiKey } from "~/auth/api-keys.server";
import { accountSchema } from "~/auth/forms";
import { saveProfile } from "~/auth/profile.server";
import { requireUser } from "~/auth/session.server";
import { ApiKeysSection } from "~/components/account/api-keys-section";
import { ProfileSection } from "~/components/account/profile-section";
import { SessionsSection } from "~/components/account/sessions-section";
import { ErrorPage } from "~/components/error-page";
import { config } from "~/config.server";
import { db } from "~/db.server";
import { type FieldErrors, invalid, parseForm, readForm } from "~/utils/forms";
import { invariantResponse } from "~/utils/http";
import type { Route } from "./+types/account";

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const [sessions, keys] = await Promise.all([listSessions(db, user.id), listApiKeys(db, user.id)]);
  return {
    user: {
      handle: user.handle,
      email: user.email,
      units: user.lengthUnit === "in" ? "us" : user.pressureUnit === "bar" ? "metric-bar" : "metric",
      roles: user.roles,
    },
    sessions: sessions.map((s) => ({
      ref: s.id_hash.slice(0, 16),
      current: s.id_hash === user.sessionHash,
      createdAt: s.created_at,
      lastSeenAt: s.last_seen_at,
      userAgent: s.user_agent,
      method: s.sign_in_method,
    })),
    keys,
    keyLimit: config.feed.keyLimit,
  };
}

export async function action({ request }: Route.ActionArgs) {
  const user = await requireUser(request);
  const form = parseForm(accountSchema, await readForm(request));
  if (!form.ok) return invalid(form.errors, form.values);
  const input = form.data;
  switch (input.intent) {
    case "profile": {
      if ((await saveProfile(db, user.id, input)) === "handle-taken")
        return invalid({ handle: ["That handle is taken"] }, form.values);
      return { ok: true as const, message: "Profile saved." };
    }
    case "end-session":
      invariantResponse(await endSession(db, user.id, input.ref), "No such session on your account", 404);
      return { ok: true as const, message: "That session is signed out." };
    case "end-other-sessions":
      await endOtherSessions(db, user.id, user.sessionHash);
      return { ok: true as const, message: "Every other session is signed out." };
    case "create-key": {
      if ((await countActiveKeys(db, user.id)) >= MAX_KEYS_PER_USER) {
        return invalid({ name: [`At most ${MAX_KEYS_PER_USER} active keys; revoke one first`] }, form.values);
      }
      const key = await createApiKey(db, user.id, input.name);
      return { ok: true as const, message: "Key created.", newKey: { name: input.name, key } };
    }
    case "revoke-key":
      invariantResponse(await revokeApiKey(db, user.id, input.keyId), "No such active key on your account", 404);
      return { ok: true as const, message: "Key revoked." };
  }
}

export default function Account({ loaderData, actionData }: Route.ComponentProps) {
  const { user, sessions, keys, keyLimit } = loaderData;
  const busy = useNavigation().state !== "idle";
  const errors: FieldErrors = actionData && !actionData.ok ? actionData.errors : {};
  const values: Record<string, unknown> = actionData && !actionData.ok ? actionData.values : {};
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-bold">Your account</h1>
      {actionData?.ok && (
        <p role="status" className="rounded bg-bay-100 px-3 py-2">
          {actionData.message}
        </p>
      )}

      <ProfileSection user={user} errors={errors} values={values} busy={busy} />

      <SessionsSection sessions={sessions} />

      <ApiKeysSection
        keys={keys}
        newKey={actionData?.ok && "newKey" in actionData ? actionData.newKey : undefined}
        errors={errors}
        values={values}
        busy={busy}
        keyLimit={keyLimit}
      />
    </div>
  );
}

export function meta() {
  return [{ title: "Your account — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
