// Hostile input against every action and API route, as every kind of caller: values from the
// routes' own schemas and the published OpenAPI, broken every way fast-check (fixed seed) can
// think of. No answer may be a 5xx, every /api/ error must be JSON, and a refused write must
// leave every main table's row count as it was. The counts are printed and written to
// .data/hostile-report.json.
import { mkdirSync, writeFileSync } from "node:fs";
import fc from "fast-check";
import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { randomToken, sha256Hex } from "../../app/utils/tokens.server";
import { testDb } from "../support/db";
import { baseUrl, cookieValue } from "../support/http";
import { validReport } from "../support/reports";
import {
  damage,
  FORM_TARGETS,
  hostileJson,
  hostileText,
  JSON_TARGETS,
  type Own,
  PATH_ID_TARGETS,
  QUERY_TARGETS,
  type Transport,
  type Who,
} from "./targets";

const SEED = 20_261_202;
const RUNS_PER_FORM = 12; // per target and caller
const RUNS_PER_JSON = 10;
const RUNS_PER_QUERY = 14;
const RUNS_PER_FEED_PATH = 16;
const KIB = 1024;

const db = testDb();
afterAll(() => db.destroy());

const cookies = {} as Record<Who, string>;
let own: Own;
const tally = {
  requests: 0,
  serverErrors: 0,
  refusedWrites: 0,
  rowsChangedByRefusedWrites: 0,
  byStatus: {} as Record<number, number>,
};
const problems: string[] = [];

const MAIN_TABLES = [
  "users",
  "user_roles",
  "role_changes",
  "sessions",
  "sign_in_links",
  "api_keys",
  "reports",
  "report_versions",
  "evidence",
  "decisions",
  "report_claims",
  "notices",
] as const;

async function rowCounts(): Promise<Record<string, number>> {
  const { rows } = await sql<Record<string, number>>`select ${sql.join(
    MAIN_TABLES.map((t) => sql`(select count(*)::int from ${sql.table(t)}) as ${sql.ref(t)}`),
  )}`.execute(db);
  return rows[0]!;
}

async function newUser(label: string, roles: ("moderator" | "admin")[]) {
  const tag = `${label}-${process.pid}-${Date.now() % 1e7}`;
  const user = await db
    .insertInto("users")
    .values({ email: `hostile-${tag}@demo.bayproof.test`, handle: `h-${tag}`.slice(0, 30) })
    .returning("id")
    .executeTakeFirstOrThrow();
  for (const role of roles)
    await db.insertInto("user_roles").values({ user_id: user.id, role, granted_by: null }).execute();
  const token = randomToken();
  await db
    .insertInto("sessions")
    .values({
      id_hash: sha256Hex(token),
      user_id: user.id,
      expires_at: new Date(Date.now() + 3600_000),
      sign_in_method: "email_link",
    })
    .execute();
  return { id: user.id, cookie: `bayproof_session=${cookieValue(token)}` };
}

let clientNumber = 0;
/** A fresh client address each request (TEST-NET-2), so per-client rate limits rarely decide the answer. */
const clientAddress = () => `198.51.100.${(clientNumber++ % 250) + 1}`;

function encodeBody(
  entries: [string, string][],
  how: Transport,
): { body?: BodyInit; type?: string; chunked?: boolean } {
  switch (how) {
    case "urlencoded":
      return { body: new URLSearchParams(entries).toString(), type: "application/x-www-form-urlencoded" };
    case "multipart": {
      const form = new FormData();
      for (const [k, v] of entries) form.append(k, v);
      return { body: form };
    }
    case "json":
      return { body: JSON.stringify(Object.fromEntries(entries)), type: "application/json" };
    case "text":
      return { body: entries.map(([k, v]) => `${k}=${v}`).join("\n"), type: "text/plain" };
    case "broken-multipart":
      return {
        body: `--cut\r\nContent-Disposition: form-data; name="${entries[0]?.[0] ?? "a"}"\r\n\r\nno end`,
        type: "multipart/form-data; boundary=cut",
      };
    case "none":
      return {};
    case "oversize":
      return {
        body: new URLSearchParams([...entries, ["padding", "x".repeat(200 * KIB)]]).toString(),
        type: "application/x-www-form-urlencoded",
      };
    case "oversize-chunked":
      return { body: "", type: "application/x-www-form-urlencoded", chunked: true };
  }
}

/** 2 MiB in 64 KiB pieces, with no Content-Length. */
const endlessBody = () => {
  let sent = 0;
  return new ReadableStream<Uint8Array>({
    pull(controller) {
      if (sent >= 2048 * KIB) return controller.close();
      sent += 64 * KIB;
      controller.enqueue(new TextEncoder().encode("a=".padEnd(64 * KIB, "x")));
    },
  });
};

