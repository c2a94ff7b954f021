// A local S3-compatible object store (s3rver) with CORS for the app's origin, so the browser can
// PUT evidence straight to it through presigned URLs, as it would to the hosted store.
import S3rver from "s3rver";

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

export async function startObjectStore({ port, dir, bucket, origins }: { port: number; dir: string; bucket: string; origins: string[] }) {
  const server = new S3rver({
    address: "127.0.0.1",
    port,
    directory: dir,
    silent: true,
    configureBuckets: [{ name: bucket, configs: [cors(origins)] }],
  });
  await server.run();
  return {
    url: `http://127.0.0.1:${port}`,
    stop: () => server.close(),
  };
}
