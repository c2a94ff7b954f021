import { data } from "react-router";

// Node refuses a status line with characters outside Latin-1; such a message goes in the body only.
const statusLine = (message: string) => (/^[\x20-\x7e]*$/.test(message) ? { statusText: message } : {});

/** Throws an HTTP error response (rendered by the error boundary) unless the condition holds. */
export function invariantResponse(condition: unknown, message: string, status = 404): asserts condition {
  if (!condition) throw data(message, { status, ...statusLine(message) });
}

/** A missing record (or one the asker may not know exists): 404 unless found. */
export function invariantFound<T>(found: T | null | undefined, message: string): asserts found is T {
  invariantResponse(found != null, message, 404);
}

/** A forbidden record: 403 unless allowed. */
export function invariantAllowed(allowed: unknown, message: string): asserts allowed {
  invariantResponse(allowed, message, 403);
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
