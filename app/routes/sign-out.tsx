import { redirect } from "react-router";
import { destroySession } from "~/auth/session.server";
import { db } from "~/db.server";
import { readForm } from "~/utils/forms";
import type { Route } from "./+types/sign-out";

// Signing out changes state, so it is a POST only; a plain visit just goes home.
export async function loader() {
  return redirect("/");
}

export async function action({ request }: Route.ActionArgs) {
  await readForm(request);
  return redirect("/", { headers: { "Set-Cookie": await destroySession(db, request) } });
}
