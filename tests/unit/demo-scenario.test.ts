import { describe, expect, it } from "vitest";
import { categories, jobTypes, makers, models } from "../../seeds/catalogue";
import { people, shops } from "../../seeds/people";
import { generateReports } from "../../seeds/reports";

const reports = generateReports();

describe("the demo scenario", () => {
  it("is deterministic", () => {
    expect(generateReports()).toEqual(reports);
  });

  it("has the size the product needs", () => {
    expect(makers.length).toBeGreaterThanOrEqual(5);
    expect(models.length).toBeGreaterThanOrEqual(24);
    expect(categories.length).toBeGreaterThanOrEqual(3);
    expect(jobTypes.length).toBe(14);
    expect(shops.length).toBe(8);
    expect(people.filter((p) => p.roles.length === 0)).toHaveLength(40);
    expect(people.filter((p) => p.roles.includes("moderator") && !p.roles.includes("admin"))).toHaveLength(3);
    expect(people.filter((p) => p.roles.includes("admin"))).toHaveLength(1);
    expect(reports.length).toBeGreaterThanOrEqual(3000);
  });

  it("covers both hammer shanks, 1/2 and 3/4 in impacts and ratchets", () => {
    const fittings = new Set(models.map((m) => `${m.category}:${m.fitting}`));
    for (const f of [
      "air-hammer:shank-0.401",
      "air-hammer:shank-0.498",
      "impact-wrench:drive-1/2",
      "impact-wrench:drive-3/4",
    ]) {
      expect(fittings).toContain(f);
    }
    expect(models.some((m) => m.category === "air-ratchet")).toBe(true);
  });

  it("uses only reserved test addresses (RFC 2606)", () => {
    for (const p of people) expect(p.email).toMatch(/@demo\.bayproof\.test$/);
  });

  it("spreads reports unevenly: popular pairs with 40–100, a tail with a handful", () => {
    const counts = new Map<string, number>();
    for (const r of reports)
      counts.set(`${r.modelIndex}:${r.jobIndex}`, (counts.get(`${r.modelIndex}:${r.jobIndex}`) ?? 0) + 1);
    const values = [...counts.values()];
    expect(Math.max(...values)).toBeLessThanOrEqual(110);
    expect(values.filter((n) => n >= 40).length).toBeGreaterThanOrEqual(10);
    expect(values.filter((n) => n <= 8).length).toBeGreaterThanOrEqual(20);
  });

  it("makes success rise with inlet pressure on seized jobs", () => {
    const seized = reports.filter((r) => jobTypes[r.jobIndex]!.seized && r.inletSource === "measured_at_inlet");
    const rate = (list: typeof seized) => list.filter((r) => r.outcome === "freed").length / list.length;
    const low = seized.filter((r) => r.inletKpa < 580);
    const high = seized.filter((r) => r.inletKpa > 700);
    expect(low.length).toBeGreaterThan(30);
    expect(high.length).toBeGreaterThan(30);
    expect(rate(high)).toBeGreaterThan(rate(low));
  });

  it("has long-tailed times and varied supplies", () => {
    const times = reports.map((r) => r.timeS).sort((a, b) => a - b);
    const median = times[Math.floor(times.length / 2)]!;
    const mean = times.reduce((s, t) => s + t, 0) / times.length;
    expect(mean).toBeGreaterThan(median * 1.3);
    const hoses = new Set(reports.map((r) => r.hoseIdMm));
    expect(Math.min(...hoses)).toBeCloseTo(6.35, 1); // 1/4 in
    expect(Math.max(...hoses)).toBeCloseTo(12.7, 1); // 1/2 in
    expect(new Set(reports.map((r) => r.couplerProfile)).size).toBeGreaterThanOrEqual(3);
  });
});
