import { createReadableStreamFromReadable } from "@react-router/node";
import { isbot } from "isbot";
import { type RenderToPipeableStreamOptions, renderToPipeableStream } from "react-dom/server";
import { type EntryContext, type RouterContextProvider, ServerRouter } from "react-router";
import { cookieMayHoldSession } from "~/auth/session.server";
import { visitorSystemOf } from "~/auth/units.server";
import { earlyHitFor } from "~/http-cache/early-hit.server";
import { pageCache } from "~/http-cache/serve.server";
import { applySecurityHeaders, newNonce } from "~/security.server";
import { CoalescingStream } from "~/utils/coalescing-stream.server";
import { NonceProvider, nonceContext } from "~/utils/nonce";

export const streamTimeout = 5_000;
// server.js refuses cross-site writes with this before React Router sees them.
export { crossSiteRefusal } from "~/security.server";
export { config } from "~/config.server";
export { storedBodyOf } from "~/http-cache/page-cache.server";

/** Page-cache hits answered before Express (server.js); the same decisions as the root middleware's. */
export const earlyHit = earlyHitFor(pageCache, {
  mayHoldSession: cookieMayHoldSession,
  variant: visitorSystemOf,
  securityHeaders: (headers, scriptSources) =>
    applySecurityHeaders(headers, newNonce(), import.meta.env.DEV, undefined, scriptSources),
});

// React Router's Node entry, plus the CSP nonce for every inline script it writes.
export default function handleRequest(
  request: Request,
  responseStatusCode: number,
  responseHeaders: Headers,
  routerContext: EntryContext,
  loadContext: RouterContextProvider,
) {
  if (request.method.toUpperCase() === "HEAD") {
    return new Response(null, { status: responseStatusCode, headers: responseHeaders });
  }
  const nonce = loadContext.get(nonceContext);

  return new Promise((resolve, reject) => {
    let shellRendered = false;
    const userAgent = request.headers.get("user-agent");
    const readyOption: keyof RenderToPipeableStreamOptions =
      (userAgent && isbot(userAgent)) || routerContext.isSpaMode ? "onAllReady" : "onShellReady";
    let timeoutId: ReturnType<typeof setTimeout> | undefined = setTimeout(() => abort(), streamTimeout + 1000);

    const { pipe, abort } = renderToPipeableStream(
      <NonceProvider value={nonce}>
        <ServerRouter context={routerContext} url={request.url} nonce={nonce} />
      </NonceProvider>,
      {
        nonce,
        [readyOption]() {
          shellRendered = true;
          const body = new CoalescingStream({
            final(callback) {
              clearTimeout(timeoutId);
              timeoutId = undefined;
              callback();
            },
          });
          responseHeaders.set("Content-Type", "text/html; charset=utf-8");
          pipe(body);
          resolve(
            new Response(createReadableStreamFromReadable(body), {
              headers: responseHeaders,
              status: responseStatusCode,
            }),
          );
        },
        onShellError(error: unknown) {
          reject(error instanceof Error ? error : new Error(String(error)));
        },
        onError(error: unknown) {
          responseStatusCode = 500;
          if (shellRendered) console.error(error);
        },
      },
    );
  });
}
