import { redirect } from "react-router";
import { finishSignIn, getProvider } from "~/auth/oidc.server";
import { db } from "~/db.server";
import { landingPath } from "~/auth/landing.server";
import { createSession } from "~/auth/session.server";
import { ErrorPage } from "~/components/error-page";
import { failureAnswer } from "~/utils/errors";
import { refuse } from "~/utils/http";
import type { Route } from "./+types/auth.$provider.callback";

export async function loader({ params, request }: Route.LoaderArgs) {
  const provider = getProvider(params.provider);
  if (!provider) refuse(`Unknown sign-in provider "${params.provider.slice(0, 40)}".`);
  try {
    const { userId, redirectTo, clearCookie } = await finishSignIn(db, provider, request);
    const headers = new Headers();
    headers.append("Set-Cookie", clearCookie);
    headers.append("Set-Cookie", await createSession(db, userId, "oidc", request));
    return redirect(await landingPath(db, userId, redirectTo), { headers });
  } catch (error) {
    throw failureAnswer(error, "page");
  }
}

export default function Callback() {
  return null;
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
