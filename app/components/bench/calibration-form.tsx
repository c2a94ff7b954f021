// Filing a rig's calibration: pasted rows and the day, checked on the server and shown back fitted
// (coefficients, residual SD, residuals, the choice of line or quadratic) before the owner saves it.
import { Form } from "react-router";
import type { FitChoice } from "~/bench/rig-registry.server";
import type { Units } from "~/domain";
import { ErrorSummary } from "../error-summary";
import { Field, inputClass } from "../field";
import { buttonClass, Card } from "../ui";
import { CERTIFICATE_LABEL, CertificateUpload } from "./certificate-upload";
import { CalibrationPlot } from "./charts";

type Errors = Record<string, string[] | undefined>;

export const CALIBRATION_FIELD_LABELS = {
  points: "Reference loads and readings",
  calibratedOn: "Day of the calibration",
  certificate: CERTIFICATE_LABEL,
};

export function CalibrationForm({
  rigId,
  certificateKey,
  unit,
  values,
  errors,
  formError,
}: {
  rigId: number;
  certificateKey: string;
  unit: string;
  values: Record<string, string>;
  errors: Errors;
  formError?: string;
}) {
  const pointErrors = errors.points ?? [];
  return (
    <Form method="post" action={`/bench/rigs/${rigId}/calibrations/new`} className="space-y-4" noValidate>
      <ErrorSummary errors={errors} labels={CALIBRATION_FIELD_LABELS} />
      {formError && Object.keys(CALIBRATION_FIELD_LABELS).every((name) => !errors[name]?.length) && (
        <p role="alert" className="rounded border border-red-700 bg-red-50 p-3 text-red-900">
          {formError}
        </p>
      )}
      <Field
        id="points"
        label={`${CALIBRATION_FIELD_LABELS.points} (${unit})`}
        hint={`Paste two columns a line: the reference load, then what the rig read, both in ${unit} (3 to 200 lines; a header line is skipped).`}
        error={pointErrors.length ? pointErrors.join("; ") : undefined}
      >
        {(control) => (
          <textarea
            name="points"
            rows={8}
            spellCheck={false}
            defaultValue={values.points ?? ""}
            placeholder={"reference,reading\n1000,1004\n2000,2003\n4000,4011"}
            className={`${inputClass} font-mono`}
            {...control}
          />
        )}
      </Field>
      <Field
        id="calibratedOn"
        label={CALIBRATION_FIELD_LABELS.calibratedOn}
        hint="YYYY-MM-DD; not in the future."
        error={errors.calibratedOn?.[0]}
      >
        {(control) => (
          <input
            name="calibratedOn"
            type="date"
            defaultValue={values.calibratedOn ?? ""}
            className={inputClass}
            {...control}
          />
        )}
      </Field>
      <CertificateUpload rigId={rigId} initialKey={certificateKey} error={errors.certificate?.[0]} />
      <div className="flex flex-wrap gap-3">
        <button type="submit" name="intent" value="preview" className={buttonClass("secondary")}>
          Fit and show
        </button>
        <button type="submit" name="intent" value="save" className={buttonClass()}>
          Save the calibration
        </button>
      </div>
    </Form>
  );
}

export function CalibrationPreview({
  choice,
  unit,
  perSi,
  units,
}: {
  choice: Pick<FitChoice, "reason"> & { fit: FitChoice["fit"] };
  unit: string;
  perSi: number;
  units: Units;
}) {
  const { fit } = choice;
  const fmt = (x: number) => x.toPrecision(6);
  const sd = (fit.residualSD * perSi).toFixed(units.system === "metric" ? 2 : 3);
  return (
    <Card as="section" aria-labelledby="fit-heading" className="space-y-3">
      <h2 id="fit-heading" className="font-semibold">
        The fit, before saving
      </h2>
      <p className="text-sm">{choice.reason}</p>
      <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
        <div>
          <dt className="text-xs text-stone-600">Reading (SI) =</dt>
          <dd className="break-words">
            {fit.coefficients.map((c, k) => `${fmt(c)}${k === 0 ? "" : k === 1 ? " × load" : " × load²"}`).join(" + ")}
          </dd>
        </div>
        <div>
          <dt className="text-xs text-stone-600">Residual standard deviation</dt>
          <dd>
            {sd} {unit} over {fit.n} points
          </dd>
        </div>
        <div>
          <dt className="text-xs text-stone-600">R²</dt>
          <dd>{fit.rSquared.toFixed(6)}</dd>
        </div>
      </dl>
      <CalibrationPlot
        residuals={fit.residuals}
        coefficients={fit.coefficients}
        residualSD={fit.residualSD}
        unit={unit}
        perSi={perSi}
      />
      <p className="text-sm text-stone-700">
        Saved, the calibration waits for a moderator; runs on the rig count once it is verified.
      </p>
    </Card>
  );
}
