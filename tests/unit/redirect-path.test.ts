// Where sign-in may send a visitor afterwards. The hostile inputs are the usual open-redirect
// tricks; how a browser reads each one is the WHATWG URL Standard's basic URL parser (published,
// https://url.spec.whatwg.org/#concept-basic-url-parser), which node's URL implements.
import { describe, expect, it } from "vitest";
import { isSafeRedirectPath, safeRedirectPath } from "../../app/auth/redirect-path";

const BASE = "http://app.invalid";
const readByBrowser = (value: string) => new URL(value, BASE);

describe("safeRedirectPath", () => {
  it.each([
    "/account",
    "/models/ht-401?job=ball-joint-separation",
    "/review/12#decision",
    "/search?q=seized%20axle%20nut",
    "/me/reports?page=2&status=returned",
  ])("keeps the same-site path %s", (path) => {
    expect(safeRedirectPath(path)).toBe(path);
  });

  // Each of these a browser resolves against our origin to another host (WHATWG URL Standard,
  // published: tabs and newlines are removed before parsing, "\" counts as "/" in special URLs).
  const leavesOrigin = [
    "//evil.example/",
    "/\t/evil.example/",
    "/\n/evil.example/",
    "/\r\n/evil.example/",
    "\t//evil.example/",
    "/\\evil.example/",
    "\\\\evil.example/",
    "/\\/evil.example/",
    "https://evil.example/",
    "javascript:alert(1)",
    "JaVaScRiPt:alert(1)",
    "data:text/html,<script>alert(1)</script>",
  ];
  it.each(leavesOrigin)("refuses %j, which a browser reads as another origin", (value) => {
    expect(readByBrowser(value).origin).not.toBe(BASE); // the parser itself, recomputed here
    expect(safeRedirectPath(value)).toBe("/account");
  });

  // Harmless to the parser today, refused all the same: control characters, encoded slashes and
  // backslashes that a later hop might decode into one of the tricks above.
  it.each([
    "/%09/evil.example/",
    "/%0a/evil.example/",
    "/%2F/evil.example/",
    "/%2f%2fevil.example/",
    "/%5Cevil.example/",
    "/%5c%5cevil.example/",
    "/\u0000/evil.example/",
    "/\u007f",
    "/\u000b/evil.example/",
    "/%E0%A4%A", // malformed percent-encoding
    " /account",
    "",
    "account",
    "./account",
    "?redirect=1",
    "http:evil.example", // same scheme as the base: a relative path to the parser, a trap to a reader
  ])("refuses %j", (value) => {
    expect(isSafeRedirectPath(value)).toBe(false);
  });

  it("refuses what is not a string and uses the fallback it is given", () => {
    for (const value of [null, undefined, 42, ["/account"], { path: "/" }])
      expect(isSafeRedirectPath(value)).toBe(false);
    expect(safeRedirectPath("//evil.example", "/")).toBe("/");
    expect(isSafeRedirectPath(`/${"a".repeat(2000)}`)).toBe(false);
  });
});
