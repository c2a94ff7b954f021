// The search fake's index: the ranking rules it copies from the hosted service's documented
// defaults (words with the "last" strategy, typo, attribute, exactness) and its typo budget.
import { describe, expect, it } from "vitest";
import { type Doc, SearchEngine, typoBudget } from "../../fakes/search-engine";

const doc = (id: string, title: string, notes = ""): Doc => ({ id, title, notes });
const ids = (docs: Doc[]) => docs.map((d) => d.id);
const all = () => true;

describe("the search fake's ranking", () => {
  const engine = new SearchEngine(
    [
      doc("notes-only", "Ratchet", "breakwater seized"),
      doc("title", "Breakwater BW-3"),
      doc("typo", "Brakewater BW-4"),
      doc("prefix", "Breakwaters BW-5"),
      doc("other", "Quillon QI-1200"),
    ],
    ["title", "notes"],
  );

  it("ranks no typo before a typo, then earlier attributes first, then whole words before prefixes", () => {
    expect(ids(engine.search("breakwater", all, 10))).toEqual(["title", "prefix", "notes-only", "typo"]);
  });

  it("allows one typo from five letters, two from nine, none below (the service's default sizes)", () => {
    expect([typoBudget("bw"), typoBudget("quilo"), typoBudget("breakwatr")]).toEqual([0, 1, 2]);
    expect(ids(engine.search("quilon", all, 10))).toEqual(["other"]);
    expect(ids(engine.search("qi", all, 10))).toEqual(["other"]);
    expect(ids(engine.search("qo", all, 10))).toEqual([]);
  });

  it("counts two swapped neighbouring letters as one typo", () => {
    expect(ids(engine.search("qiullon", all, 10))).toEqual(["other"]);
  });

  it("reads only the last word as a prefix", () => {
    expect(ids(engine.search("breakwat bw", all, 10))).toEqual([]);
    expect(ids(engine.search("bw breakwat", all, 10))).toEqual(["title", "prefix", "typo"]);
  });

  it("drops words from the end only while short of the wanted count", () => {
    expect(ids(engine.search("breakwater seized", all, 1))).toEqual(["notes-only"]);
    expect(ids(engine.search("breakwater seized", all, 3))).toEqual(["notes-only", "title", "prefix", "typo"]);
    expect(ids(engine.search("zzz breakwater", all, 10))).toEqual([]);
  });

  it("applies the filter before ranking, and lists everything for an empty query", () => {
    expect(ids(engine.search("breakwater", (d) => d.id !== "title", 10))).toEqual(["prefix", "notes-only", "typo"]);
    expect(engine.search("  ", all, 2)).toHaveLength(5);
  });
});
