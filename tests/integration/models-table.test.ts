// The /models table: filters and sort in the URL, over the demo data; bad filters are named, not fatal.
import { afterAll, describe, expect, it } from "vitest";
import { testDb } from "../support/db";
import { Browserish } from "../support/http";

const db = testDb();
afterAll(() => db.destroy());

type Row = {
  slug: string;
  fitting: string;
  weight_kg: number;
  street_price_cents: number;
  reports: number;
  job_lower: number | null;
  category_slug: string;
};
const rows = async (qs: string) => {
  const res = await new Browserish().get(`/api/models?${qs}`);
  expect(res.status).toBe(200);
  return (await res.json()) as { rows: Row[]; ignored: string[] };
};

describe("the tools table", () => {
  it("filters by category, fitting, price and weight", async () => {
    const all = await rows("");
    expect(all.rows.length).toBe(25);
    const hammers = await rows("category=air-hammer&fitting=shank-0.498");
    expect(hammers.rows.length).toBeGreaterThan(0);
    expect(hammers.rows.every((r) => r.category_slug === "air-hammer" && r.fitting === "shank-0.498")).toBe(true);
    const cheapLight = await rows("maxPrice=150&maxWeight=2");
    expect(cheapLight.rows.every((r) => r.street_price_cents <= 15000 && r.weight_kg <= 2)).toBe(true);
  });

  it("sorts by the lower bound of success on a chosen job, and keeps only that job's category", async () => {
    const { rows: list } = await rows("job=lug-nut-breakaway&sort=success&dir=desc");
    const lows = list.map((r) => r.job_lower ?? -1);
    expect(lows).toEqual([...lows].sort((a, b) => b - a));
    expect(list.every((r) => r.category_slug === "impact-wrench")).toBe(true);
  });

  it("sorts by price both ways", async () => {
    const up = (await rows("sort=price&dir=asc")).rows.map((r) => r.street_price_cents);
    expect(up).toEqual([...up].sort((a, b) => a - b));
    const down = (await rows("sort=price&dir=desc")).rows.map((r) => r.street_price_cents);
    expect(down).toEqual([...down].sort((a, b) => b - a));
  });

  it("applies the filters it can read and names the rest", async () => {
    const r = await rows(`maxPrice=-5&fitting=zzz&minReports=abc&category=air-hammer&sort=${"x".repeat(1000)}`);
    expect(r.ignored.sort()).toEqual(["fitting", "maxPrice", "minReports", "sort"]);
    expect(r.rows.every((x) => x.category_slug === "air-hammer")).toBe(true);
    const page = await new Browserish().get("/models?maxPrice=-5");
    expect(page.status).toBe(200);
    expect(await page.text()).toMatch(/Left out filters that could not be read/);
  });
});
