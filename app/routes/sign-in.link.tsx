import { Form, redirect } from "react-router";
import { z } from "zod";
import { consumeSignInLink } from "~/auth/email-link.server";
import { db } from "~/db.server";
import { carriedRedirect, landingPath } from "~/auth/landing.server";
import { createSession } from "~/auth/session.server";
import { ErrorPage } from "~/components/error-page";
import { buttonClass, Card } from "~/components/ui";
import { readForm } from "~/utils/forms";
import type { Route } from "./+types/sign-in.link";
import { refuse } from "~/utils/http";

const tokenSchema = z.string().regex(/^[A-Za-z0-9_-]{43}$/);

// Opening the link only shows a button: mail scanners that fetch links must not spend it.
export async function loader({ request }: Route.LoaderArgs) {
  const url = new URL(request.url);
  const token = tokenSchema.safeParse(url.searchParams.get("token"));
  if (!token.success) refuse("This sign-in link is incomplete. Copy the whole link from the message.");
  return { token: token.data, redirectTo: carriedRedirect(url.searchParams.get("redirectTo")) };
}

const REASONS = {
  unknown: "This sign-in link is not valid. Ask for a new one.",
  used: "This sign-in link has already been used. Each link works once; ask for a new one.",
  expired: "This sign-in link has expired (links last 10 minutes). Ask for a new one.",
  banned: "This account is suspended.",
} as const;

export async function action({ request }: Route.ActionArgs) {
  const form = await readForm(request);
  const token = tokenSchema.safeParse(form.get("token"));
  if (!token.success) refuse(REASONS.unknown);
  const result = await consumeSignInLink(db, token.data);
  if (!result.ok) refuse(REASONS[result.reason], result.reason === "banned" ? 403 : 400);
  const cookie = await createSession(db, result.userId, "email_link", request);
  return redirect(await landingPath(db, result.userId, form.get("redirectTo")), { headers: { "Set-Cookie": cookie } });
}

export default function SignInLink({ loaderData }: Route.ComponentProps) {
  return (
    <Card as="section" padding="lg" className="mx-auto max-w-md">
      <h1 className="text-2xl font-bold">Finish signing in</h1>
      <p className="mt-2 text-stone-700">Press the button to sign in on this device.</p>
      <Form method="post" className="mt-4">
        <input type="hidden" name="token" value={loaderData.token} />
        <input type="hidden" name="redirectTo" value={loaderData.redirectTo} />
        <button type="submit" className={buttonClass("primary", "md", "w-full")}>
          Sign in
        </button>
      </Form>
    </Card>
  );
}

export function meta() {
  return [{ title: "Finish signing in — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
