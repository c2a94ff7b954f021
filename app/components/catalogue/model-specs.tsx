import type { getModelBySlug } from "~/catalogue/queries.server";
import {
  type Units,
  FITTING_LABELS,
  formatFlow,
  formatLength,
  formatPressure,
  formatPrice,
  formatTorque,
  formatWeight,
  RATED_INLET_KPA,
} from "~/domain";
import { Card } from "~/components/ui";

type Model = NonNullable<Awaited<ReturnType<typeof getModelBySlug>>>;

/** A model's catalogue figures, each with where it comes from (maker sheet, measured, typical). */
export function ModelSpecs({ model, units }: { model: Model; units: Units }) {
  const measured = new Set(model.measured_specs);
  const spec = (label: string, field: string, value: string | null) =>
    value == null ? null : { label, value, source: measured.has(field) ? "measured" : "maker sheet" };
  const specs = [
    { label: "Fitting", value: FITTING_LABELS[model.fitting] ?? model.fitting, source: "maker sheet" },
    spec("Bore", "bore_mm", model.bore_mm == null ? null : formatLength(model.bore_mm, units)),
    spec("Stroke", "stroke_mm", model.stroke_mm == null ? null : formatLength(model.stroke_mm, units)),
    spec("Blows per minute", "blows_per_minute", model.blows_per_minute?.toLocaleString("en-US") ?? null),
    spec(
      "Free speed",
      "free_speed_rpm",
      model.free_speed_rpm == null ? null : `${model.free_speed_rpm.toLocaleString("en-US")} rpm`,
    ),
    spec(
      "Maker's max torque",
      "max_torque_nm",
      model.max_torque_nm == null ? null : formatTorque(model.max_torque_nm, units),
    ),
    spec("Weight", "weight_kg", formatWeight(model.weight_kg, units)),
    spec("Length", "length_mm", formatLength(model.length_mm, units)),
    spec(
      "Rated air use",
      "rated_air_lps",
      `${formatFlow(model.rated_air_lps, units)} at ${formatPressure(RATED_INLET_KPA, units)}`,
    ),
    { label: "Air inlet", value: model.air_inlet, source: "maker sheet" },
    { label: "Maximum inlet pressure", value: formatPressure(model.max_inlet_kpa, units), source: "maker sheet" },
    { label: "Street price", value: formatPrice(model.street_price_cents), source: "typical" },
  ].filter((s) => s != null);

  return (
    <Card as="section" aria-labelledby="specs-heading">
      <h2 id="specs-heading" className="mb-2 font-semibold">
        Specifications
      </h2>
      <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-2">
        {specs.map((s) => (
          <div key={s.label} className="flex justify-between gap-3 border-b border-stone-100 py-1 text-sm">
            <dt className="text-stone-600">{s.label}</dt>
            <dd className="text-right">
              {s.value} <span className="text-xs text-stone-600">({s.source})</span>
            </dd>
          </div>
        ))}
      </dl>
    </Card>
  );
}
