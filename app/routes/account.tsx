import { Form, Link, useNavigation } from "react-router";
import { endOtherSessions, endSession, listSessions } from "~/auth/account.server";
import { countActiveKeys, createApiKey, listApiKeys, MAX_KEYS_PER_USER, revokeApiKey } from "~/auth/api-keys.server";
import { accountSchema } from "~/auth/forms";
import { saveProfile } from "~/auth/profile.server";
import { requireUser } from "~/auth/session.server";
import { formatDate } from "~/domain";
import { SessionsSection } from "~/components/account/sessions-section";
import { buttonClass, cardClass } from "~/components/ui";
import { ErrorPage } from "~/components/error-page";
import { Field, inputClass, Select } from "~/components/field";
import { db } from "~/db.server";
import { LIMITS } from "~/feed/params";
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
  const { user, sessions, keys } = loaderData;
  const busy = useNavigation().state !== "idle";
  const errors: FieldErrors = actionData && !actionData.ok ? actionData.errors : {};
  const values: Record<string, unknown> = actionData && !actionData.ok ? actionData.values : {};
  const text = (v: unknown) => (typeof v === "string" ? v : "");
  const typed = (k: string, fallback: string) =>
    values.intent === "profile" && typeof values[k] === "string" ? values[k] : fallback;
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-bold">Your account</h1>
      {actionData?.ok && (
        <p role="status" className="rounded bg-bay-100 px-3 py-2">
          {actionData.message}
        </p>
      )}

      <section className={cardClass()} aria-labelledby="profile-heading">
        <h2 id="profile-heading" className="mb-2 text-lg font-semibold">
          Profile
        </h2>
        <p className="mb-3 text-sm text-stone-600">
          Your handle is the only name shown publicly. Your e-mail ({user.email}) is never shown or shared.
        </p>
        <Form method="post" className="grid gap-3 sm:grid-cols-2">
          <input type="hidden" name="intent" value="profile" />
          <Field id="handle" label="Public handle" error={errors.handle?.[0]} className="sm:col-span-2">
            {(control) => (
              <input name="handle" defaultValue={typed("handle", user.handle)} {...control} className={inputClass} />
            )}
          </Field>
          <Select
            id="units"
            name="units"
            label="Units for every figure"
            options={UNIT_CHOICES}
            defaultValue={typed("units", user.units)}
            className="sm:col-span-2"
          />
          <div className="sm:col-span-2">
            <button type="submit" disabled={busy} className={buttonClass("primary")}>
              Save profile
            </button>
          </div>
        </Form>
      </section>

      <SessionsSection sessions={sessions} />

      <section className={cardClass()} aria-labelledby="keys-heading">
        <h2 id="keys-heading" className="mb-2 text-lg font-semibold">
          API keys for the open data feed
        </h2>
        <p className="mb-3 text-sm text-stone-600">
          A key raises your feed limit from {LIMITS.anonymous.points} to {LIMITS.key.points} requests a minute and opens
          the bulk files; send it as <code>Authorization: Bearer &lt;key&gt;</code>. It is shown once; keep it secret.{" "}
          <Link className="underline" to="/data">
            How to use the feed
          </Link>
        </p>
        {actionData?.ok && "newKey" in actionData && actionData.newKey && (
          <div className="mb-3 rounded border border-signal-500 bg-signal-100 p-3">
            <p className="text-sm font-semibold">
              Your new key “{actionData.newKey.name}” — copy it now, it will not be shown again:
            </p>
            <code className="mt-1 block break-all rounded bg-white px-2 py-1 text-sm" data-testid="new-api-key">
              {actionData.newKey.key}
            </code>
          </div>
        )}
        <Form method="post" className="flex flex-wrap items-end gap-2">
          <input type="hidden" name="intent" value="create-key" />
          <Field
            id="key-name"
            label="Key name"
            labelClassName="text-sm font-semibold"
            error={errors.name?.[0]}
            className="flex-1"
          >
            {(control) => (
              <input
                name="name"
                defaultValue={values.intent === "create-key" ? text(values.name) : ""}
                {...control}
                className={inputClass}
              />
            )}
          </Field>
          <button type="submit" disabled={busy} className={buttonClass("primary")}>
            Create key
          </button>
        </Form>
        {keys.length > 0 && (
          <ul className="mt-3 divide-y divide-stone-100 text-sm">
            {keys.map((k) => (
              <li key={k.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
                <span>
                  <span className="font-semibold">{k.name}</span>{" "}
                  <code className="text-stone-600">{k.key_prefix}…</code>{" "}
                  <span className="text-stone-600">
                    · created {formatDate(k.created_at)} · last used{" "}
                    {k.last_used_at ? formatDate(k.last_used_at) : "never"}
                  </span>
                </span>
                {k.revoked_at ? (
                  <span className="text-stone-500">revoked {formatDate(k.revoked_at)}</span>
                ) : (
                  <Form method="post">
                    <input type="hidden" name="intent" value="revoke-key" />
                    <input type="hidden" name="keyId" value={k.id} />
                    <button type="submit" className="rounded border border-stone-300 px-3 py-2">
                      Revoke
                    </button>
                  </Form>
                )}
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}

/** One system for every figure you read and type; metric readers may keep bar for pressure. */
const UNIT_CHOICES = [
  ["us", "US customary: psi, 3/8 in, ft, SCFM, gal, lbf"],
  ["metric", "Metric: kPa, mm, m, l/s, l, N"],
  ["metric-bar", "Metric with bar: bar, mm, m, l/s, l, N"],
] as const;

export function meta() {
  return [{ title: "Your account — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
