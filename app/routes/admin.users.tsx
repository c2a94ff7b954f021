import { Form, Link } from "react-router";
import { changeRole, recentRoleChanges, searchUsers } from "~/auth/roles.server";
import { roleSchema, userSearchSchema } from "~/auth/forms";
import { requireRole } from "~/auth/session.server";
import { formatDate } from "~/domain";
import { ErrorPage } from "~/components/error-page";
import { buttonClass, Card, DataTable } from "~/components/ui";
import { db } from "~/db.server";
import { failureAnswer } from "~/utils/errors";
import { parseForm, readForm } from "~/utils/forms";
import { refuse } from "~/utils/http";
import type { Route } from "./+types/admin.users";

export async function loader({ request }: Route.LoaderArgs) {
  const admin = await requireRole(request, "admin");
  const parsed = userSearchSchema.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!parsed.success) refuse(parsed.error.issues[0]!.message);
  const [users, changes] = await Promise.all([searchUsers(db, parsed.data.q), recentRoleChanges(db)]);
  return { q: parsed.data.q, users, changes, adminId: admin.id };
}

export async function action({ request }: Route.ActionArgs) {
  const admin = await requireRole(request, "admin");
  const form = parseForm(roleSchema, await readForm(request));
  if (!form.ok) refuse("That role change is not valid");
  try {
    const changed = await changeRole(db, admin.id, form.data.userId, form.data.role, form.data.intent);
    return { ok: true as const, message: changed ? "Role updated and logged." : "Nothing to change." };
  } catch (error) {
    return failureAnswer(error, "form");
  }
}

export default function AdminUsers({ loaderData, actionData }: Route.ComponentProps) {
  const { q, users, changes, adminId } = loaderData;
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-bold">Users and roles</h1>
      {actionData && (
        <p
          role={actionData.ok ? "status" : "alert"}
          className={`rounded px-3 py-2 ${actionData.ok ? "bg-bay-100" : "bg-red-100 text-red-900"}`}
        >
          {actionData.message}
        </p>
      )}
      <Form method="get" className="flex gap-2">
        <label className="sr-only" htmlFor="q">
          Search by handle or e-mail
        </label>
        <input
          id="q"
          name="q"
          defaultValue={q}
          placeholder="Handle or e-mail"
          className="flex-1 rounded border border-stone-300 px-3 py-3"
        />
        <button type="submit" className={buttonClass()}>
          Search
        </button>
      </Form>
      <DataTable
        label="Users"
        minWidth="40rem"
        head={
          <tr>
            <th className="px-3 py-2">Handle</th>
            <th className="px-3 py-2">E-mail</th>
            <th className="px-3 py-2">Shop</th>
            <th className="px-3 py-2">Roles</th>
          </tr>
        }
      >
        {users.map((u) => (
          <tr key={u.id}>
            <td className="px-3 py-2 font-semibold">
              <Link to={`/admin/users/${u.id}`} className="text-bay-700 underline">
                {u.handle}
              </Link>
              {u.banned_at && <span className="ml-2 rounded bg-red-100 px-1 text-xs text-red-900">banned</span>}
            </td>
            <td className="px-3 py-2">{u.email}</td>
            <td className="px-3 py-2">{u.shop_name ?? "—"}</td>
            <td className="px-3 py-2">
              <div className="flex flex-wrap gap-2">
                {(["moderator", "admin"] as const).map((role) => {
                  const has = u.roles.includes(role);
                  const self = role === "admin" && has && u.id === adminId;
                  return (
                    <Form method="post" key={role}>
                      <input type="hidden" name="userId" value={u.id} />
                      <input type="hidden" name="role" value={role} />
                      <button
                        type="submit"
                        name="intent"
                        value={has ? "revoke" : "grant"}
                        disabled={self}
                        title={self ? "You cannot remove your own admin role" : undefined}
                        className={`rounded border px-2 py-1 ${has ? "border-bay-700 bg-bay-100" : "border-stone-300"} disabled:opacity-50`}
                      >
                        {has ? `✓ ${role} — remove` : `make ${role}`}
                      </button>
                    </Form>
                  );
                })}
              </div>
            </td>
          </tr>
        ))}
      </DataTable>
      <section aria-labelledby="log-heading">
        <h2 id="log-heading" className="mb-2 text-lg font-semibold">
          Recent role changes
        </h2>
        {changes.length === 0 ? (
          <p className="text-stone-600">None yet.</p>
        ) : (
          <Card as="ul" padding="none" className="text-sm">
            {changes.map((c) => (
              <li key={c.id} className="border-b border-stone-100 px-3 py-2 last:border-0">
                {formatDate(c.created_at)}: {c.actor_handle ?? "someone"} {c.change === "grant" ? "made" : "removed"}{" "}
                {c.user_handle} {c.change === "grant" ? "a" : "as"} {c.role}
              </li>
            ))}
          </Card>
        )}
      </section>
    </div>
  );
}

export function meta() {
  return [{ title: "Users and roles — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
