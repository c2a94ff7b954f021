// Bad input is a 4xx with a reason, never a 500: bodies over the route's limit, bodies that are
// not forms, ids out of PostgreSQL's range or written loosely, and control characters in text.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { testDb } from "../support/db";
import { baseUrl, type Browserish, signedInAs } from "../support/http";
import { validReport } from "../support/reports";

const db = testDb();
let reporter: Browserish;
let admin: Browserish;
afterAll(() => db.destroy());

beforeAll(async () => {
  const email = `refusals-${process.pid}-${Date.now()}@demo.bayproof.test`;
  await db
    .insertInto("users")
    .values({ email, handle: `refusals-${Date.now() % 1e8}` })
    .execute();
  reporter = await signedInAs(db, email);
  admin = await signedInAs(db, "admin@demo.bayproof.test");
});

const post = (path: string, body: BodyInit, type?: string, extra: RequestInit = {}) =>
  fetch(new URL(path, baseUrl()), {
    method: "POST",
    redirect: "manual",
    body,
    ...extra,
    headers: { origin: baseUrl(), ...(type ? { "content-type": type } : {}) },
  });

describe("request body limits", () => {
  it("refuses a body over the limit by its Content-Length, before reading it", async () => {
    const res = await post("/sign-in", `email=${"a".repeat(300 * 1024)}`, "application/x-www-form-urlencoded");
    expect(res.status).toBe(413);
    expect(await res.text()).toMatch(/at most 64 KiB/);
  });

  it("refuses a streamed body without Content-Length once it passes the limit", async () => {
    let sent = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(c) {
        if (sent >= 4 * 1024 * 1024) return c.close();
        sent += 64 * 1024;
        c.enqueue(new Uint8Array(64 * 1024).fill(97));
      },
    });
    const res = await post("/sign-in", body, "multipart/form-data; boundary=x", { duplex: "half" } as RequestInit);
    expect(res.status).toBe(413);
    expect(await res.text()).toMatch(/at most 64 KiB/);
  });

  it("answers JSON under /api/", async () => {
    const res = await post(
      "/api/evidence/1/publish",
      JSON.stringify({ public: "x".repeat(20 * 1024) }),
      "application/json",
    );
    expect(res.status).toBe(413);
    expect((await res.json()).error.code).toBe("body_too_large");
  });

  it("takes the fullest report form, with room to spare", async () => {
    // Every field at its longest: 4,000 characters of notes, each 3 bytes in UTF-8 (9 URL-encoded).
    const form = { ...validReport(), attachment: "€".repeat(120), notes: "€".repeat(4000), intent: "save-draft" };
    const size = new URLSearchParams(form).toString().length;
    expect(size * 4).toBeLessThanOrEqual(160 * 1024);
    const res = await reporter.post("/reports/new", form);
    expect(res.status).toBe(302);
  });
});

describe("bodies that are not forms", () => {
  it("refuses JSON and plain text on a form route with 415 and a reason", async () => {
    for (const [body, type] of [
      [JSON.stringify({ email: "a@b.example" }), "application/json"],
      ["email=a@b.example", "text/plain"],
      ["email=x", undefined],
    ] as const) {
      const res = await post("/sign-in", body, type);
      expect(res.status, String(type)).toBe(415);
      expect(await res.text()).toMatch(/application\/x-www-form-urlencoded or multipart\/form-data/);
    }
  });

  it("refuses a malformed multipart body with 400", async () => {
    const res = await post(
      "/sign-in",
      '--cut\r\nContent-Disposition: form-data; name="email"\r\n\r\nno end',
      "multipart/form-data; boundary=cut",
    );
    expect(res.status).toBe(400);
  });

  it("refuses a form where the API takes JSON, with a JSON error", async () => {
    const res = await reporter.post("/api/evidence/1/publish", { public: "true" });
    expect(res.status).toBe(415);
    expect((await res.json()).error.code).toBe("unsupported_media_type");
  });
});

describe("ids", () => {
  it("treats an id out of range or written loosely in a path as not found", async () => {
    for (const id of ["2147483648", "99999999999", "0x10", "1e3", "0", "-1", "00012"]) {
      expect((await reporter.get(`/reports/${id}/edit`)).status, id).toBe(404);
      expect((await reporter.get(`/reports/${id}/history`)).status, id).toBe(404);
      expect((await admin.get(`/review/${id}`)).status, id).toBe(404);
    }
  });

  it("refuses a loose id in a field or search param with 400", async () => {
    const target = await db
      .selectFrom("users")
      .select("id")
      .where("email", "like", "refusals-%")
      .orderBy("id", "desc")
      .executeTakeFirstOrThrow();
    for (const userId of ["0x10", "2147483648", "1e1", ` ${target.id}`]) {
      const res = await admin.post("/admin/users", { intent: "grant", userId, role: "moderator" });
      expect(res.status, userId).toBe(400);
    }
    expect((await reporter.get("/me/reports?submitted=0x10")).status).toBe(400);
    expect((await reporter.get("/me/reports?submitted=2147483648")).status).toBe(400);
    const withdraw = await reporter.post("/reports/new", { intent: "withdraw", reportId: "2147483648" });
    expect(withdraw.status).toBe(400);
  });
});

describe("control characters", () => {
  it("refuses NUL in the report form with a field message, keeping what was typed", async () => {
    const res = await reporter.post("/reports/new", {
      ...validReport(),
      notes: "Soaked\u0000 overnight",
      attachment: "fork\u0007",
    });
    expect(res.status).toBe(400);
    const html = await res.text();
    expect(html).toMatch(/Leave out invisible control characters/);
    expect(html).toMatch(/Soaked\\+u0000 overnight/); // the typed value, escaped in the page's data
  });

  it("refuses them in an API key name, a sign-in address and a review note", async () => {
    const key = await reporter.post("/account", { intent: "create-key", name: "bench\u0000key" });
    expect(key.status).toBe(400);
    expect(await key.text()).toMatch(/Leave out invisible control characters/);
    const signIn = await post(
      "/sign-in",
      new URLSearchParams({ email: "a\u0000@b.example" }).toString(),
      "application/x-www-form-urlencoded",
    );
    expect(signIn.status).toBe(400);
    const review = await admin.post("/review/1", {
      action: "return",
      reasonCode: "gauge_unreadable",
      note: "look\u0000",
      version: "1",
      seenDecisions: "0",
    });
    expect(review.status).toBe(400);
    expect(await review.text()).toMatch(/Leave out invisible control characters/);
  });

  it("refuses them in search and feed parameters with 400 and a reason", async () => {
    const search = await fetch(new URL("/search?q=ham%00mer", baseUrl()));
    expect(search.status).toBe(400);
    expect(await search.text()).toMatch(/control characters/);
    const suggest = await fetch(new URL("/api/models/suggest?q=%00", baseUrl()));
    expect(suggest.status).toBe(400);
    expect((await suggest.json()).error.code).toBe("invalid_parameter");
    const feed = await fetch(new URL("/api/v1/reports?model=%00", baseUrl()), {
      headers: { "x-forwarded-for": "203.0.113.250" },
    });
    expect(feed.status).toBe(400);
    expect((await feed.json()).error.parameter).toBe("model");
  });
});
