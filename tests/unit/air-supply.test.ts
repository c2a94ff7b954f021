import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { calculatorSchema, toSupplyInput, CALCULATOR_DEFAULTS } from "~/air/calculator-form";
import { couplerPressureDropBar } from "~/air/couplers";
import { airDemandLps } from "~/air/demand";
import { analyseSupply, type Line, lineLossKpa, operatingInletPressure, supplyNeededKpa, tankRunTimeS } from "~/air/supply";
import { ATMOSPHERE_KPA, galToL, parseMeasure, psiToKpa, RATED_INLET_KPA } from "~/domain";

const line: Line = { hoseIdMm: 9.525, hoseLengthM: 15.24, couplerProfile: "industrial_m", couplerCount: 2 };

describe("operating inlet pressure", () => {
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
    fc.assert(fc.property(supplies, ratings, bores, lengths, lengths, (s, q, d, l1, l2) => {
      const [short, long] = l1 < l2 ? [l1, l2] : [l2, l1];
      const a = operatingInletPressure(s, q, { ...line, hoseIdMm: d, hoseLengthM: short }).inletKpa;
      const b = operatingInletPressure(s, q, { ...line, hoseIdMm: d, hoseLengthM: long }).inletKpa;
      return b <= a + 1e-5;
    }));
  });

  it("never rises with a narrower hose (property)", () => {
    fc.assert(fc.property(supplies, ratings, bores, bores, lengths, (s, q, d1, d2, l) => {
      const [narrow, wide] = d1 < d2 ? [d1, d2] : [d2, d1];
      const a = operatingInletPressure(s, q, { ...line, hoseIdMm: wide, hoseLengthM: l }).inletKpa;
      const b = operatingInletPressure(s, q, { ...line, hoseIdMm: narrow, hoseLengthM: l }).inletKpa;
      return b <= a + 1e-5;
    }));
  });

  it("stays between zero and the supply pressure (property)", () => {
    fc.assert(fc.property(supplies, ratings, bores, lengths, (s, q, d, l) => {
      const p = operatingInletPressure(s, q, { ...line, hoseIdMm: d, hoseLengthM: l }).inletKpa;
      return p >= 0 && p <= s;
    }));
  });

  it("finds the supply that puts the rating at the tool", () => {
    const needed = supplyNeededKpa(RATED_INLET_KPA, 2.4, line);
    expect(operatingInletPressure(needed, 2.4, line).inletKpa).toBeCloseTo(RATED_INLET_KPA, 1);
  });
});

describe("tank run time", () => {
  const tank = { volumeL: 200, cutOutKpa: psiToKpa(150), cutInKpa: psiToKpa(120), compressorLps: 1 };

  it("matches the receiver formula t = V·Δp / (p_atm · q) above cut-in (common practice)", () => {
    const floor = psiToKpa(130);
    const expected = (200 * (tank.cutOutKpa - floor)) / ATMOSPHERE_KPA / 3;
    expect(tankRunTimeS(tank, 3, floor)).toBeCloseTo(expected, 6);
  });

  it("nets off the compressor's delivery below cut-in", () => {
    const floor = psiToKpa(100);
    const t = tankRunTimeS(tank, 3, floor);
    const above = (200 * (tank.cutOutKpa - tank.cutInKpa)) / ATMOSPHERE_KPA / 3;
    const below = (200 * (tank.cutInKpa - floor)) / ATMOSPHERE_KPA / (3 - 1);
    expect(t).toBeCloseTo(above + below, 6);
    expect(tankRunTimeS({ ...tank, compressorLps: 5 }, 3, floor)).toBe(Infinity);
  });

  it("refuses an inverted pressure band", () => {
    expect(() => tankRunTimeS({ ...tank, cutInKpa: tank.cutOutKpa + 1 }, 3, 0)).toThrow(/cut-out/);
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
    const input = toSupplyInput(form, null);
    expect(input.tank.volumeL).toBeCloseTo(galToL(60), 6);
    expect(input.line.hoseIdMm).toBeCloseTo(9.525, 6);
    const result = analyseSupply(input);
    expect(result.compressorShort).toBe(true);
    expect(result.inletKpa).toBeLessThan(input.supplyKpa);
  });

  it("gives field messages for values outside physical sense", () => {
    const r = calculatorSchema.safeParse({ ...CALCULATOR_DEFAULTS.in, hid: "2", hlen: "-5", cin: "200" });
    expect(r.success).toBe(false);
    const paths = r.error!.issues.map((i) => i.path[0]);
    expect(paths).toEqual(expect.arrayContaining(["hid", "hlen", "cin"]));
  });
});
