// The signed-in user is read once per GET however many loaders ask (root and route), and afresh
// on a POST, whose action may change it (docs/decisions/011-database-access.md).
import type {
  KyselyPlugin,
  PluginTransformQueryArgs,
  PluginTransformResultArgs,
  QueryResult,
  UnknownRow,
} from "kysely";
import { afterAll, expect, it } from "vitest";
import { getUser, withSessions } from "../../app/auth/session.server";
import { testDb } from "../support/db";
import { newSession } from "../support/sessions";

const db = testDb();
afterAll(() => db.destroy());

/** Counts the queries that read the sessions table (built, or written as a `sql` template). */
class SessionReads implements KyselyPlugin {
  count = 0;
  transformQuery({ node }: PluginTransformQueryArgs) {
    if (node.kind === "SelectQueryNode" && JSON.stringify(node.from).includes('"sessions"')) this.count++;
    if (node.kind === "RawNode" && /\bselect\b[\s\S]*\bfrom sessions\b/.test(node.sqlFragments.join("?"))) this.count++;
    return node;
  }
  async transformResult({ result }: PluginTransformResultArgs): Promise<QueryResult<UnknownRow>> {
    return result;
  }
}

async function signedInRequest(method: string) {
  const { cookie } = await newSession(db, "reporter@demo.bayproof.test");
  return new Request("http://127.0.0.1/me/reports", { method, headers: { cookie: `bayproof_session=${cookie}` } });
}

it("reads the session once for every loader of a GET", async () => {
  const reads = new SessionReads();
  const request = await signedInRequest("GET");
  const users = await withSessions(db.withPlugin(reads), () =>
    Promise.all([getUser(request), getUser(request), getUser(request)]),
  );
  expect(users.map((u) => u?.handle)).toEqual(Array(3).fill(users[0]!.handle));
  expect(users[0]).not.toBeNull();
  expect(reads.count).toBe(1);
});

it("reads it afresh each time a POST's action asks", async () => {
  const reads = new SessionReads();
  const request = await signedInRequest("POST");
  await withSessions(db.withPlugin(reads), async () => {
    await getUser(request);
    await getUser(request);
  });
  expect(reads.count).toBe(2);
});

it("refuses to guess the database outside the root middleware", async () => {
  expect(() => getUser(new Request("http://127.0.0.1/"))).toThrow(/withSessions/);
});
