// The one rule for where a visitor may be sent after signing in: a path on our own site, never
// another origin. Pure, so the unit tests can throw every trick at it.
const PROBE_ORIGIN = "http://app.invalid";
const MAX_LENGTH = 2000;
// C0 controls, DEL and the backslash: the WHATWG URL parser strips tabs and newlines and reads
// "\" as "/" in http(s) URLs, so "/\t/evil" and "/\evil" both become "//evil" — another host.
// eslint-disable-next-line no-control-regex -- the control characters are exactly what this refuses
const REFUSED_CHARACTERS = /[\u0000-\u001f\u007f\\]/;

function looksSafe(path: string): boolean {
  return path.startsWith("/") && !path.startsWith("//") && !REFUSED_CHARACTERS.test(path);
}

/** True when `value` is a same-origin path that stays same-origin however a browser reads it. */
export function isSafeRedirectPath(value: unknown): value is string {
  if (typeof value !== "string" || value.length === 0 || value.length > MAX_LENGTH) return false;
  if (!looksSafe(value)) return false;
  // Checked once more after decoding: a later hop that decodes ("/%2F%2Fevil") must not find a host.
  let decoded: string;
  try {
    decoded = decodeURIComponent(value);
  } catch {
    return false;
  }
  if (!looksSafe(decoded)) return false;
  // And the browser's own reading: resolved against any origin, it must keep that origin.
  try {
    return new URL(value, PROBE_ORIGIN).origin === PROBE_ORIGIN;
  } catch {
    return false;
  }
}

/** `value` when it is a safe same-site path, otherwise `fallback`. */
export function safeRedirectPath(value: unknown, fallback = "/account"): string {
  return isSafeRedirectPath(value) ? value : fallback;
}
