// Calibrations waiting for a moderator, each with its own verify button (a plain form).
import { Form, Link } from "react-router";
import type { PendingCalibration } from "~/bench/rig-registry.server";
import { formatDate } from "~/domain/format";
import { buttonClass, Card } from "../ui";

export function PendingCalibrations({
  pending,
  showRig = false,
  error,
}: {
  pending: PendingCalibration[];
  showRig?: boolean;
  error?: string;
}) {
  return (
    <Card as="section" aria-labelledby="pending-calibrations" className="space-y-3">
      <h2 id="pending-calibrations" className="font-semibold">
        Calibrations waiting for a moderator
      </h2>
      {error && (
        <p role="alert" className="rounded border border-red-700 bg-red-50 p-3 text-red-900">
          {error}
        </p>
      )}
      {pending.length === 0 ? (
        <p className="text-sm text-stone-600">None waiting.</p>
      ) : (
        <ul className="space-y-3">
          {pending.map((c) => (
            <li key={c.id} className="flex flex-wrap items-center justify-between gap-2 border-t border-stone-100 pt-2">
              <span className="text-sm">
                {showRig ? (
                  <Link to={`/bench/rigs/${c.rig_id}`} className="text-bay-700 underline">
                    {c.rig_name}
                  </Link>
                ) : (
                  "Calibration"
                )}{" "}
                of {formatDate(c.calibrated_on)} by {c.owner_handle}: {c.degree === 1 ? "straight line" : "quadratic"}
              </span>
              <Form method="post" action={`/bench/rigs/${c.rig_id}`}>
                <input type="hidden" name="intent" value="verify" />
                <input type="hidden" name="calibrationId" value={c.id} />
                <button
                  type="submit"
                  className={buttonClass("primary", "sm")}
                  aria-label={`Verify the calibration of ${formatDate(c.calibrated_on)}${showRig ? ` on ${c.rig_name}` : ""}`}
                >
                  Verify
                </button>
              </Form>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
