// Storage out of reach when an upload is checked: the completion route answers 503 with a message
// the uploader shows, and the draft and its pending upload stay as they were. The shared store
// keeps serving the other tests: the route runs here, in-process, against a second store instance
// that has been stopped.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { startObjectStore } from "../../fakes/storage";
import { testDb } from "../support/db";
import { tinyPng } from "../support/files";
import { signedInAs, type Browserish } from "../support/http";
import { complete, newDraft, presign } from "../support/evidence";
import { freePort } from "../support/system";
import type * as CompleteRoute from "../../app/routes/api.evidence.$id.complete";
import type * as SessionModule from "../../app/auth/session.server";

const db = testDb();
const dir = mkdtempSync(path.join(tmpdir(), "bayproof-stopped-store-"));
let owner: Browserish;
let route: typeof CompleteRoute;
let withSessions: typeof SessionModule.withSessions;
let appPool: { end(): Promise<void> };

beforeAll(async () => {
  owner = await signedInAs(db, "reporter@demo.bayproof.test");
  const port = await freePort();
  const stopped = await startObjectStore({ port, dir, bucket: inject("s3").bucket, origins: [owner.origin] });
  await stopped.stop();
  // The app modules read their configuration when first imported.
  Object.assign(process.env, {
    DATABASE_URL: inject("databaseUrl"),
    S3_ENDPOINT: stopped.url,
    S3_BUCKET: inject("s3").bucket,
  });
  route = await import("../../app/routes/api.evidence.$id.complete");
  ({ withSessions } = await import("../../app/auth/session.server"));
  appPool = (await import("../../app/db.server")).pool;
});
afterAll(async () => {
  await appPool?.end();
  await db.destroy();
  rmSync(dir, { recursive: true, force: true });
});

describe("checking an upload while storage is down", () => {
  it("answers 503 with a message for the uploader, and the draft is unchanged", async () => {
    const draft = await newDraft(owner);
    const png = tinyPng();
    const signed = await (await presign(owner, draft, { type: "image/png", size: png.length })).json();
    expect(
      (await fetch(signed.url, { method: "PUT", headers: signed.headers, body: new Uint8Array(png) })).status,
    ).toBe(200);

    const request = new Request(new URL(`/api/evidence/${signed.evidenceId}/complete`, owner.origin), {
      method: "POST",
      headers: { cookie: [...owner.cookies].map(([k, v]) => `${k}=${v}`).join("; "), origin: owner.origin },
    });
    // In-process, as the root middleware would run it (the guards read the session through withSessions).
    const res = await withSessions(db, () =>
      route.action({ request, params: { id: String(signed.evidenceId) } } as Parameters<typeof route.action>[0]),
    );
    expect(res.status).toBe(503);
    expect(res.headers.get("content-type")).toMatch(/application\/json/);
    expect((await res.json()).error).toMatch(/storage is not reachable.*kept on your device/i);

    const evidence = await db
      .selectFrom("evidence")
      .select(["status", "object_key"])
      .where("id", "=", signed.evidenceId)
      .executeTakeFirstOrThrow();
    expect(evidence).toEqual({ status: "pending", object_key: signed.key });
    expect(
      (await db.selectFrom("reports").select("status").where("id", "=", draft).executeTakeFirstOrThrow()).status,
    ).toBe("draft");

    // Once storage answers again (the served app's store), the same upload is checked.
    expect((await complete(owner, signed.evidenceId)).status).toBe(200);
  });
});
