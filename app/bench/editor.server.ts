// The bench run form's loader data and its submission: which rig and protocol version, the tools it
// may measure, the values to show again (editing), and the refusals with their reasons.
import { redirect } from "react-router";
import type { Db } from "../../db/database";
import { kpaTo, type Units } from "../domain";
import { AppError } from "../utils/errors";
import { type FieldErrors, formValues, invalid } from "../utils/forms";
import { BenchFieldError, modelsFor, ownedRig, protocolFor, runForEdit, saveRun } from "./filing.server";
import { listProtocols } from "./protocols.server";
import { rigFilingRefusal, rigsOwnedBy } from "./rigs.server";
import { benchRunSchema, fieldName } from "./run-form";
import { benchUnit } from "./terms";

const KIND_CATEGORY = { percussive_force: "air-hammer", impact_torque: "impact-wrench" } as const;

/** What the form needs: for a new run, `rig` and `protocol` come from the chooser's query. */
export async function benchEditorData(
  db: Db,
  userId: number,
  units: Units,
  target: { runId: number } | { rigId: number | null; protocolRef: string | null },
) {
  const rigs = await rigsOwnedBy(db, userId);
  if (rigs.length === 0) throw new AppError("Only the owner of a rig files bench runs, and you own none", 403);
  const protocols = await listProtocols(db);
  let values: Record<string, string> = {};
  let rigId: number | null;
  let protocolRef: string | null;
  let runId: number | null = null;
  if ("runId" in target) {
    const found = await runForEdit(db, userId, target.runId);
    if (!found) throw new AppError("No such bench run among yours", 404);
    if (found.run.status !== "draft" && found.run.status !== "returned")
      throw new AppError(`This run is ${found.run.status}; only a draft or a returned run can be changed`, 409);
    runId = found.run.id;
    rigId = found.run.rig_id;
    protocolRef = `${found.protocol.slug}@${found.protocol.version}`;
    values = editValues(found, units);
  } else {
    ({ rigId, protocolRef } = target);
  }
  const rig = rigId == null ? null : await ownedRig(db, userId, rigId);
  const protocol = protocolRef ? await protocolFor(db, protocolRef) : null;
  const refusal = rig ? await rigFilingRefusal(db, rig.id) : null;
  if (rig && protocol && protocol.category_slug !== KIND_CATEGORY[rig.kind])
    throw new AppError("This protocol measures another kind of tool than this rig holds; choose another", 400);
  const models = protocol ? await modelsFor(db, protocol.category_id) : [];
  return { rigs, protocols, rig, protocol, refusal, models, values, runId, units };
}

function editValues(found: NonNullable<Awaited<ReturnType<typeof runForEdit>>>, units: Units) {
  const { run, series, trials, protocol } = found;
  const { perSi } = benchUnit(protocol.quantity, units);
  const values: Record<string, string> = {
    toolModelId: String(run.tool_model_id),
    unitSerial: run.unit_serial,
    unitCondition: run.unit_condition,
    unitHours: run.unit_hours == null ? "" : String(run.unit_hours),
    runOn: run.run_day,
    operator: run.operator,
    ambientC: String(run.ambient_c),
    notes: run.notes ?? "",
  };
  const p = (kpa: number) => String(Number(kpaTo(kpa, units.pressure).toFixed(units.pressure === "bar" ? 2 : 1)));
  for (const s of series) {
    values[fieldName.staticKpa(s.position)] = p(s.static_inlet_kpa);
    values[fieldName.runningKpa(s.position)] = p(s.running_inlet_kpa);
    for (const t of trials.filter((x) => x.run_series_id === s.id))
      values[fieldName.peaks(s.position, t.trial_number)] = t.peaks.map((v) => String(Math.round(v * perSi))).join(" ");
  }
  return values;
}

/** Saves the form: 400 with the field errors and every typed value, or a redirect to the run. */
export async function benchEditorAction(
  db: Db,
  userId: number,
  units: Units,
  formData: FormData,
  runId: number | null,
) {
  const values = formValues(formData);
  const rigId = Number(values.rig);
  const protocolRef = typeof values.protocol === "string" ? values.protocol : "";
  try {
    const rig = await ownedRig(db, userId, Number.isSafeInteger(rigId) && rigId > 0 ? rigId : 0);
    const protocol = await protocolFor(db, protocolRef);
    const parsed = benchRunSchema(protocol, units, rig.sensor_capacity, userId).safeParse(values);
    if (!parsed.success) {
      const errors: FieldErrors = {};
      for (const issue of parsed.error.issues) {
        const key = String(issue.path[0] ?? "form");
        (errors[key] ??= []).push(issue.message);
      }
      return invalid(errors, values, "Some values need a look; they are marked below.");
    }
    const id = await saveRun(db, {
      userId,
      rigId: rig.id,
      protocolRef,
      input: parsed.data,
      submit: values.intent !== "draft",
      runId: runId ?? undefined,
    });
    return redirect(`/bench/runs/${id}`);
  } catch (error) {
    if (error instanceof BenchFieldError) return invalid({ [error.fieldName]: [error.message] }, values, error.message);
    if (error instanceof AppError && (error.status === 400 || error.status === 409 || error.status === 503))
      return invalid(error.field ? { [error.field]: [error.message] } : {}, values, error.message);
    throw error;
  }
}

export type BenchEditorData = Awaited<ReturnType<typeof benchEditorData>>;
