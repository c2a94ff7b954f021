import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { analyseAir, supplyForInlet } from "~/air/analysis";
import { evaluateCalculator } from "~/air/calculator";
import { calculatorSchema, toAirInput, CALCULATOR_DEFAULTS } from "~/air/calculator-form";
import { couplerPressureDropBar } from "~/air/couplers";
import { airDemandLps } from "~/air/demand";
import { demandAt, operatingPoint, tankRunTime, type ToolAir } from "~/air/index";
import { shopLineSegments } from "~/air/shop-line";
import { type Line, lineLossKpa, operatingInletPressure } from "~/air/supply";
import { ATMOSPHERE_KPA, galToL, kpaToPsi, parseMeasure, psiToKpa, RATED_INLET_KPA, scfmToLps } from "~/domain";

const line: Line = { hoseIdMm: 9.525, hoseLengthM: 15.24, couplerProfile: "industrial_m", couplerCount: 2 };

// The first edition's solver: still what the stats refresh corrects regulator readings with.
describe("operating inlet pressure (first edition)", () => {
  it("converges, and its answer satisfies the balance it solves", () => {
    const supply = psiToKpa(100);
    const point = operatingInletPressure(supply, 2.4, line);
    expect(point.converged).toBe(true);
    expect(point.iterations).toBeLessThan(60);
    const loss = lineLossKpa(supply, airDemandLps(2.4, point.inletKpa), line).total;
    expect(Math.abs(supply - loss - point.inletKpa)).toBeLessThan(1e-4);
  });

  it("reports a stalled tool when the line cannot carry its demand", () => {
    const point = operatingInletPressure(psiToKpa(40), 40, { ...line, hoseIdMm: 4, hoseLengthM: 100 });
    expect(point.stalled).toBe(true);
    expect(point.inletKpa).toBe(0);
  });

  it("refuses nonsense", () => {
    expect(() => operatingInletPressure(600, 2, { ...line, hoseLengthM: -1 })).toThrow(/length/);
    expect(() => operatingInletPressure(600, 2, { ...line, hoseIdMm: 0 })).toThrow(/diameter/);
    expect(() => operatingInletPressure(600, 0, line)).toThrow(/consumption/);
    expect(() => operatingInletPressure(-5, 2, line)).toThrow(/supply/);
    expect(() => couplerPressureDropBar("industrial_m", 1.5, 2, 7)).toThrow(/whole number/);
  });

  const bores = fc.double({ min: 4, max: 25, noNaN: true });
  const lengths = fc.double({ min: 0.5, max: 100, noNaN: true });
  const supplies = fc.double({ min: 200, max: 1200, noNaN: true });
  const ratings = fc.double({ min: 0.5, max: 10, noNaN: true });

  it("never rises with a longer hose (property)", () => {
    fc.assert(
      fc.property(supplies, ratings, bores, lengths, lengths, (s, q, d, l1, l2) => {
        const [short, long] = l1 < l2 ? [l1, l2] : [l2, l1];
        const a = operatingInletPressure(s, q, { ...line, hoseIdMm: d, hoseLengthM: short }).inletKpa;
        const b = operatingInletPressure(s, q, { ...line, hoseIdMm: d, hoseLengthM: long }).inletKpa;
        return b <= a + 1e-5;
      }),
    );
  });

  it("never rises with a narrower hose (property)", () => {
    fc.assert(
      fc.property(supplies, ratings, bores, bores, lengths, (s, q, d1, d2, l) => {
        const [narrow, wide] = d1 < d2 ? [d1, d2] : [d2, d1];
        const a = operatingInletPressure(s, q, { ...line, hoseIdMm: wide, hoseLengthM: l }).inletKpa;
        const b = operatingInletPressure(s, q, { ...line, hoseIdMm: narrow, hoseLengthM: l }).inletKpa;
        return b <= a + 1e-5;
      }),
    );
  });

  it("stays between zero and the supply pressure (property)", () => {
    fc.assert(
      fc.property(supplies, ratings, bores, lengths, (s, q, d, l) => {
        const p = operatingInletPressure(s, q, { ...line, hoseIdMm: d, hoseLengthM: l }).inletKpa;
        return p >= 0 && p <= s;
      }),
    );
  });

  it("finds the supply that puts the rating at the running tool (second edition)", () => {
    const tool: ToolAir = { ratedLps: 2.4 };
    const needed = supplyForInlet(RATED_INLET_KPA, line, tool)!;
    expect(operatingPoint(needed, shopLineSegments(needed, line), tool).inletKpa).toBeCloseTo(RATED_INLET_KPA, 2);
    expect(supplyForInlet(RATED_INLET_KPA, { ...line, hoseIdMm: 4, hoseLengthM: 100 }, { ratedLps: 20 })).toBeNull();
  });
});

