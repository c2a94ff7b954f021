// The best-pick chance and the trade-off front: exact where the answer is known by construction,
// within the simulation's own stated error where it is random (4 standard errors), and properties
// over random inputs (fast-check, fixed seed).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { bestPickChances, type Draw, mulberry32, sampleDraw } from "~/exposure/best-pick";
import { nonDominated } from "~/exposure/trade-offs";

const rate = (successes: number, trials: number): Draw => ({ kind: "beta", successes, trials });
const chanceOf = (r: ReturnType<typeof bestPickChances>, id: string) => r.chances.find((c) => c.id === id)!;

describe("bestPickChances", () => {
  it("two tools whose posteriors do not overlap: 1 and 0", () => {
    // Beta(100.5, 0.5) and Beta(0.5, 100.5) share no mass worth a draw in 4000.
    const r = bestPickChances(
      [
        { id: "sure", criteria: { chance: rate(100, 100) } },
        { id: "never", criteria: { chance: rate(0, 100) } },
      ],
      [{ key: "chance", better: "higher" }],
    );
    expect(chanceOf(r, "sure").chance).toBe(1);
    expect(chanceOf(r, "never").chance).toBe(0);
    expect(r).toMatchObject({ draws: 4000, seed: 1, rule: "lexicographic" });
  });

  it("times on the log scale: a tool whose whole interval is faster always wins on time", () => {
    const r = bestPickChances(
      [
        { id: "fast", criteria: { time: { kind: "interval", estimate: 20, lower: 15, upper: 30, log: true } } },
        { id: "slow", criteria: { time: { kind: "interval", estimate: 200, lower: 150, upper: 300, log: true } } },
      ],
      [{ key: "time", better: "lower" }],
    );
    expect(chanceOf(r, "fast").chance).toBe(1);
  });

  it("identical tools: ½ each within the stated simulation error", () => {
    const same = { chance: rate(12, 20), time: { kind: "interval", estimate: 60, lower: 40, upper: 90, log: true } };
    const r = bestPickChances(
      [
        { id: "a", criteria: same as Record<string, Draw> },
        { id: "b", criteria: same as Record<string, Draw> },
      ],
      [
        { key: "chance", better: "higher", weight: 2 },
        { key: "time", better: "lower", weight: 1 },
      ],
      { draws: 4000, seed: 7 },
    );
    expect(r.rule).toBe("weighted ranks");
    for (const c of r.chances) {
      expect(c.standardError).toBeCloseTo(Math.sqrt(0.25 / 4000), 3);
      expect(Math.abs(c.chance - 0.5)).toBeLessThanOrEqual(4 * c.standardError);
    }
  });

  it("fixed values tie: the tie is split, and the next criterion in the order breaks it", () => {
    const tie = bestPickChances(
      [
        { id: "a", criteria: { weight: { kind: "fixed", value: 2 } } },
        { id: "b", criteria: { weight: { kind: "fixed", value: 2 } } },
      ],
      [{ key: "weight", better: "lower" }],
      { draws: 10 },
    );
    expect(tie.chances.map((c) => c.chance)).toEqual([0.5, 0.5]);
    const broken = bestPickChances(
      [
        { id: "a", criteria: { weight: { kind: "fixed", value: 2 }, price: { kind: "fixed", value: 300 } } },
        { id: "b", criteria: { weight: { kind: "fixed", value: 2 }, price: { kind: "fixed", value: 200 } } },
      ],
      [
        { key: "weight", better: "lower" },
        { key: "price", better: "lower" },
      ],
      { draws: 10 },
    );
    expect(chanceOf(broken, "b").chance).toBe(1);
  });

  it("weighted ranks, worked by hand: the heavy, sure tool against the light, doubtful one", () => {
    // a: rank 1 on chance, 2 on weight; b: 2 and 1. Weights 3 (chance) and 1 (weight):
    // a scores 3·1 + 1·2 = 5, b scores 3·2 + 1·1 = 7 → a. Weights 1 and 3: a 1 + 6 = 7, b 2 + 3 = 5 → b.
    const tools = [
      { id: "a", criteria: { chance: { kind: "fixed", value: 0.9 }, weight: { kind: "fixed", value: 3.4 } } },
      { id: "b", criteria: { chance: { kind: "fixed", value: 0.6 }, weight: { kind: "fixed", value: 1.8 } } },
    ] satisfies { id: string; criteria: Record<string, Draw> }[];
    const sure = bestPickChances(tools, [
      { key: "chance", better: "higher", weight: 3 },
      { key: "weight", better: "lower", weight: 1 },
    ]);
    expect(chanceOf(sure, "a").chance).toBe(1);
    const light = bestPickChances(tools, [
      { key: "chance", better: "higher", weight: 1 },
      { key: "weight", better: "lower", weight: 3 },
    ]);
    expect(chanceOf(light, "b").chance).toBe(1);
  });

  it("the same seed gives the same answer; another seed may differ only within the error", () => {
    const tools = [
      { id: "a", criteria: { chance: rate(8, 12) } },
      { id: "b", criteria: { chance: rate(9, 15) } },
      { id: "c", criteria: { chance: rate(3, 5) } },
    ];
    const order = [{ key: "chance", better: "higher" as const }];
    const one = bestPickChances(tools, order, { draws: 2000, seed: 42 });
    expect(bestPickChances(tools, order, { draws: 2000, seed: 42 })).toEqual(one);
    const other = bestPickChances(tools, order, { draws: 2000, seed: 43 });
    one.chances.forEach((c, i) => {
      const se = Math.hypot(c.standardError, other.chances[i]!.standardError);
      expect(Math.abs(c.chance - other.chances[i]!.chance)).toBeLessThanOrEqual(4 * se + 1e-12);
    });
  });

  it("property: the chances sum to 1 and each lies in [0, 1]", () => {
    const draw: fc.Arbitrary<Draw> = fc.oneof(
      fc
        .tuple(fc.integer({ min: 0, max: 40 }), fc.integer({ min: 0, max: 40 }))
        .map(([s, f]) => ({ kind: "beta" as const, successes: s, trials: s + f })),
      fc
        .tuple(fc.double({ min: 1, max: 500, noNaN: true }), fc.double({ min: 1, max: 3, noNaN: true }))
        .map(([e, k]) => ({ kind: "interval" as const, estimate: e, lower: e / k, upper: e * k, log: true })),
      fc.integer({ min: 1, max: 5 }).map((v) => ({ kind: "fixed" as const, value: v })),
    );
    fc.assert(
      fc.property(
        fc.array(fc.tuple(draw, draw), { minLength: 1, maxLength: 6 }),
        fc.boolean(),
        fc.integer({ min: 1, max: 2 ** 31 }),
        (tools, weighted, seed) => {
          const r = bestPickChances(
            tools.map(([x, y], i) => ({ id: `t${i}`, criteria: { x, y } })),
            [
              { key: "x", better: "higher", ...(weighted ? { weight: 2 } : {}) },
              { key: "y", better: "lower", ...(weighted ? { weight: 1 } : {}) },
            ],
            { draws: 200, seed },
          );
          const sum = r.chances.reduce((a, c) => a + c.chance, 0);
          expect(sum).toBeCloseTo(1, 9);
          for (const c of r.chances) expect(c.chance).toBeGreaterThanOrEqual(0);
        },
      ),
      { seed: 21, numRuns: 60 },
    );
  });

  it("refuses a question it cannot answer", () => {
    expect(() => bestPickChances([], [])).toThrow(RangeError);
    expect(() => bestPickChances([{ id: "a", criteria: {} }], [{ key: "x", better: "higher" }])).toThrow(/no value/);
    expect(() => bestPickChances([], [{ key: "x", better: "higher" }], { draws: 0 })).toThrow(RangeError);
  });
});

