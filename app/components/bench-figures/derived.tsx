// A derived bench figure (force per kg, per 100 mm, per $100) in the reader's unit, for the model page
// and /compare alike. Three significant figures: a ratio of a pooled force warrants no more.
import { benchUnit, type BenchQuantity } from "~/bench/terms";
import type { Interval } from "~/bench/derived-figures";
import type { Units } from "~/domain";

/** The estimate and both ends of its interval, in the reader's force or torque unit. */
export function derivedParts(v: Interval, q: BenchQuantity, units: Units) {
  const { label, perSi } = benchUnit(q, units);
  const round = (x: number) => String(Number((x * perSi).toPrecision(3)));
  return { unit: label, estimate: round(v.estimate), lower: round(v.lower), upper: round(v.upper) };
}

/** The estimate, then its interval in small type (the heading names the unit). */
export function DerivedValue({ v, q, units }: { v: Interval; q: BenchQuantity; units: Units }) {
  const p = derivedParts(v, q, units);
  return (
    <>
      {p.estimate}{" "}
      <span className="text-xs text-stone-600">
        ({p.lower} to {p.upper})
      </span>
    </>
  );
}
