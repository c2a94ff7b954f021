// Checks AWS Signature Version 4 on a request to the local object store, as the hosted store does:
// the Authorization header or the presigned query (X-Amz-*), the credential scope, the request's
// age or a presigned URL's expiry, and every signed header's value. Written from the AWS Signature
// Version 4 documentation ("Create a canonical request", "Create a string to sign", "Calculate the
// signature", "Authenticating requests: using query parameters"), from memory.
// Not checked: the payload hash itself (the signed x-amz-content-sha256 value is trusted).
import { createHash, createHmac, timingSafeEqual } from "node:crypto";
import type { IncomingHttpHeaders } from "node:http";

export interface SignedRequest {
  method: string;
  /** The request target as sent: path and query, still percent-encoded. */
  url: string;
  headers: IncomingHttpHeaders;
}

export interface Refusal {
  code:
    | "AccessDenied"
    | "SignatureDoesNotMatch"
    | "InvalidAccessKeyId"
    | "AuthorizationQueryParametersError"
    | "RequestTimeTooSkewed";
  message: string;
}

const ALGORITHM = "AWS4-HMAC-SHA256";
const MAX_SKEW_MS = 15 * 60_000; // the hosted store's allowed clock skew for header-signed requests
const MAX_EXPIRES_S = 604_800; // a presigned URL lives at most seven days

/** RFC 3986 encoding, as SigV4 canonical query strings use it. */
const encode = (s: string) =>
  encodeURIComponent(s).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
const hmac = (key: Buffer | string, data: string) => createHmac("sha256", key).update(data, "utf8").digest();
const sha256Hex = (data: string) => createHash("sha256").update(data, "utf8").digest("hex");

function parseQuery(raw: string): [string, string][] {
  return raw
    .split("&")
    .filter(Boolean)
    .map((part) => {
      const eq = part.indexOf("=");
      const [k, v] = eq < 0 ? [part, ""] : [part.slice(0, eq), part.slice(eq + 1)];
      return [decodeURIComponent(k), decodeURIComponent(v)];
    });
}

/** "20261202T101500Z" → Date, or null. */
function parseAmzDate(s: string | undefined): Date | null {
  const m = /^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/.exec(s ?? "");
  return m ? new Date(Date.UTC(+m[1]!, +m[2]! - 1, +m[3]!, +m[4]!, +m[5]!, +m[6]!)) : null;
}

const headerValue = (headers: IncomingHttpHeaders, name: string) => {
  const v = headers[name];
  return (Array.isArray(v) ? v.join(",") : (v ?? "")).trim().replace(/\s+/g, " ");
};

/**
 * Null when the request is signed with a known key and the signature matches; otherwise why not.
 * `secrets` maps access key ids to secret keys; `now` is the store's clock.
 */