async function send(
  who: Who,
  method: string,
  path: string,
  body?: { body?: BodyInit; type?: string; chunked?: boolean },
) {
  const headers: Record<string, string> = { origin: baseUrl(), "x-forwarded-for": clientAddress() };
  if (cookies[who]) headers.cookie = cookies[who];
  if (body?.type) headers["content-type"] = body.type;
  const init: RequestInit & { duplex?: "half" } = { method, headers, redirect: "manual" };
  if (body?.chunked) {
    init.body = endlessBody();
    init.duplex = "half";
  } else if (body?.body !== undefined) init.body = body.body;
  let res: Response;
  try {
    res = await fetch(new URL(path, baseUrl()), init);
  } catch (error) {
    // A body cut short after the 413 may end in a reset; the 413 itself is checked by the limit test.
    if (body?.chunked) return { status: 413, type: "", text: "" };
    throw error;
  }
  const text = await res.text().catch(() => "");
  tally.requests++;
  tally.byStatus[res.status] = (tally.byStatus[res.status] ?? 0) + 1;
  const type = res.headers.get("content-type") ?? "";
  if (res.status >= 500) {
    tally.serverErrors++;
    problems.push(`${who} ${method} ${path.slice(0, 120)} → ${res.status}: ${text.slice(0, 200)}`);
  }
  if (path.startsWith("/api/") && res.status >= 400 && !type.includes("application/json")) {
    problems.push(`${who} ${method} ${path.slice(0, 120)} → ${res.status} without a JSON error (${type})`);
  }
  return { status: res.status, type, text, location: res.headers.get("location") };
}

/** A write: the main tables' row counts must not move unless the write was accepted. */
async function write(who: Who, path: string, body: ReturnType<typeof encodeBody>) {
  const before = await rowCounts();
  const res = await send(who, "POST", path, body);
  const accepted =
    (res.status >= 200 && res.status < 300) ||
    (res.status >= 300 && res.status < 400 && !res.location?.startsWith("/sign-in"));
  if (!accepted) {
    tally.refusedWrites++;
    const after = await rowCounts();
    const moved = MAIN_TABLES.filter((t) => after[t] !== before[t]);
    if (moved.length) {
      tally.rowsChangedByRefusedWrites += moved.reduce((n, t) => n + Math.abs(after[t]! - before[t]!), 0);
      problems.push(
        `${who} POST ${path} → ${res.status} changed ${moved.map((t) => `${t} ${before[t]}→${after[t]}`).join(", ")}`,
      );
    }
  }
  return res;
}

/** Only this suite's own rows may be named for real: an id that would be valid becomes ours. */
function ownOnly(field: string, value: string): string {
  if (field === "userId" && /^[1-9][0-9]{0,9}$/.test(value)) return String(own.targetUser);
  return value;
}

beforeAll(async () => {
  const [reporter, moderator, admin, target] = await Promise.all([
    newUser("rep", []),
    newUser("mod", ["moderator"]),
    newUser("adm", ["admin"]),
    newUser("tgt", []),
  ]);
  cookies.anonymous = "";
  cookies.reporter = reporter.cookie;
  cookies.moderator = moderator.cookie;
  cookies.admin = admin.cookie;
  // The reporter's own draft and submitted report, filed through the app.
  const draft = await send(
    "reporter",
    "POST",
    "/reports/new",
    encodeBody(Object.entries({ ...validReport(), intent: "save-draft" }), "urlencoded"),
  );
  const submitted = await send(
    "reporter",
    "POST",
    "/reports/new",
    encodeBody(Object.entries(validReport()), "urlencoded"),
  );
  own = {
    reporterDraft: Number(draft.location!.match(/\/reports\/(\d+)\/edit/)![1]),
    submittedReport: Number(new URL(submitted.location!, baseUrl()).searchParams.get("submitted")),
    targetUser: target.id,
  };
  // Starting the review claims the report for the moderator (the admin's start finds it held):
  // done here, so the decisions that follow meet a claim already taken.
  for (const who of ["moderator", "admin"] as const)
    await send(who, "POST", `/review/${own.submittedReport}`, encodeBody([["intent", "claim"]], "urlencoded"));
});

afterAll(() => {
  const summary = { seed: SEED, ...tally, problems: problems.length };
  mkdirSync(".data", { recursive: true });
  writeFileSync(".data/hostile-report.json", JSON.stringify({ ...summary, problemList: problems }, null, 2));
  console.log(
    `[hostile] ${tally.requests} requests, ${tally.serverErrors} answered 5xx, ${tally.refusedWrites} refused writes, ` +
      `${tally.rowsChangedByRefusedWrites} rows changed by refused writes; statuses ${JSON.stringify(tally.byStatus)}`,
  );
});

