// A rig's calibration standing as a labelled badge (words, not colour alone) and its list on the bench page.
import { Link } from "react-router";
import { RIG_KIND_LABELS, RIG_STATUS_LABELS, formatCapacity, type RigStatusName } from "~/bench/terms";
import type { RigListItem } from "~/bench/rigs.server";
import { formatDate, type Units } from "~/domain";
import { Card, cx } from "../ui";

const TONE: Record<RigStatusName, string> = {
  current: "border-bay-700 bg-bay-50 text-bay-900",
  unverified: "border-amber-600 bg-amber-50 text-amber-900",
  expired: "border-red-700 bg-red-50 text-red-900",
  uncalibrated: "border-stone-400 bg-stone-50 text-stone-800",
};

export function RigStatusBadge({ status }: { status: RigStatusName }) {
  return (
    <span className={cx("inline-block rounded border px-2 py-0.5 text-xs font-semibold", TONE[status])}>
      {RIG_STATUS_LABELS[status]}
    </span>
  );
}

export function RigList({ rigs, units }: { rigs: RigListItem[]; units: Units }) {
  if (rigs.length === 0) return <p className="text-stone-600">No rigs yet.</p>;
  return (
    <Card as="ul" padding="none" className="divide-y divide-stone-100">
      {rigs.map((r) => (
        <li key={r.id} className="p-3">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <Link to={`/bench/rigs/${r.id}`} className="font-semibold text-bay-700 underline">
              {r.name}
            </Link>
            <RigStatusBadge status={r.standing.status} />
          </div>
          <p className="text-sm text-stone-700">
            {RIG_KIND_LABELS[r.kind]} · capacity {formatCapacity(r.kind, r.sensor_capacity, units)} ·{" "}
            {r.shop_name ?? r.owner_handle}
            {r.shop_city ? `, ${r.shop_city}` : ""}
          </p>
          <p className="text-xs text-stone-600">
            {r.standing.calibratedOn ? `Calibrated ${formatDate(r.standing.calibratedOn)}` : "Not calibrated"}
            {r.standing.expiresOn ? ` · counts until ${formatDate(r.standing.expiresOn)}` : ""}
            {r.standing.lastCheckInControl === false ? " · last check-standard session outside its limits" : ""}
          </p>
        </li>
      ))}
    </Card>
  );
}
