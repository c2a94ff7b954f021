// A protocol version as declared: what is measured, how long a trial is, the bit, warm-up and
// oiling, and its series in order.
import { Link } from "react-router";
import { INLET_LABELS, QUANTITY_LABELS, TRIGGER_LABELS } from "~/bench/terms";
import type { ProtocolSeries } from "~/bench/protocols.server";
import { COUPLER_LABELS, formatDate, formatHoseId, formatHoseLength, formatPressure, type Units } from "~/domain";
import { Card } from "../ui";

interface ProtocolView {
  slug: string;
  version: number;
  title: string;
  quantity: "peak_force_n" | "peak_torque_nm";
  category_name: string;
  trials_per_series: number;
  blows_per_trial: number | null;
  seconds_per_trial: number | null;
  blows_discarded: number;
  attachment: string;
  warm_up: string;
  oiling: string;
  summary: string;
  frozen_at: Date | string | null;
  accepted_runs: number;
  series: ProtocolSeries[];
}

export function SeriesLine({ s, units }: { s: ProtocolSeries; units: Units }) {
  return (
    <>
      <span className="font-medium">{s.label}</span>
      <span className="block text-xs text-stone-600">
        {TRIGGER_LABELS[s.trigger]} · {INLET_LABELS[s.inlet]} {s.inlet === "open_line" ? "set to " : "at "}
        {formatPressure(s.inlet_kpa, units)}
        {s.inlet === "open_line" &&
          ` · ${formatHoseLength(s.hose_length_m, units)} of ${formatHoseId(s.hose_id_mm, units)} hose, ${s.coupler_count} ${
            s.coupler_profile ? COUPLER_LABELS[s.coupler_profile] : ""
          } coupler${s.coupler_count === 1 ? "" : "s"}`}
      </span>
    </>
  );
}

export function trialLength(p: Pick<ProtocolView, "blows_per_trial" | "seconds_per_trial">) {
  return p.blows_per_trial != null ? `${p.blows_per_trial} blows` : `${p.seconds_per_trial} s`;
}

export function ProtocolCard({
  protocol,
  units,
  link = true,
}: {
  protocol: ProtocolView;
  units: Units;
  link?: boolean;
}) {
  const p = protocol;
  return (
    <Card as="article" aria-labelledby={`protocol-${p.slug}-${p.version}`}>
      <h3 id={`protocol-${p.slug}-${p.version}`} className="font-semibold">
        {link ? (
          <Link to={`/bench/protocols/${p.slug}`} className="text-bay-700 underline">
            {p.title}
          </Link>
        ) : (
          p.title
        )}{" "}
        <span className="text-sm font-normal text-stone-600">version {p.version}</span>
      </h3>
      <p className="text-sm text-stone-700">{p.summary}</p>
      <dl className="mt-2 grid gap-x-4 gap-y-1 text-sm sm:grid-cols-2">
        <Item label="Measures" value={`${QUANTITY_LABELS[p.quantity]} (${p.category_name.toLowerCase()})`} />
        <Item
          label="Trials"
          value={`${p.trials_per_series} per series, ${trialLength(p)} each; first ${p.blows_discarded} blows left out`}
        />
        <Item label="Bit or socket" value={p.attachment} />
        <Item label="Warm-up" value={p.warm_up} />
        <Item label="Oiling" value={p.oiling} />
        <Item
          label="State"
          value={p.frozen_at ? `Frozen ${formatDate(p.frozen_at)} (in use; a change is a new version)` : "Not yet used"}
        />
      </dl>
      <h4 className="mt-3 text-sm font-semibold">Series, in the order they are run</h4>
      <ol className="mt-1 list-decimal space-y-1 pl-5 text-sm">
        {p.series.map((s) => (
          <li key={s.id}>
            <SeriesLine s={s} units={units} />
          </li>
        ))}
      </ol>
      <p className="mt-2 text-xs text-stone-600">
        {p.accepted_runs} accepted run{p.accepted_runs === 1 ? "" : "s"}
      </p>
    </Card>
  );
}

function Item({ label, value }: { label: string; value: string }) {
  return (
    <div>
      <dt className="text-xs text-stone-600">{label}</dt>
      <dd>{value}</dd>
    </div>
  );
}
