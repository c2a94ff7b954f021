import { Form, Link } from "react-router";
import { formatDate } from "~/domain";
import type { listApiKeys } from "~/auth/api-keys.server";
import { buttonClass, cardClass } from "~/components/ui";
import { Field, inputClass } from "~/components/field";
import { ANONYMOUS_LIMIT } from "~/feed/params";
import type { FieldErrors } from "~/utils/forms";

/** The user's feed keys: a new key shown once, a form to create one, and each key with its revoke button. */
export function ApiKeysSection({
  keys,
  newKey,
  errors,
  values,
  busy,
  keyLimit,
}: {
  keys: Awaited<ReturnType<typeof listApiKeys>>;
  newKey: { name: string; key: string } | undefined;
  errors: FieldErrors;
  values: Record<string, unknown>;
  busy: boolean;
  /** Requests a minute per API key, as the server is configured. */
  keyLimit: number;
}) {
  const text = (v: unknown) => (typeof v === "string" ? v : "");
  return (
    <section className={cardClass()} aria-labelledby="keys-heading">
      <h2 id="keys-heading" className="mb-2 text-lg font-semibold">
        API keys for the open data feed
      </h2>
      <p className="mb-3 text-sm text-stone-600">
        A key raises your feed limit from {ANONYMOUS_LIMIT.points} to {keyLimit} requests a minute and opens the bulk
        files; send it as <code>Authorization: Bearer &lt;key&gt;</code>. It is shown once; keep it secret.{" "}
        <Link className="underline" to="/data">
          How to use the feed
        </Link>
      </p>
      {newKey && (
        <div className="mb-3 rounded border border-signal-500 bg-signal-100 p-3">
          <p className="text-sm font-semibold">
            Your new key “{newKey.name}” — copy it now, it will not be shown again:
          </p>
          <code className="mt-1 block break-all rounded bg-white px-2 py-1 text-sm" data-testid="new-api-key">
            {newKey.key}
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
                <span className="font-semibold">{k.name}</span> <code className="text-stone-600">{k.key_prefix}…</code>{" "}
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
  );
}
