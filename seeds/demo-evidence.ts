// Puts a playable invented clip (or a still of the demo gauge) in object storage behind each
// evidence row of the demo's reports still waiting for moderators, so the review screen can play
// them. Idempotent: objects already there are left alone.
import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import path from "node:path";
import { HeadObjectCommand, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import type { Kysely } from "kysely";
import type { Database } from "../db/schema";

const media = (name: string) => readFileSync(path.join(import.meta.dirname, "media", name));

export async function ensureDemoEvidence(db: Kysely<Database>, env: Record<string, string>) {
  const s3 = new S3Client({
    endpoint: env.S3_ENDPOINT, region: env.S3_REGION ?? "us-east-1", forcePathStyle: true,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID!, secretAccessKey: env.S3_SECRET_ACCESS_KEY! },
  });
  const files = {
    video: { body: media("demo-clip.webm"), type: "video/webm" },
    photo: { body: media("demo-gauge.png"), type: "image/png" },
  };
  const items = await db.selectFrom("evidence as e").innerJoin("reports as r", "r.id", "e.report_id")
    .select(["e.id", "e.object_key", "e.kind"]).where("r.status", "in", ["submitted", "returned"]).where("e.status", "!=", "pending").execute();
  let put = 0;
  for (let i = 0; i < items.length; i += 16) {
    await Promise.all(items.slice(i, i + 16).map(async (item) => {
      const exists = await s3.send(new HeadObjectCommand({ Bucket: env.S3_BUCKET, Key: item.object_key })).then(() => true, () => false);
      if (exists) return;
      const file = files[item.kind];
      await s3.send(new PutObjectCommand({ Bucket: env.S3_BUCKET, Key: item.object_key, Body: file.body, ContentType: file.type }));
      await db.updateTable("evidence").set({
        content_type: file.type, size_bytes: file.body.length, sha256: createHash("sha256").update(file.body).digest("hex"),
      }).where("id", "=", item.id).execute();
      put++;
    }));
  }
  s3.destroy();
  return put;
}
