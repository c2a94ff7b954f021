import { Link, redirect } from "react-router";
import { z } from "zod";
import { getUser, hasRole, requireRole } from "~/auth/session.server";
import { unitsFor } from "~/auth/units.server";
import { unverifiedCalibrations, verifyCalibration } from "~/bench/rig-registry.server";
import { getRig } from "~/bench/rigs.server";
import { runsOnRig } from "~/bench/runs.server";
import { BenchSafetyCautions } from "~/components/bench/bench-safety";
import { CalibrationCertificates } from "~/components/bench/calibration-certificates";
import { PendingCalibrations } from "~/components/bench/calibration-verify";
import { RigView } from "~/components/bench/rig-view";
import { RunList } from "~/components/bench/run-list";
import { ErrorPage } from "~/components/error-page";
import { buttonClass } from "~/components/ui";
import { db } from "~/db.server";
import { AppError, failureAnswer } from "~/utils/errors";
import { invariantResponse } from "~/utils/http";
import { invalid, parseForm, readForm } from "~/utils/forms";
import { idField, parseIdParam } from "~/utils/params";
import type { Route } from "./+types/bench.rigs.$id";

export async function loader({ params, request }: Route.LoaderArgs) {
  const id = parseIdParam(params.id, "No such rig");
  const [detail, runs, units, user] = await Promise.all([
    getRig(db, id),
    runsOnRig(db, id),
    unitsFor(request),
    getUser(request),
  ]);
  invariantResponse(detail, "No such rig", 404);
  const moderator = user != null && hasRole(user, "moderator");
  const owns = user?.id === detail.rig.owner_id;
  // A moderator sees what waits on someone else's rig; their own rig waits for another moderator.
  const pending = moderator ? await unverifiedCalibrations(db, user.id, id) : null;
  // Certificates are for the owner and moderators; nobody else learns whether one exists.
  const certificates =
    owns || moderator
      ? detail.calibrations.map((c) => ({
          id: c.id,
          calibratedOn: c.calibrated_on,
          verified: c.verified_at != null,
          hasCertificate: c.has_certificate,
        }))
      : null;
  return { detail, runs, units, owns, pending, certificates };
}

const verifySchema = z.object({ intent: z.literal("verify"), calibrationId: idField("No such calibration") });

export async function action({ request, params }: Route.ActionArgs) {
  const moderator = await requireRole(request, "moderator");
  const rigId = parseIdParam(params.id, "No such rig");
  const parsed = parseForm(verifySchema, await readForm(request));
  if (!parsed.ok) return invalid(parsed.errors, parsed.values, "Choose a calibration to verify.");
  try {
    await verifyCalibration(db, parsed.data.calibrationId, rigId, moderator.id);
  } catch (error) {
    if (error instanceof AppError && error.status === 409) return invalid({}, parsed.values, error.message);
    throw failureAnswer(error, "page");
  }
  return redirect(`/bench/rigs/${rigId}`);
}

export default function RigPage({ loaderData, actionData }: Route.ComponentProps) {
  const { detail, runs, units, owns, pending, certificates } = loaderData;
  return (
    <div className="space-y-6">
      <header>
        <p className="text-sm">
          <Link to="/bench" className="inline-flex min-h-11 items-center text-bay-700 underline">
            Bench runs
          </Link>
        </p>
        <h1 className="text-2xl font-bold">{detail.rig.name}</h1>
        {owns && (
          <p className="mt-2">
            <Link
              to={`/bench/rigs/${detail.rig.id}/calibrations/new`}
              className={buttonClass("primary", "md", "inline-block")}
            >
              File a calibration
            </Link>
          </p>
        )}
      </header>
      {pending && (pending.length > 0 || actionData?.formError) && (
        <PendingCalibrations pending={pending} error={actionData?.formError} />
      )}
      <RigView detail={detail} units={units} />
      {certificates && certificates.length > 0 && (
        <CalibrationCertificates rigId={detail.rig.id} certificates={certificates} />
      )}
      <section aria-labelledby="rig-runs" className="space-y-2">
        <h2 id="rig-runs" className="text-lg font-semibold">
          Accepted runs on this rig
        </h2>
        <RunList runs={runs} units={units} show={["tool"]} />
      </section>
      <BenchSafetyCautions />
    </div>
  );
}

export function meta({ data }: Route.MetaArgs) {
  return [{ title: data ? `${data.detail.rig.name} — Bayproof` : "Rig not found — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
