import { redirect } from "react-router";
import { getProvider, startSignIn } from "~/auth/oidc.server";
import { carriedRedirect } from "~/auth/landing.server";
import type { Route } from "./+types/auth.$provider";
import { refuse } from "~/utils/http";

// Starts the provider's sign-in; a GET so it can be a plain link (no form-action to a third party).
export async function loader({ params, request }: Route.LoaderArgs) {
  const provider = getProvider(params.provider);
  if (!provider) refuse(`Unknown sign-in provider "${params.provider.slice(0, 40)}".`);
  const redirectTo = carriedRedirect(new URL(request.url).searchParams.get("redirectTo"));
  const { url, cookie } = await startSignIn(provider, redirectTo);
  return redirect(url, { headers: { "Set-Cookie": cookie } });
}
