// A local S3-compatible object store (s3rver) with CORS for the app's origin, so the browser can
// PUT evidence straight to it through presigned URLs, as it would to the hosted store.
// Like the hosted store, it serves only requests signed with AWS Signature Version 4 (see
// ./sigv4.ts): anonymous, tampered or expired requests get 403 with the store's XML error.
// s3rver alone lets anonymous requests through and does not check V4 signatures at all.
import type { IncomingMessage, ServerResponse } from "node:http";
import S3rver from "s3rver";
import { verifySigV4 } from "./sigv4";

export const FAKE_S3_CREDENTIALS = { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" };

const cors = (origins: string[]) => `<CORSConfiguration>
  <CORSRule>
    ${origins.map((o) => `<AllowedOrigin>${o}</AllowedOrigin>`).join("\n    ")}
    <AllowedMethod>PUT</AllowedMethod>
    <AllowedMethod>GET</AllowedMethod>
    <AllowedMethod>HEAD</AllowedMethod>
    <AllowedHeader>*</AllowedHeader>
    <ExposeHeader>ETag</ExposeHeader>
    <MaxAgeSeconds>3000</MaxAgeSeconds>
  </CORSRule>
</CORSConfiguration>`;

const xmlText = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;");

/** s3rver behind a SigV4 check; CORS preflights (unsigned by nature) go straight through. */
class SignedObjectStore extends S3rver {
  constructor(
    options: ConstructorParameters<typeof S3rver>[0],
    private readonly origins: string[],
  ) {
    super(options);
  }

  override callback() {
    const serve = super.callback();
    const secrets = new Map([[FAKE_S3_CREDENTIALS.accessKeyId, FAKE_S3_CREDENTIALS.secretAccessKey]]);
    return (req: IncomingMessage, res: ServerResponse) => {
      if (req.method === "OPTIONS") return serve(req, res);
      const refusal = verifySigV4({ method: req.method ?? "GET", url: req.url ?? "/", headers: req.headers }, secrets);
      if (!refusal) return serve(req, res);
      req.resume();
      const origin = req.headers.origin;
      res.writeHead(403, {
        "Content-Type": "application/xml",
        ...(origin && this.origins.includes(origin) ? { "Access-Control-Allow-Origin": origin, Vary: "Origin" } : {}),
      });
      res.end(
        `<?xml version="1.0" encoding="UTF-8"?>\n<Error><Code>${refusal.code}</Code><Message>${xmlText(refusal.message)}</Message></Error>`,
      );
    };
  }
}

export async function startObjectStore({
  port,
  dir,
  bucket,
  origins,
}: {
  port: number;
  dir: string;
  bucket: string;
  origins: string[];
}) {
  const server = new SignedObjectStore(
    {
      address: "127.0.0.1",
      port,
      directory: dir,
      silent: true,
      configureBuckets: [{ name: bucket, configs: [cors(origins)] }],
    },
    origins,
  );
  await server.run();
  return {
    url: `http://127.0.0.1:${port}`,
    stop: () => server.close(),
  };
}