export function verifySigV4(req: SignedRequest, secrets: Map<string, string>, now = new Date()): Refusal | null {
  const q = req.url.indexOf("?");
  const path = q < 0 ? req.url : req.url.slice(0, q);
  let query: [string, string][];
  try {
    query = parseQuery(q < 0 ? "" : req.url.slice(q + 1));
  } catch {
    return { code: "AccessDenied", message: "The query string cannot be read" };
  }
  const param = (name: string) => query.find(([k]) => k === name)?.[1];
  const authorization = headerValue(req.headers, "authorization");
  const presigned = param("X-Amz-Signature") != null || param("X-Amz-Algorithm") != null;
  if (!authorization && !presigned) return { code: "AccessDenied", message: "Access Denied" };
  if (authorization && presigned) return { code: "AccessDenied", message: "Only one auth mechanism allowed" };

  let algorithm: string | undefined,
    credential: string | undefined,
    signedHeaders: string | undefined,
    signature: string | undefined;
  let amzDate: string | undefined, payloadHash: string;
  if (presigned) {
    [algorithm, credential, signedHeaders, signature, amzDate] = [
      "X-Amz-Algorithm",
      "X-Amz-Credential",
      "X-Amz-SignedHeaders",
      "X-Amz-Signature",
      "X-Amz-Date",
    ].map(param);
    payloadHash = param("X-Amz-Content-Sha256") ?? "UNSIGNED-PAYLOAD";
    query = query.filter(([k]) => k !== "X-Amz-Signature");
  } else {
    const m = /^(\S+) Credential=([^,\s]+),\s*SignedHeaders=([^,\s]+),\s*Signature=([0-9a-f]+)$/.exec(authorization);
    if (!m)
      return { code: "AccessDenied", message: "The Authorization header is not an AWS Signature Version 4 header" };
    [, algorithm, credential, signedHeaders, signature] = m;
    amzDate = headerValue(req.headers, "x-amz-date") || undefined;
    payloadHash = headerValue(req.headers, "x-amz-content-sha256");
    if (!payloadHash)
      return { code: "AccessDenied", message: "Missing required header for this request: x-amz-content-sha256" };
  }
  if (algorithm !== ALGORITHM || !credential || !signedHeaders || !signature || !amzDate) {
    return {
      code: "AuthorizationQueryParametersError",
      message: `Signed requests need ${ALGORITHM} with a credential, signed headers, a signature and X-Amz-Date`,
    };
  }

  const [accessKeyId, day, region, service, terminator, ...rest] = credential.split("/");
  const secret = secrets.get(accessKeyId ?? "");
  if (!secret)
    return { code: "InvalidAccessKeyId", message: "The AWS Access Key Id you provided does not exist in our records." };
  const signedAt = parseAmzDate(amzDate);
  if (
    !signedAt ||
    rest.length ||
    !region ||
    service !== "s3" ||
    terminator !== "aws4_request" ||
    day !== amzDate.slice(0, 8)
  ) {
    return { code: "AccessDenied", message: "The credential scope or X-Amz-Date is malformed" };
  }
  if (presigned) {
    const expires = Number(param("X-Amz-Expires"));
    if (!Number.isInteger(expires) || expires < 1 || expires > MAX_EXPIRES_S) {
      return {
        code: "AuthorizationQueryParametersError",
        message: "X-Amz-Expires must be between 1 and 604800 seconds",
      };
    }
    if (now.getTime() > signedAt.getTime() + expires * 1000)
      return { code: "AccessDenied", message: "Request has expired" };
    if (signedAt.getTime() > now.getTime() + MAX_SKEW_MS)
      return { code: "AccessDenied", message: "Request is not valid yet" };
  } else if (Math.abs(now.getTime() - signedAt.getTime()) > MAX_SKEW_MS) {
    return {
      code: "RequestTimeTooSkewed",
      message: "The difference between the request time and the current time is too large.",
    };
  }

  const names = signedHeaders.split(";");
  if (
    !names.includes("host") ||
    names.some((n) => n !== n.toLowerCase()) ||
    names.join(";") !== [...names].sort().join(";")
  ) {
    return { code: "AccessDenied", message: "SignedHeaders must be lower case, sorted and include host" };
  }
  const canonicalQuery = query
    .map(([k, v]) => [encode(k), encode(v)] as const)
    .sort(([a, x], [b, y]) => (a < b ? -1 : a > b ? 1 : x < y ? -1 : x > y ? 1 : 0))
    .map(([k, v]) => `${k}=${v}`)
    .join("&");
  const canonicalRequest = [
    req.method.toUpperCase(),
    path, // the hosted store signs the path as sent, without normalising it
    canonicalQuery,
    names.map((n) => `${n}:${headerValue(req.headers, n)}\n`).join(""),
    signedHeaders,
    payloadHash,
  ].join("\n");
  const scope = `${day}/${region}/${service}/${terminator}`;
  const stringToSign = [ALGORITHM, amzDate, scope, sha256Hex(canonicalRequest)].join("\n");
  const key = hmac(hmac(hmac(hmac(`AWS4${secret}`, day), region), service), terminator);
  const expected = Buffer.from(hmac(key, stringToSign).toString("hex"));
  const given = Buffer.from(signature);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) {
    return {
      code: "SignatureDoesNotMatch",
      message:
        "The request signature we calculated does not match the signature you provided. Check your key and signing method.",
    };
  }
  return null;
}
