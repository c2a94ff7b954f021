// Object storage through the AWS SDK: the hosted S3-compatible store in production, the local
// fake (fakes/storage.ts) in development and tests. Objects are private; the browser only ever
// gets short-lived presigned URLs.
import { createHash } from "node:crypto";
import type { Readable } from "node:stream";
import {
  CopyObjectCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  PutObjectCommand,
  S3Client,
} from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { config } from "~/config.server";

export const storageConfig = config.storage;

const clientFor = (endpoint: string) =>
  new S3Client({
    endpoint,
    region: storageConfig.region,
    forcePathStyle: storageConfig.forcePathStyle,
    credentials: { accessKeyId: storageConfig.accessKeyId, secretAccessKey: storageConfig.secretAccessKey },
    // Presigned browser PUTs cannot add the SDK's default checksum headers.
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });

export const s3 = clientFor(storageConfig.endpoint);

/** A bucket and the client that reaches it: the configured one, or another (tests, scripts). */
export interface Store {
  client: S3Client;
  bucket: string;
}
export const defaultStore: Store = { client: s3, bucket: storageConfig.bucket };
export const storeAt = (endpoint: string, bucket: string): Store => ({ client: clientFor(endpoint), bucket });

/** The origin browsers upload to and play from; it must be allowed by the page's CSP. */
export const storageOrigin = new URL(storageConfig.endpoint).origin;

/** How long a browser may take to start its upload; the URL can write one key, nothing else. */
export const UPLOAD_URL_SECONDS = 600;

/**
 * A PUT for exactly this key, content type and length: the store refuses the same URL with any other
 * Content-Type or Content-Length (both are signed; the S3 presigner leaves Content-Type unsigned
 * unless asked).
 */
export async function presignPut(
  key: string,
  contentType: string,
  contentLength: number,
  expiresIn = UPLOAD_URL_SECONDS,
) {
  return getSignedUrl(
    s3,
    new PutObjectCommand({
      Bucket: storageConfig.bucket,
      Key: key,
      ContentType: contentType,
      ContentLength: contentLength,
    }),
    {
      expiresIn,
      signableHeaders: new Set(["content-type", "content-length"]),
    },
  );
}

/** A short-lived GET; `response` names the Content-Type and Content-Disposition the store answers with. */
export async function presignGet(
  key: string,
  expiresIn = 300,
  response: { contentType?: string; disposition?: string } = {},
) {
  return getSignedUrl(
    s3,
    new GetObjectCommand({
      Bucket: storageConfig.bucket,
      Key: key,
      ResponseContentType: response.contentType,
      ResponseContentDisposition: response.disposition,
    }),
    { expiresIn },
  );
}

/** Size of a stored object, or null when there is none. */
export async function objectSize(key: string): Promise<number | null> {
  try {
    const head = await s3.send(new HeadObjectCommand({ Bucket: storageConfig.bucket, Key: key }));
    return head.ContentLength ?? null;
  } catch (error) {
    if ((error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return null;
    throw error;
  }
}

export async function readHead(key: string, bytes = 4100): Promise<Uint8Array> {
  const res = await s3.send(
    new GetObjectCommand({ Bucket: storageConfig.bucket, Key: key, Range: `bytes=0-${bytes - 1}` }),
  );
  return res.Body!.transformToByteArray();
}

/** SHA-256 of the whole object, streamed so memory stays flat for a 500 MB video. */
export async function sha256OfObject(key: string): Promise<string> {
  const res = await s3.send(new GetObjectCommand({ Bucket: storageConfig.bucket, Key: key }));
  const hash = createHash("sha256");
  for await (const chunk of res.Body as Readable) hash.update(chunk as Buffer);
  return hash.digest("hex");
}

/** Server-side copy inside the bucket; the bytes never pass through the app. */
export async function copyObject(from: string, to: string) {
  const source = `${storageConfig.bucket}/${from.split("/").map(encodeURIComponent).join("/")}`;
  await s3.send(new CopyObjectCommand({ Bucket: storageConfig.bucket, Key: to, CopySource: source }));
}

/**
 * True when the store could not be reached or failed on its side (no HTTP answer, or a 5xx), as
 * opposed to answering about the request (404, 403…). Such a failure is worth retrying later.
 */
export function isStorageOutage(error: unknown) {
  const status = (error as { $metadata?: { httpStatusCode?: number } } | null)?.$metadata?.httpStatusCode;
  return status == null || status >= 500;
}

export async function deleteObject(key: string) {
  await s3.send(new DeleteObjectCommand({ Bucket: storageConfig.bucket, Key: key }));
}
