import { data } from "react-router";

// Node refuses a status line with characters past Latin-1 or control characters: a message that is not plain
// printable ASCII goes in the body only.
const statusLine = (message: string) => (/^[\x20-\x7e]*$/.test(message) ? { statusText: message } : {});

/** Throws an HTTP error response (rendered by the error boundary) unless the condition holds: a missing record is
 * the default 404, a forbidden one a 403. */
export function invariantResponse(condition: unknown, message: string, status = 404): asserts condition {
  if (!condition) throw data(message, { status, ...statusLine(message) });
}

/** Unconditionally refuses the request with `status` (a bad form or parameter is 400). */
export function refuse(message: string, status = 400): never {
  throw data(message, { status, ...statusLine(message) });
}

/**
 * The loader of a resource route that only takes POST: a GET is a 405 that says what to send.
 * `export const loader = postOnly("POST … here");`
 */
export const postOnly = (hint: string) => () =>
  Response.json({ error: hint }, { status: 405, headers: { Allow: "POST" } });

/** True when If-None-Match names `etag` (weak comparison, as RFC 9110 §13.1.2 asks for GET). */
export function matchesIfNoneMatch(header: string | null, etag: string) {
  if (!header) return false;
  if (header.trim() === "*") return true;
  return header
    .split(",")
    .map((t) => t.trim().replace(/^W\//, ""))
    .includes(etag);
}
