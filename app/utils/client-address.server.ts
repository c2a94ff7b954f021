// Who is asking, for rate limits (sign-in links, the open feed).
import { sha256Hex } from "./tokens.server";
import { config } from "~/config.server";

/**
 * The header in which server.js passes the client's socket address to the app. server.js
 * overwrites whatever a client sent under this name, so the app can trust it.
 */
export const CLIENT_ADDRESS_HEADER = "x-bayproof-client-address";

/**
 * The client's key: behind a trusted load balancer the first X-Forwarded-For hop; otherwise the
 * socket address server.js passes on. Only the Vite dev server lacks both, and there clients are
 * told apart by their user agent.
 */
export function clientKey(request: Request): string {
  if (config.trustProxy) {
    const hop = request.headers.get("x-forwarded-for")?.split(",")[0]?.trim();
    if (hop) return `ip:${hop.slice(0, 60)}`;
  }
  const address = request.headers.get(CLIENT_ADDRESS_HEADER);
  if (address) return `ip:${address.slice(0, 60)}`;
  return `ua:${sha256Hex(request.headers.get("user-agent") ?? "").slice(0, 32)}`;
}
