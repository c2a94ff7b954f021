// Search through the meilisearch SDK against the local fake, the PostgreSQL fallback, the pages,
// and indexing after an accept.
import { createServer, type RequestListener } from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, describe, expect, inject, it } from "vitest";
import { BREAK_AFTER, INDEX, search, searchClient } from "../../app/search/search.server";
import { testDb } from "../support/db";
import { Browserish } from "../support/http";

const db = testDb();
const client = searchClient(inject("searchUrl"));
afterAll(() => db.destroy());

describe("the search service fake, through the SDK", () => {
  it("is healthy and finds a model despite a typo, with facets", async () => {
    expect((await client.health()).status).toBe("available");
    const r = await search(db, "quilon", { kind: "model" }, 10, client);
    expect(r.source).toBe("search");
    expect(r.hits.map((h) => h.title)).toEqual(
      expect.arrayContaining(["Quillon Air Tools QH-3", "Quillon Air Tools QI-1200"]),
    );
    expect(Object.keys(r.facets)).toEqual(expect.arrayContaining(["category", "job", "shank"]));
    const reports = await search(db, "tie rod", { kind: "report" }, 5, client);
    expect(reports.hits.every((h) => h.kind === "report" && h.job_name === "Tie rod end release")).toBe(true);
  });

  it("filters by facet", async () => {
    const r = await search(db, "ball joint", { category: "air-hammer", shank: "shank-0.498" }, 30, client);
    expect(r.hits.length).toBeGreaterThan(0);
    expect(r.hits.every((h) => h.shank === "shank-0.498")).toBe(true);
  });

  it("refuses a filter on an attribute that is not filterable, as the service does", async () => {
    await expect(client.index(INDEX).search("x", { filter: ["notes = 'a'"] })).rejects.toThrow(/not filterable/);
  });
});

describe("when the search service is down", () => {
  it("falls back to PostgreSQL and says so", async () => {
    const r = await search(db, "quillon qh", {}, 10, searchClient("http://127.0.0.1:9"));
    expect(r.source).toBe("database");
    expect(r.hits.map((h) => h.title)).toContain("Quillon Air Tools QH-3");
  });
});

/** A stand-in service on a free port that answers every request with `handler`. */
async function fakeService(handler: RequestListener) {
  const server = createServer(handler);
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  return {
    url: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    close: () => new Promise((r) => server.close(r)),
  };
}

describe("when the search service is slow or failing", () => {
  it("waits for a slow answer instead of calling the service down", async () => {
    const slow = await fakeService((_req, res) => {
      // Slower than the 800 ms the client used to allow, well inside the present timeout.
      setTimeout(() => {
        res.setHeader("Content-Type", "application/json");
        res.end(
          JSON.stringify({
            hits: [{ id: "model-slow", kind: "model", title: "Slow answer", url: "/models/slow" }],
            estimatedTotalHits: 1,
            facetDistribution: {},
          }),
        );
      }, 1500);
    });
    try {
      const r = await search(db, "anything", {}, 5, searchClient(slow.url));
      expect(r.source).toBe("search");
      expect(r.hits[0]?.title).toBe("Slow answer");
    } finally {
      await slow.close();
    }
  });

  it("stops asking a failing service after a few failures in a row and answers from PostgreSQL", async () => {
    let asked = 0;
    const failing = await fakeService((_req, res) => {
      asked += 1;
      res.statusCode = 500;
      res.setHeader("Content-Type", "application/json");
      res.end(JSON.stringify({ message: "internal", code: "internal", type: "internal", link: "" }));
    });
    try {
      const client = searchClient(failing.url);
      for (let i = 0; i < BREAK_AFTER + 2; i++) {
        const r = await search(db, "quillon qh", {}, 5, client);
        expect(r.source).toBe("database");
      }
      expect(asked).toBe(BREAK_AFTER);
    } finally {
      await failing.close();
    }
  });
});

describe("the search pages", () => {
  it("answers suggestions and full results, and names what it could not read", async () => {
    const s = await (await new Browserish().get("/api/search?q=brakwater")).json();
    expect(s.hits.length).toBeGreaterThan(0);
    const titles = s.hits.map((h: { title: string; url: string }) => h.title + h.url);
    expect(new Set(titles).size).toBe(titles.length);
    const page = await new Browserish().get(`/search?q=${"quilon ".repeat(200)}&job=%3Cb%3E`);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toMatch(/cut to 200 characters/);
    expect(html).toMatch(/Left out what could not be read: job/);
  });
});

describe("indexing after an accept", () => {
  it("puts a newly accepted report in the index through the worker", async () => {
    // The newest report accepted by a moderator's decision (the feed tests add accepted rows directly).
    const accepted = await db
      .selectFrom("reports as r")
      .select("r.id")
      .where("r.status", "=", "accepted")
      .where((eb) =>
        eb.exists(
          eb
            .selectFrom("decisions as d")
            .select("d.id")
            .whereRef("d.report_id", "=", "r.id")
            .where("d.action", "=", "accept"),
        ),
      )
      .orderBy("r.accepted_at", "desc")
      .executeTakeFirstOrThrow();
    // Fresh accepts from the moderation tests enqueue indexing; the demo's own were indexed at start.
    const deadline = Date.now() + 60_000;
    let found = false;
    while (!found && Date.now() < deadline) {
      found = await client
        .index(INDEX)
        .getDocument(`report-${accepted.id}`)
        .then(
          () => true,
          () => false,
        );
      if (!found) await new Promise((r) => setTimeout(r, 300));
    }
    expect(found).toBe(true);
  });
});
