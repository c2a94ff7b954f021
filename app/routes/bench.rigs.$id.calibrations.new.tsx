import { Link, redirect } from "react-router";
import { requireUser } from "~/auth/session.server";
import { unitsFor } from "~/auth/units.server";
import { calibrationSchema, rigUnit } from "~/bench/rig-form";
import { fitOrRefuse, rigForOwner, saveCalibration } from "~/bench/rig-registry.server";
import { BenchSafetyCautions } from "~/components/bench/bench-safety";
import { CalibrationForm, CalibrationPreview } from "~/components/bench/calibration-form";
import { ErrorPage } from "~/components/error-page";
import { db } from "~/db.server";
import { AppError, failureAnswer } from "~/utils/errors";
import { invalid, parseForm, readForm } from "~/utils/forms";
import { parseIdParam } from "~/utils/params";
import type { Route } from "./+types/bench.rigs.$id.calibrations.new";

// /bench/rigs/:id/calibrations/new: the rig's owner files a calibration; it is saved unverified.
export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const id = parseIdParam(params.id, "No such rig");
  try {
    const [rig, units] = await Promise.all([rigForOwner(db, user.id, id), unitsFor(request)]);
    return { rig, units };
  } catch (error) {
    throw failureAnswer(error, "page");
  }
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireUser(request);
  const id = parseIdParam(params.id, "No such rig");
  let rig;
  try {
    rig = await rigForOwner(db, user.id, id);
  } catch (error) {
    throw failureAnswer(error, "page");
  }
  const [units, formData] = await Promise.all([unitsFor(request), readForm(request)]);
  const parsed = parseForm(calibrationSchema(rigUnit(rig.kind, units).perSi, user.id), formData);
  if (!parsed.ok) return invalid(parsed.errors, parsed.values, "Some values need a look; they are marked below.");
  try {
    const choice = fitOrRefuse(parsed.data.points);
    if (parsed.values.intent === "save") {
      await saveCalibration(db, rig.id, {
        ...parsed.data,
        fit: choice.fit,
        certificateUpload: parsed.data.certificate,
      });
      return redirect(`/bench/rigs/${rig.id}`);
    }
    return { ok: true as const, choice: { fit: choice.fit, reason: choice.reason }, values: parsed.values };
  } catch (error) {
    // A refused certificate, or the file store out of reach while checking it, keeps what was typed.
    if (error instanceof AppError && (error.status === 400 || error.field === "certificate"))
      return invalid(error.field ? { [error.field]: [error.message] } : {}, parsed.values, error.message, error.status);
    throw failureAnswer(error, "page");
  }
}

export default function FileCalibration({ loaderData, actionData }: Route.ComponentProps) {
  const { rig, units } = loaderData;
  const { label: unit, perSi } = rigUnit(rig.kind, units);
  const failed = actionData && "errors" in actionData ? actionData : null;
  const preview = actionData && "choice" in actionData ? actionData : null;
  const values = textValues((failed ?? preview)?.values ?? {});
  return (
    <div className="space-y-6">
      <header>
        <p className="text-sm">
          <Link to={`/bench/rigs/${rig.id}`} className="inline-flex min-h-11 items-center text-bay-700 underline">
            {rig.name}
          </Link>
        </p>
        <h1 className="text-2xl font-bold">File a calibration</h1>
        <p className="text-stone-700">
          Load the rig with known reference loads and note what it reads at each. The rows are fitted by least squares:
          a straight line, or a quadratic where the line's residuals bend significantly.
        </p>
      </header>
      {preview && <CalibrationPreview choice={preview.choice} unit={unit} perSi={perSi} units={units} />}
      <CalibrationForm
        rigId={rig.id}
        certificateKey={failed?.errors.certificate ? "" : (values.certificate ?? "")}
        unit={unit}
        values={values}
        errors={failed?.errors ?? {}}
        formError={failed?.formError}
      />
      <BenchSafetyCautions />
    </div>
  );
}

const textValues = (values: Record<string, unknown>) =>
  Object.fromEntries(Object.entries(values).map(([k, v]) => [k, typeof v === "string" ? v : ""]));

export function meta() {
  return [{ title: "File a calibration — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
