// The figures derived from a model's stored pooled figures, worked out once for its page and for
// /compare: force per kilogram, per 100 mm of length and per $100 of street price divide the headline
// pooled force and both ends of its interval by the model's figure, taken as exact; the trigger control
// range is its own pooled figure. Each is shown on its own, never added up.
import type { BenchQuantity } from "./terms";

export interface Interval {
  estimate: number;
  lower: number;
  upper: number;
}

/** A stored pooled figure with the series and protocol it belongs to. */
export interface PooledSeriesFigure extends Interval {
  figure: "force" | "trigger_range";
  protocol_id: number;
  label: string;
  trigger: "full" | "lightest_steady";
  inlet: "regulated_at_tool" | "open_line";
  quantity: BenchQuantity;
  runs: number;
  rigs: number;
}

/** What the derived figures are divided by: the model's weight, length and street price. */
export interface ModelMeasures {
  weight_kg: number;
  length_mm: number;
  street_price_cents: number | null;
}

/** A pooled figure with the series it comes from. */
export interface FromSeries extends Interval {
  series: string;
  runs: number;
  rigs: number;
}

export interface DerivedFigures {
  quantity: BenchQuantity;
  /** The headline pooled force the ratios divide. */
  pooled: FromSeries;
  perKg: Interval;
  per100mm: Interval;
  perHundredDollars: Interval | null;
  triggerRange: FromSeries | null;
}

const divided = ({ estimate, lower, upper }: Interval, by: number): Interval => ({
  estimate: estimate / by,
  lower: lower / by,
  upper: upper / by,
});

const fromSeries = (f: PooledSeriesFigure): FromSeries => ({
  estimate: f.estimate,
  lower: f.lower,
  upper: f.upper,
  series: f.label,
  runs: f.runs,
  rigs: f.rigs,
});

/** The headline: full trigger, regulated at the tool, the series with the most runs (the first on a tie). */
export function headlineForce<F extends PooledSeriesFigure>(figures: readonly F[]): F | null {
  let best: F | null = null;
  for (const f of figures) {
    if (f.figure !== "force" || f.trigger !== "full" || f.inlet !== "regulated_at_tool") continue;
    if (!best || f.runs > best.runs) best = f;
  }
  return best;
}

/** The trigger control range beside the headline: regulated at the tool, its protocol first, then the most runs. */
function headlineRange(figures: readonly PooledSeriesFigure[], headline: PooledSeriesFigure) {
  const own = (f: PooledSeriesFigure) => f.protocol_id === headline.protocol_id;
  const better = (a: PooledSeriesFigure, b: PooledSeriesFigure) => (own(a) === own(b) ? a.runs > b.runs : own(a));
  let best: PooledSeriesFigure | null = null;
  for (const f of figures) {
    if (f.figure !== "trigger_range" || f.inlet !== "regulated_at_tool") continue;
    if (!best || better(f, best)) best = f;
  }
  return best;
}

/** The derived figures of one model from its pooled figures; null without a headline force. */
export function derivedFigures(
  figures: readonly PooledSeriesFigure[],
  model: ModelMeasures | null | undefined,
): DerivedFigures | null {
  const headline = headlineForce(figures);
  if (!headline || !model) return null;
  const price = model.street_price_cents;
  const range = headlineRange(figures, headline);
  return {
    quantity: headline.quantity,
    pooled: fromSeries(headline),
    perKg: divided(headline, model.weight_kg),
    per100mm: divided(headline, model.length_mm / 100),
    perHundredDollars: price && price > 0 ? divided(headline, price / 10000) : null,
    triggerRange: range ? fromSeries(range) : null,
  };
}
