import { describe, expect, it } from "vitest";
import { formatDuration, formatHoseId, formatPressure } from "~/domain";

describe("display formats", () => {
  it("shows hose bores in the fractions they are sold in", () => {
    expect(formatHoseId(6.35)).toBe("1/4 in");
    expect(formatHoseId(7.94)).toBe("5/16 in");
    expect(formatHoseId(12.7)).toBe("1/2 in");
    expect(formatHoseId(9.5, "mm")).toBe("9.5 mm");
  });
  it("shows pressures in the reader's unit", () => {
    expect(formatPressure(620.5)).toBe("90 psi");
    expect(formatPressure(620.5, "bar")).toBe("6.2 bar");
    expect(formatPressure(null)).toBe("—");
  });
  it("shows long-tailed times readably", () => {
    expect(formatDuration(45)).toBe("45 s");
    expect(formatDuration(600)).toBe("10 min");
    expect(formatDuration(9000)).toBe("2.5 h");
  });
});