describe("hostile input", () => {
  it("forms: every action, every caller, broken fields and bodies", async () => {
    let n = 0;
    for (const target of FORM_TARGETS) {
      for (const who of target.who) {
        const cases = fc.sample(damage(target.fields), { seed: SEED + n, numRuns: RUNS_PER_FORM });
        for (const c of cases) {
          const values = { ...target.base(own, n++) };
          for (const k of c.missing) delete values[k];
          for (const [k, v] of c.changed) values[k] = ownOnly(k, v);
          const entries = Object.entries(values);
          for (const k of c.repeated) entries.push([k, ownOnly(k, values[k] ?? "again")]);
          const res = await write(who, target.path(own), encodeBody(entries, c.transport));
          if (c.transport === "oversize") expect.soft(res.status, `${who} ${target.path(own)} oversize`).toBe(413);
        }
      }
    }
    expect(problems).toEqual([]);
  }, 300_000);

  it("JSON API: bodies of every shape and type", async () => {
    let n = 0;
    for (const target of JSON_TARGETS) {
      for (const who of target.who) {
        const arb = fc.record({
          changes: fc.array(fc.tuple(fc.constantFrom(...target.fields, "extra"), hostileJson), { maxLength: 2 }),
          raw: fc.option(fc.constantFrom("{", "[1,", "null", '"text"', '{"public": tru}'), { nil: undefined }),
          transport: fc.constantFrom<Transport>("json", "json", "json", "urlencoded", "text", "none", "oversize"),
        });
        for (const c of fc.sample(arb, { seed: SEED + 1000 + n++, numRuns: RUNS_PER_JSON })) {
          const body = { ...target.base(), ...Object.fromEntries(c.changes) };
          const encoded =
            c.transport === "json"
              ? { body: c.raw ?? JSON.stringify(body), type: "application/json" }
              : encodeBody(
                  Object.entries(body).map(([k, v]) => [k, String(v)]),
                  c.transport,
                );
          await write(who, target.path(own), encoded);
        }
      }
    }
    expect(problems).toEqual([]);
  }, 300_000);

  it("query strings and path ids of pages and the app's API", async () => {
    let n = 0;
    for (const target of QUERY_TARGETS) {
      for (const who of target.who) {
        const arb = fc.array(fc.tuple(fc.constantFrom(...target.fields, "unknown"), hostileText), {
          minLength: 1,
          maxLength: 3,
        });
        for (const params of fc.sample(arb, { seed: SEED + 2000 + n++, numRuns: RUNS_PER_QUERY })) {
          await send(who, "GET", `${target.path(own)}?${new URLSearchParams(params)}`);
        }
      }
    }
    for (const path of PATH_ID_TARGETS(own))
      for (const who of ["anonymous", "moderator"] as const) await send(who, "GET", path);
    expect(problems).toEqual([]);
  }, 300_000);

  it("the open feed: every published path and parameter", async () => {
    const openapi = (await (await fetch(new URL("/api/v1/openapi.json", baseUrl()))).json()) as {
      paths: Record<string, { get?: { parameters?: { name: string; in: string }[] } }>;
    };
    let n = 0;
    for (const [template, item] of Object.entries(openapi.paths)) {
      const params = item.get?.parameters ?? [];
      const query = params.filter((p) => p.in === "query").map((p) => p.name);
      const inPath = params.filter((p) => p.in === "path").map((p) => p.name);
      const arb = fc.record({
        query: fc.array(fc.tuple(fc.constantFrom(...query, "unknown"), hostileText), { maxLength: 3 }),
        path: fc.constantFrom(...BAD_PATH_VALUES, "1", "report", "model"),
        method: fc.constantFrom("GET", "GET", "GET", "HEAD", "POST", "DELETE"),
      });
      for (const c of fc.sample(arb, { seed: SEED + 3000 + n++, numRuns: RUNS_PER_FEED_PATH })) {
        let path = template;
        for (const name of inPath) path = path.replace(`{${name}}`, encodeURIComponent(c.path));
        const url = `${path.startsWith("/api/") ? "" : "/api/v1"}${path}${c.query.length ? `?${new URLSearchParams(c.query)}` : ""}`;
        const res =
          c.method === "GET" || c.method === "HEAD"
            ? await send("anonymous", c.method, url)
            : await write("anonymous", url, encodeBody([["a", "b"]], "urlencoded"));
        if (res.status >= 400 && c.method === "GET") expect.soft(res.type, url).toContain("application/json");
      }
    }
    expect(problems).toEqual([]);
  }, 300_000);
});

const BAD_PATH_VALUES = ["0", "-1", "0x10", "2147483648", "99999999999", "\u0000", "a b", "..", "%"];
