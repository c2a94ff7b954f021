// A new reporter, made for one test, files one report over HTTP; as their first report without
// evidence it comes back flagged, so it needs two moderators' accepts.
import type { Kysely } from "kysely";
import type { Database } from "../../db/schema";
import { signedInAs } from "./http";
import { validReport } from "./reports";

/** `prefix` names the test in the new reporter's e-mail and handle (`mod` → mod-test-…, modtest-…). */
export async function fileFirstReport(db: Kysely<Database>, prefix: string) {
  const stamp = `${Date.now()}${Math.floor(Math.random() * 1000)}`;
  const email = `${prefix}-test-${stamp}@demo.bayproof.test`;
  await db
    .insertInto("users")
    .values({ email, handle: `${prefix}test-${stamp.slice(-9)}` })
    .execute();
  const reporter = await signedInAs(db, email);
  const res = await reporter.post("/reports/new", validReport());
  const id = Number(res.headers.get("location")!.match(/submitted=(\d+)/)![1]);
  return { id, email, reporter };
}
