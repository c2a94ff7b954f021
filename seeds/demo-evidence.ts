// Puts a playable invented clip (or a still of the demo gauge) in object storage behind every
// checked evidence row that has no object yet — the demo's reports in every state, so the review
// screen can play them and the open feed's evidence links answer. The row is made to describe the
// file placed (type, size, SHA-256) before the file is placed, so a run cut short is finished by
// the next one. Idempotent: objects already there are left alone. Local stand-in data only.
import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import path from "node:path";
import { ListObjectsCommand, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import type { Kysely } from "kysely";
import type { Database } from "../db/schema";
import { demoTraceCsv, demoTraces } from "./bench";

const media = (name: string) => readFileSync(path.join(import.meta.dirname, "media", name));

/**
 * Every key in the bucket, a page of up to 1,000 at a time. The first version of the listing
 * call, paged by the last key seen (S3's own rule when no delimiter is given): the local store's
 * second version pages with a token it enciphers with DES, which Node 20's OpenSSL 3 refuses, so
 * any listing longer than one page failed there.
 */
async function storedKeys(s3: S3Client, bucket: string) {
  const keys = new Set<string>();
  let marker: string | undefined;
  for (;;) {
    const page = await s3.send(new ListObjectsCommand({ Bucket: bucket, Marker: marker }));
    const contents = page.Contents ?? [];
    for (const o of contents) if (o.Key) keys.add(o.Key);
    if (!page.IsTruncated || contents.length === 0) return keys;
    marker = page.NextMarker ?? contents.at(-1)!.Key;
  }
}

export async function ensureDemoEvidence(db: Kysely<Database>, env: Record<string, string>) {
  const s3 = new S3Client({
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION ?? "us-east-1",
    forcePathStyle: true,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID!, secretAccessKey: env.S3_SECRET_ACCESS_KEY! },
  });
  try {
    const files = {
      video: { body: media("demo-clip.webm"), type: "video/webm" },
      photo: { body: media("demo-gauge.png"), type: "image/png" },
    };
    const [items, present] = await Promise.all([
      db.selectFrom("evidence").select(["id", "object_key", "kind"]).where("status", "!=", "pending").execute(),
      storedKeys(s3, env.S3_BUCKET!),
    ]);
    const missing = items.filter((item) => !present.has(item.object_key));
    for (const kind of ["video", "photo"] as const) {
      const ids = missing.filter((item) => item.kind === kind).map((item) => item.id);
      const file = files[kind];
      for (let i = 0; i < ids.length; i += 5000) {
        await db
          .updateTable("evidence")
          .set({
            content_type: file.type,
            size_bytes: file.body.length,
            sha256: createHash("sha256").update(file.body).digest("hex"),
          })
          .where("id", "in", ids.slice(i, i + 5000))
          .execute();
      }
    }
    for (let i = 0; i < missing.length; i += 16) {
      await Promise.all(
        missing.slice(i, i + 16).map((item) => {
          const file = files[item.kind];
          return s3.send(
            new PutObjectCommand({
              Bucket: env.S3_BUCKET,
              Key: item.object_key,
              Body: file.body,
              ContentType: file.type,
            }),
          );
        }),
      );
    }
    // The demo bench runs' raw traces, made again from the same seed as the peaks stored from them.
    for (const { trace, unit } of demoTraces()) {
      if (present.has(trace.key)) continue;
      await s3.send(
        new PutObjectCommand({
          Bucket: env.S3_BUCKET,
          Key: trace.key,
          Body: demoTraceCsv(trace, unit),
          ContentType: "text/csv",
        }),
      );
    }
    return missing.length;
  } finally {
    s3.destroy();
  }
}
