// The demo's evidence rows point at files that exist: the test stack places them the way `npm
// start` does (seeds/demo-evidence.ts), and the open feed's evidence links lead to the file.
import { createHash } from "node:crypto";
import { sql } from "kysely";
import { afterAll, describe, expect, it } from "vitest";
import { testDb } from "../support/db";
import { feedClient } from "../support/feed";

const db = testDb();
afterAll(() => db.destroy());

describe("demo evidence in the local object store", () => {
  it("serves every sampled published file of an accepted report, with the recorded SHA-256", async () => {
    const sample = await db
      .selectFrom("evidence as e")
      .innerJoin("reports as r", "r.id", "e.report_id")
      .select(["e.id", "e.sha256", "e.size_bytes"])
      .where("r.status", "=", "accepted")
      .where("e.is_public", "=", true)
      .where("e.status", "in", ["uploaded", "verified"])
      .orderBy(sql`random()`)
      .limit(40)
      .execute();
    expect(sample.length).toBe(40);
    const get = feedClient(); // 40 requests: under the anonymous limit of 60 a minute
    for (const file of sample) {
      const res = await get(`/api/v1/evidence/${file.id}`);
      expect(res.status, `evidence ${file.id}`).toBe(302);
      const object = await fetch(res.headers.get("location")!);
      expect(object.status, `evidence ${file.id}`).toBe(200);
      const bytes = new Uint8Array(await object.arrayBuffer());
      expect(createHash("sha256").update(bytes).digest("hex"), `evidence ${file.id}`).toBe(file.sha256);
      expect(bytes.length).toBe(Number(file.size_bytes));
    }
  });
});
