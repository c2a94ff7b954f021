import { data, Form, Link, redirect, useNavigation } from "react-router";
import { requestSignInLink } from "~/auth/email-link.server";
import { db } from "~/db.server";
import { emailSchema } from "~/auth/forms";
import { providers } from "~/auth/oidc.server";
import { carriedRedirect, landingPath } from "~/auth/landing.server";
import { getUser } from "~/auth/session.server";
import { ErrorPage } from "~/components/error-page";
import { buttonClass, Card } from "~/components/ui";
import { type FieldErrors, invalid, parseForm, readForm } from "~/utils/forms";
import type { Route } from "./+types/sign-in";

export async function loader({ request }: Route.LoaderArgs) {
  const redirectTo = carriedRedirect(new URL(request.url).searchParams.get("redirectTo"));
  const user = await getUser(request);
  if (user) throw redirect(await landingPath(db, user.id, redirectTo));
  return { redirectTo, providers: Object.values(providers).map((p) => ({ id: p.id, name: p.name })) };
}

export async function action({ request }: Route.ActionArgs) {
  const form = parseForm(emailSchema, await readForm(request));
  if (!form.ok) return invalid(form.errors, form.values);
  const redirectTo = carriedRedirect(form.data.redirectTo);
  const result = await requestSignInLink(db, form.data.email, request, redirectTo);
  if (!result.ok && result.reason === "mail_failed") {
    return data(
      {
        ok: false as const,
        errors: {},
        values: form.values,
        formError: "The mail could not be sent just now. Try again in a minute.",
      },
      { status: 503, headers: { "Retry-After": "60" } },
    );
  }
  if (!result.ok) {
    const message =
      result.reason === "too_many_for_address"
        ? "Several links were sent to this address in the last 15 minutes. Use the newest one, or wait a little."
        : "Too many sign-in links from this device in the last 15 minutes. Wait a little and try again.";
    return data({ ok: false as const, errors: {}, values: form.values, formError: message }, { status: 429 });
  }
  return { ok: true as const, sentTo: form.data.email };
}

export default function SignIn({ loaderData, actionData }: Route.ComponentProps) {
  const { redirectTo, providers } = loaderData;
  const sending = useNavigation().state === "submitting";
  if (actionData?.ok) {
    return (
      <Card as="section" padding="lg" className="mx-auto max-w-md">
        <h1 className="text-2xl font-bold">Check your mail</h1>
        <p className="mt-2">
          We sent a sign-in link to <strong>{actionData.sentTo}</strong>. It works once, for 10 minutes.
        </p>
        <p className="mt-4 text-sm text-stone-600">
          Nothing arrived? Check the spam folder, or{" "}
          <Link to="/sign-in" className="underline">
            send another
          </Link>
          .
        </p>
      </Card>
    );
  }
  const errors: FieldErrors = actionData && !actionData.ok ? actionData.errors : {};
  const values: Record<string, unknown> = actionData && !actionData.ok ? actionData.values : {};
  return (
    <Card as="section" padding="lg" className="mx-auto max-w-md space-y-6">
      <h1 className="text-2xl font-bold">Sign in</h1>
      <p className="text-stone-700">
        Signing in lets you file reports from the bay and follow the decisions on them. Browsing needs no account.
      </p>
      {providers.map((p) => (
        <a
          key={p.id}
          href={`/auth/${p.id}?redirectTo=${encodeURIComponent(redirectTo)}`}
          className={buttonClass("primary", "md", "block text-center")}
        >
          Continue with {p.name}
        </a>
      ))}
      <div className="flex items-center gap-3 text-sm text-stone-500">
        <hr className="flex-1" />
        or
        <hr className="flex-1" />
      </div>
      <Form method="post" className="space-y-3" noValidate>
        <input type="hidden" name="redirectTo" value={redirectTo} />
        <label className="block">
          <span className="font-semibold">E-mail address</span>
          <input
            name="email"
            type="email"
            autoComplete="email"
            inputMode="email"
            required
            defaultValue={typeof values.email === "string" ? values.email : ""}
            aria-invalid={errors.email ? true : undefined}
            aria-describedby={errors.email ? "email-error" : undefined}
            className="mt-1 block w-full rounded border border-stone-300 px-3 py-3 text-base"
          />
        </label>
        {errors.email && (
          <p id="email-error" className="text-sm text-red-700">
            {errors.email[0]}
          </p>
        )}
        {actionData && !actionData.ok && actionData.formError && (
          <p role="alert" className="text-sm text-red-700">
            {actionData.formError}
          </p>
        )}
        <button type="submit" disabled={sending} className={buttonClass("secondary", "md", "w-full")}>
          {sending ? "Sending…" : "Mail me a sign-in link"}
        </button>
      </Form>
    </Card>
  );
}

/** The action's Retry-After (mail could not be sent) reaches the document response. */
export function headers({ actionHeaders }: Route.HeadersArgs) {
  return actionHeaders;
}

export function meta() {
  return [{ title: "Sign in — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