describe("sampleDraw", () => {
  it("Jeffreys Beta(s + ½, f + ½): the mean of many draws is (s + ½) / (n + 1)", () => {
    const rand = mulberry32(3);
    let sum = 0;
    const n = 20000;
    for (let i = 0; i < n; i++) sum += sampleDraw(rate(3, 10), rand);
    // Mean of Beta(3.5, 7.5) = 3.5 / 11 (recomputed); sd ≈ 0.134, so the mean of 20,000 is good to ±0.004.
    expect(Math.abs(sum / n - 3.5 / 11)).toBeLessThan(0.004);
  });

  it("an interval on the log scale: half the draws fall below the estimate, about 2.5 % below the lower end", () => {
    const rand = mulberry32(5);
    const d: Draw = { kind: "interval", estimate: 60, lower: 30, upper: 180, log: true };
    const xs = Array.from({ length: 20000 }, () => sampleDraw(d, rand));
    const below = (x: number) => xs.filter((v) => v < x).length / xs.length;
    expect(Math.abs(below(60) - 0.5)).toBeLessThan(0.015);
    expect(Math.abs(below(30) - 0.025)).toBeLessThan(0.006);
    expect(Math.abs(below(180) - 0.975)).toBeLessThan(0.006);
  });
});

describe("nonDominated", () => {
  it("the front of a hand-worked example: chance (higher) against weight (lower)", () => {
    // C is beaten by B (likelier and lighter), D by A (as likely, lighter); A, B, E each win somewhere.
    const items = [
      { id: "A", values: { chance: 0.8, weight: 3 } },
      { id: "B", values: { chance: 0.7, weight: 2 } },
      { id: "C", values: { chance: 0.6, weight: 2.5 } },
      { id: "D", values: { chance: 0.8, weight: 3.5 } },
      { id: "E", values: { chance: 0.5, weight: 1.5 } },
    ];
    const criteria = [
      { key: "chance", better: "higher" as const },
      { key: "weight", better: "lower" as const },
    ];
    expect(nonDominated(items, criteria)).toEqual(["A", "B", "E"]);
    // On chance alone, A and D tie at the top: neither beats the other.
    expect(nonDominated(items, [criteria[0]!])).toEqual(["A", "D"]);
    // Equal on everything: neither dominates.
    expect(nonDominated([items[0]!, { ...items[0]!, id: "A2" }], criteria)).toEqual(["A", "A2"]);
    // A missing value counts as the worst.
    expect(nonDominated([{ id: "x", values: { chance: null, weight: 2 } }, items[4]!], criteria)).toEqual(["E"]);
  });
});
