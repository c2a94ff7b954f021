// server.js is plain JavaScript and cannot import the app's constants: the two must agree.
// And the security header function, which adds HSTS only over https.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { applySecurityHeaders, HSTS, strictTransportSecurity } from "../../app/security.server";
import { CLIENT_ADDRESS_HEADER } from "../../app/utils/client-address.server";

it("server.js sets the client-address header the app reads", () => {
  const server = readFileSync(new URL("../../server.js", import.meta.url), "utf8");
  expect(server).toContain(`const CLIENT_ADDRESS_HEADER = "${CLIENT_ADDRESS_HEADER}";`);
});

it("server.js sends the same Strict-Transport-Security value as the app", () => {
  const server = readFileSync(new URL("../../server.js", import.meta.url), "utf8");
  expect(server).toContain(`const HSTS = "${HSTS}";`);
});

describe("Strict-Transport-Security", () => {
  // One year with subdomains: common practice. RFC 6797 defines the directives (published); the
  // HSTS preload list (hstspreload.org) asks for max-age of at least 31536000 (from memory).
  it("is sent only when the app's origin is https", () => {
    expect(HSTS).toBe("max-age=31536000; includeSubDomains");
    expect(strictTransportSecurity("https://bayproof.example")).toBe(HSTS);
    expect(strictTransportSecurity("http://127.0.0.1:3000")).toBeNull();
  });

  it("is among the headers of every page over https, and absent over http", () => {
    const secure = new Headers();
    applySecurityHeaders(secure, "bm9uY2U=", false, "https://bayproof.example");
    expect(secure.get("strict-transport-security")).toBe(HSTS);
    const plain = new Headers();
    applySecurityHeaders(plain, "bm9uY2U=", false, "http://127.0.0.1:3000");
    expect(plain.get("strict-transport-security")).toBeNull();
    expect(plain.get("x-content-type-options")).toBe("nosniff");
  });
});
