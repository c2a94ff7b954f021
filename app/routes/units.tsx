import { redirect } from "react-router";
import { unitsSchema } from "~/auth/forms";
import { getUser, safeRedirectPath } from "~/auth/session.server";
import { rememberVisitorUnits, saveUserUnits } from "~/auth/units.server";
import { db } from "~/db.server";
import { parseForm, readForm } from "~/utils/forms";
import { postOnly, refuse } from "~/utils/http";
import type { Route } from "./+types/units";

export const loader = postOnly(
  "POST system=us|metric (and back=/a/path) here to choose the units figures are shown in",
);

/** The footer's switch: remembered on the account when signed in, in a cookie otherwise; back to the same page. */
export async function action({ request }: Route.ActionArgs) {
  const form = parseForm(unitsSchema, await readForm(request));
  if (!form.ok) refuse(Object.values(form.errors).flat()[0] ?? "Choose a unit system");
  const { system, back } = form.data;
  const to = safeRedirectPath(back, "/");
  const user = await getUser(request);
  if (user) {
    await saveUserUnits(db, user.id, system, user.pressureUnit);
    return redirect(to, 303);
  }
  return redirect(to, { status: 303, headers: { "Set-Cookie": await rememberVisitorUnits(system) } });
}
