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

function panel(placed: ReturnType<typeof tool>[]) {
  const data = {
    quantity: "peak_force_n",
    intercept: fit.intercept,
    slope: fit.slope,
    ed50: 4000,
    ed50_lower: 3600,
    ed50_upper: 4500,
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
});