// Moved from the first edition's tankRunTimeS to tankRunTime: with the regulator holding the
// inlet, the tool's demand is constant and the time-stepped run reduces to the receiver formula.
describe("tank run time at a held inlet", () => {
  const tank = { volumeL: 200, cutOutKpa: psiToKpa(150), cutInKpa: psiToKpa(120) };
  const tool: ToolAir = { ratedLps: 1.2, runningLps: 3, runningSource: "measured" };

  it("matches the receiver formula t = V·Δp / (p_atm · q) above cut-in (common practice)", () => {
    const floor = psiToKpa(130);
    const q = demandAt(3, floor);
    const expected = (200 * (tank.cutOutKpa - floor)) / ATMOSPHERE_KPA / q;
    const r = tankRunTime(tank, { deliveryLps: 1 }, [{ kind: "regulator", setKpa: floor }], tool, {
      minInletKpa: floor,
    });
    expect(r.seconds).toBeCloseTo(expected, 1);
  });

  it("nets off the compressor's delivery below cut-in", () => {
    const floor = psiToKpa(100);
    const q = demandAt(3, floor);
    const held = [{ kind: "regulator" as const, setKpa: floor }];
    const t = tankRunTime(tank, { deliveryLps: 1 }, held, tool, { minInletKpa: floor }).seconds;
    const above = (200 * (tank.cutOutKpa - tank.cutInKpa)) / ATMOSPHERE_KPA / q;
    const below = (200 * (tank.cutInKpa - floor)) / ATMOSPHERE_KPA / (q - 1);
    expect(t).toBeCloseTo(above + below, 1);
    expect(tankRunTime(tank, { deliveryLps: 5 }, held, tool, { minInletKpa: floor }).seconds).toBe(Infinity);
  });

  it("refuses an inverted pressure band", () => {
    expect(() => tankRunTime({ ...tank, cutInKpa: tank.cutOutKpa + 1 }, { deliveryLps: 1 }, [], tool)).toThrow(
      /cut-out/,
    );
  });
});

describe("the /air analysis", () => {
  it("chains the segments from the regulator to the inlet, couplers where they sit", () => {
    const r = analyseAir({
      supplyKpa: psiToKpa(110),
      tool: { ratedLps: scfmToLps(4) },
      line: { ...line, couplerCount: 3, whip: { idMm: 6.35, lengthM: 1 } },
      tank: { volumeL: galToL(60), cutOutKpa: psiToKpa(150), cutInKpa: psiToKpa(120) },
      compressorLps: scfmToLps(10),
    });
    expect(r.segments.map((s) => s.label)).toEqual([
      "Regulator",
      "Coupler 1 (at the regulator)",
      "Hose",
      "Coupler 2 (hose to whip)",
      "Whip hose",
      "Coupler 3 (at the tool)",
    ]);
    r.segments.slice(1).forEach((s, i) => expect(s.inletKpa).toBe(r.segments[i]!.outletKpa));
    expect(r.segments.at(-1)!.outletKpa).toBeCloseTo(r.point.inletKpa, 6);
    expect(r.loss.total).toBeCloseTo(psiToKpa(110) - r.point.inletKpa, 6);
    // The same coupler takes more at the low-pressure end.
    expect(r.segments[5]!.dropKpa).toBeGreaterThan(r.segments[1]!.dropKpa);
  });

  it("says where the running figure came from", () => {
    const estimated = evaluateCalculator(CALCULATOR_DEFAULTS.in, []);
    const typed = evaluateCalculator({ ...CALCULATOR_DEFAULTS.in, run: "9" }, []);
    const picked = evaluateCalculator({ ...CALCULATOR_DEFAULTS.in, tool: "t" }, [
      { slug: "t", label: "T", ratedLps: 2, runningLps: 5, runningSource: "maker_sheet", runningFactor: null },
    ]);
    if (!estimated.ok || !typed.ok || !picked.ok) throw new Error("the defaults must parse");
    expect(estimated.result.point.running).toEqual({ lps: scfmToLps(4) * 2.5, source: "estimated", factor: 2.5 });
    expect(typed.result.point.running.lps).toBeCloseTo(scfmToLps(9), 9);
    expect(picked.result.point.running).toEqual({ lps: 5, source: "maker_sheet", factor: null });
    expect(picked.toolFrom).toBe("catalogue");
  });

  it("gives the default case's figures (this model's own output, pinned: 97.8 psi in the first edition)", () => {
    const r = evaluateCalculator(CALCULATOR_DEFAULTS.in, []);
    if (!r.ok) throw new Error("the defaults must parse");
    expect(kpaToPsi(r.result.point.inletKpa)).toBeCloseTo(91.07, 1);
    expect(kpaToPsi(r.result.loss.hose)).toBeCloseTo(3.0, 1);
    expect(kpaToPsi(r.result.loss.couplers)).toBeCloseTo(5.93, 1);
  });
});

describe("the calculator form", () => {
  it("reads hose sizes the way they are written in the trade", () => {
    expect(parseMeasure("3/8")).toBe(0.375);
    expect(parseMeasure("1 1/4")).toBe(1.25);
    expect(parseMeasure("9,5")).toBe(9.5);
    expect(parseMeasure("abc")).toBeNaN();
  });

  it("turns the imperial defaults into SI and flags the compressor when it is short", () => {
    const form = calculatorSchema.parse({ ...CALCULATOR_DEFAULTS.in, comp: "2", cons: "8" });
    const input = toAirInput(form, null);
    expect(input.tank.volumeL).toBeCloseTo(galToL(60), 6);
    expect(input.line.hoseIdMm).toBeCloseTo(9.525, 6);
    const result = analyseAir(input);
    expect(result.compressorShort).toBe(true);
    expect(result.point.inletKpa).toBeLessThan(input.supplyKpa);
  });

  it("gives field messages for values outside physical sense", () => {
    const r = calculatorSchema.safeParse({ ...CALCULATOR_DEFAULTS.in, hid: "2", hlen: "-5", cin: "200" });
    expect(r.success).toBe(false);
    const paths = r.error!.issues.map((i) => i.path[0]);
    expect(paths).toEqual(expect.arrayContaining(["hid", "hlen", "cin"]));
  });
});
