// The force a job takes, as the job page draws it: a tool without bench data is placed from its field
// reports only and the figure says so; with every tool on the bench, it says nothing of the kind. The
// demo has bench runs for every hammer, so the note is checked here on invented figures.
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { MemoryRouter } from "react-router";
import { describe, expect, it } from "vitest";
import type { JobForce } from "~/bench/figures-read.server";
import { forceCurve } from "~/bench";
import type { LogisticFit } from "~/stats";
import { ForceCurvePanel } from "~/components/bench-figures/force-curve";
import { unitsOf } from "~/domain";

const fit: LogisticFit = {
  intercept: -4,
  slope: 0.001,
  interceptSE: 0.5,
  slopeSE: 0.0001,
  covariance: [
    [0.25, -0.00004],
    [-0.00004, 1e-8],
  ],
  converged: true,
  iterations: 0,
};

const tool = (id: number, force: number, placedFrom: "bench" | "field") => ({
  id,
  slug: `tool-${id}`,
  model_code: `T-${id}`,
  maker_name: "Invented Works",
  estimate: 0.5,
  n: 12,
  force,
  placedFrom,
});

function panel(placed: ReturnType<typeof tool>[], figures: Record<string, number> = {}) {
  const data = {
    quantity: "peak_force_n",
    intercept: fit.intercept,
    slope: fit.slope,
    ed50: 4000,
    ed50_lower: 3600,
    ed50_upper: 4500,
    force_min: 2500,
    force_max: 5500,
    ...figures,
    method: "Fieller",
    firth: false,
    reports: 60,
    models: 3,
    curve: forceCurve(fit, 2000, 6000, 10),
    placed,
  } as unknown as JobForce;
  return renderToStaticMarkup(
    createElement(MemoryRouter, null, createElement(ForceCurvePanel, { data, units: unitsOf("metric") })),
  );
}

describe("the force a job takes", () => {
  it("says so where a tool is placed from its field reports only", () => {
    const html = panel([tool(1, 3000, "bench"), tool(2, 4200, "field")]);
    expect(html).toContain("Open dots: no bench data; placed from their field reports only.");
    expect(html).toContain("from field reports only, no bench data");
    expect(html).toContain("(95 % interval 3600 N to 4500 N)");
  });

  it("says nothing of the kind when every tool has bench data", () => {
    const html = panel([tool(1, 3000, "bench"), tool(2, 4200, "bench")]);
    expect(html).not.toContain("field reports only");
  });

  it("gives no half-way force outside the bench forces on record, and says where it lies", () => {
    const below = panel([tool(1, 3000, "bench")], { ed50: -1200, ed50_lower: -18000, ed50_upper: 2700 });
    expect(below).toContain("lies below every bench force on record, so it is not given");
    expect(below).not.toContain("-1200");
    const above = panel([tool(1, 3000, "bench")], { ed50: 9000, ed50_lower: 6000, ed50_upper: 20000 });
    expect(above).toContain("lies above every bench force on record, so it is not given");
    const wide = panel([tool(1, 3000, "bench")], { ed50: 3000, ed50_lower: -500, ed50_upper: 7000 });
    expect(wide).toContain("(95 % interval from under 2500 N to over 5500 N)");
  });
});
