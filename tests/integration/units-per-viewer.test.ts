// One unit system per viewer (issue 18): a visitor's default from Accept-Language, the choice
// remembered (a cookie for visitors, the account for users), every figure of a row in that system,
// and the units a report was typed in kept beside its SI values.
import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { testDb } from "../support/db";
import { Browserish, signedInAs } from "../support/http";

const db = testDb();
afterAll(() => db.destroy());

const GERMAN = { "accept-language": "de-DE,de;q=0.9,en;q=0.8" };
const AMERICAN = { "accept-language": "en-US,en;q=0.9" };
let modelPage = "/models";

beforeAll(async () => {
  // A model with accepted reports that name a hose, so its rows carry a bore and a length.
  const row = await db
    .selectFrom("reports as r")
    .innerJoin("tool_models as m", "m.id", "r.tool_model_id")
    .select("m.slug")
    .where("r.status", "=", "accepted")
    .where("r.hose_id_mm", "is not", null)
    .where("r.hose_length_m", "is not", null)
    .groupBy("m.slug")
    .orderBy(sql`count(*)`, "desc")
    .limit(1)
    .executeTakeFirstOrThrow();
  modelPage = `/models/${row.slug}`;
});

/** Which system the page's footer switch marks as chosen. */
const chosen = (html: string) => html.match(/value="(us|metric)" aria-pressed="true"/)?.[1];
// React separates the text parts of a cell with empty comments in server-rendered HTML.
const US_HOSE = /\d+(?: \d+)?(?:\/\d+)? in(?:<!-- -->)? × (?:<!-- -->)?\d+ ft/;
const METRIC_HOSE = /\d+\.\d mm(?:<!-- -->)? × (?:<!-- -->)?\d+(?:\.\d)? m</;

describe("a visitor's units", () => {
  it("reads metric for de-DE and US customary for en-US, a whole row in one system", async () => {
    const german = await (await new Browserish().get(modelPage, GERMAN)).text();
    expect(chosen(german)).toBe("metric");
    expect(german).toMatch(METRIC_HOSE);
    expect(german).not.toMatch(US_HOSE);

    const american = await (await new Browserish().get(modelPage, AMERICAN)).text();
    expect(chosen(american)).toBe("us");
    expect(american).toMatch(US_HOSE);
    expect(american).not.toMatch(METRIC_HOSE);
  });

  it("remembers a switch in a cookie, over the browser's language, and returns to the same page", async () => {
    const visitor = new Browserish();
    const res = await visitor.post("/units", { system: "us", back: modelPage }, { origin: visitor.origin, ...GERMAN });
    expect(res.status).toBe(303);
    expect(res.headers.get("location")).toBe(modelPage);
    const page = await (await visitor.get(modelPage, GERMAN)).text();
    expect(chosen(page)).toBe("us");
    expect(page).toMatch(US_HOSE);
  });

  it("answers a bad choice with a 400 and a reason, and never leaves the site", async () => {
    const visitor = new Browserish();
    const bad = await visitor.post("/units", { system: "imperial" });
    expect(bad.status).toBe(400);
    expect(await bad.text()).toMatch(/US customary|metric/);
    const away = await visitor.post("/units", { system: "metric", back: "https://elsewhere.example/" });
    expect(away.status).toBe(303);
    expect(away.headers.get("location")).toBe("/");
  });
});

describe("a signed-in user's units", () => {
  it("keeps the choice on the account, whatever the browser's language", async () => {
    const stamp = `${Date.now() % 1e8}`;
    const email = `units-${stamp}@demo.bayproof.test`;
    await db
      .insertInto("users")
      .values({ email, handle: `units-${stamp}` })
      .execute();
    const user = await signedInAs(db, email);
    expect(chosen(await (await user.get(modelPage, GERMAN)).text())).toBe("us"); // the account's default

    expect((await user.post("/units", { system: "metric", back: modelPage })).status).toBe(303);
    const row = await db
      .selectFrom("users")
      .select(["pressure_unit", "length_unit", "force_unit"])
      .where("email", "=", email)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({ pressure_unit: "kPa", length_unit: "mm", force_unit: "N" });
    const page = await (await user.get(modelPage, AMERICAN)).text();
    expect(chosen(page)).toBe("metric");
    expect(page).toMatch(METRIC_HOSE);
  });

  it("is one system in the database: a row mixing them is refused", async () => {
    await expect(
      db.transaction().execute(async (trx) => {
        await trx
          .insertInto("users")
          .values({
            email: `mixed-${Date.now()}@demo.bayproof.test`,
            handle: `mixed-${Date.now() % 1e8}`,
            length_unit: "mm",
            pressure_unit: "psi",
          })
          .execute();
      }),
    ).rejects.toThrow(/users_one_unit_system/);
  });
});

describe("a report keeps the units it was typed in", () => {
  it("stores SI and the reporter's units, so a moderator reads 3/8 in as entered", async () => {
    const reporter = await signedInAs(db, "reporter@demo.bayproof.test");
    const res = await reporter.post("/reports/new", {
      intent: "save-draft",
      pu: "psi",
      lu: "in",
      toolModel: "brackwater-bh-150",
      jobType: "tie-rod-end-release",
      hoseId: "3/8",
      hoseLength: "25",
    });
    expect(res.status).toBe(302);
    const id = Number(res.headers.get("location")!.match(/\/reports\/(\d+)\/edit/)![1]);
    try {
      const row = await db
        .selectFrom("reports")
        .select(["hose_id_mm", "hose_length_m", "entered_length_unit", "entered_pressure_unit"])
        .where("id", "=", id)
        .executeTakeFirstOrThrow();
      // 3/8 in = 9.525 mm and 25 ft = 7.62 m exactly (1 in = 25.4 mm, 1 ft = 0.3048 m; NIST SP 811)
      expect(row.hose_id_mm).toBeCloseTo(9.525, 2);
      expect(row.hose_length_m).toBeCloseTo(7.62, 6);
      expect(row).toMatchObject({ entered_length_unit: "in", entered_pressure_unit: "psi" });
    } finally {
      await db.deleteFrom("reports").where("id", "=", id).execute();
    }
  });
});
