// Input every route would refuse anyway, refused once in the root middleware with a reason, so
// no loader or action meets it: a body that is not a form on a page route, and control
// characters in the query string. (Actions still read their bodies with readForm, which checks
// the same again; the open feed checks its own parameters and answers in its own format.)
import { formContentTypeProblem } from "./forms";
import { hasControlCharacters } from "./text";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

const refusal = (api: boolean, status: number, code: string, message: string) =>
  api
    ? Response.json({ error: { code, message } }, { status, headers: { "Cache-Control": "no-store" } })
    : new Response(message, {
        status,
        headers: { "Content-Type": "text/plain; charset=utf-8", "Cache-Control": "no-store" },
      });

export function refuseUnreadableRequest(request: Request): Response | null {
  const url = new URL(request.url);
  const api = url.pathname.startsWith("/api/");
  if (!url.pathname.startsWith("/api/v1/") && url.pathname !== "/api/v1") {
    for (const [name, value] of url.searchParams) {
      if (hasControlCharacters(name) || hasControlCharacters(value)) {
        return refusal(
          api,
          400,
          "invalid_parameter",
          `The address's "${name.replace(/[^\w-]/g, "?").slice(0, 40)}" holds control characters (such as NUL): type plain text.`,
        );
      }
    }
  }
  if (!api && !SAFE_METHODS.has(request.method.toUpperCase())) {
    const problem = formContentTypeProblem(request);
    if (problem) return refusal(false, 415, "unsupported_media_type", problem);
  }
  return null;
}
