// Filing a bench run: only a rig's owner files on it, only while its calibration is verified and
// current, and only under a protocol version that exists. Traces uploaded for trials are copied out of
// the upload area, analysed here (authoritatively) and the whole run is written in one transaction.
import { sql } from "kysely";
import type { Db } from "../../db/database";
import { copyObject, deleteObject, isStorageOutage, objectSize } from "../storage/s3.server";
import { AppError } from "../utils/errors";
import { randomToken } from "../utils/tokens.server";
import { blowRateAgreement, TraceError } from "./index";
import { freezeProtocol, getProtocol, getProtocolById } from "./protocols.server";
import { rigFilingRefusal } from "./rigs.server";
import type { BenchRunInput } from "./run-form";
import { analyseTraceText, MAX_TRACE_BYTES, readTraceText } from "./traces.server";

/** A refusal tied to one field of the form (a trace that cannot be read, say). */
export class BenchFieldError extends AppError {
  constructor(
    readonly fieldName: string,
    message: string,
  ) {
    super(message, 400, { field: fieldName });
  }
}

const STORAGE_DOWN = "The file store could not be reached; nothing was saved. Try again in a few minutes.";

/** The rig, if the user owns it; a rig of someone else's is a 403, a missing one a 404. */
export async function ownedRig(db: Db, userId: number, rigId: number) {
  const rig = await db
    .selectFrom("rigs")
    .select(["id", "owner_id", "kind", "name", "sensor_capacity", "sample_rate_hz"])
    .where("id", "=", rigId)
    .executeTakeFirst();
  if (!rig) throw new AppError("No such rig", 404);
  if (rig.owner_id !== userId) throw new AppError("Only the rig's owner files runs on it", 403);
  return rig;
}

/** A protocol version by "slug@version", or a refusal saying it does not exist. */
export async function protocolFor(db: Db, ref: string) {
  const match = /^([a-z0-9]+(?:-[a-z0-9]+)*)@([1-9]\d{0,4})$/.exec(ref);
  const protocol = match ? await getProtocol(db, match[1]!, Number(match[2])) : null;
  if (!protocol)
    throw new AppError(`There is no protocol version "${ref.slice(0, 80)}"; choose one from the list`, 400, {
      field: "protocol",
    });
  return protocol;
}

export async function modelsFor(db: Db, categoryId: number) {
  return db
    .selectFrom("tool_models as m")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .select(["m.id", "m.model_code", "m.blows_per_minute", "mk.name as maker_name", "m.category_id"])
    .where("m.category_id", "=", categoryId)
    .orderBy("mk.name")
    .orderBy("m.model_code")
    .execute();
}

interface SaveArgs {
  userId: number;
  rigId: number;
  protocolRef: string;
  input: BenchRunInput;
  submit: boolean;
  /** Set when editing: the run to replace (a draft or a returned run of the same filer). */
  runId?: number;
}

/** Copies each uploaded trace out of the upload area and analyses the copy; returns what the trials store. */
async function checkTraces(args: SaveArgs, capacity: number, discardBlows: number) {
  const out = new Map<string, { key: string; peaks: number[]; rateHz: number; bpm: number | null; clipped: number }>();
  for (const s of args.input.series) {
    for (const t of s.trials) {
      if (!t.traceKey) continue;
      const field = `s${s.position}_t${t.trial}_trace`;
      try {
        const size = await objectSize(t.traceKey);
        if (size == null) throw new BenchFieldError(field, "This trace has not arrived in storage; upload it again");
        if (size > MAX_TRACE_BYTES)
          throw new BenchFieldError(field, `A trace file may be at most ${MAX_TRACE_BYTES / 1024 / 1024} MB`);
        const key = `bench/traces/${args.userId}/${randomToken(18)}.csv`;
        await copyObject(t.traceKey, key);
        const { rateHz, analysis } = analyseTraceText(await readTraceText(key), { capacity, discardBlows });
        if (analysis.blows.length === 0) throw new BenchFieldError(field, "No blows were found in this trace");
        out.set(field, {
          key,
          peaks: analysis.blows.map((b) => Math.round(b.peak * 10) / 10),
          rateHz,
          bpm: analysis.blowsPerMinute,
          clipped: analysis.blows.filter((b) => b.clipped).length,
        });
      } catch (error) {
        if (error instanceof TraceError) throw new BenchFieldError(field, error.message);
        if (error instanceof AppError) throw error;
        if (isStorageOutage(error)) throw new AppError(STORAGE_DOWN, 503);
        throw error;
      }
    }
  }
  return out;
}

/** Files (or, when editing, replaces) a run with its series and trials in one transaction. */
export async function saveRun(db: Db, args: SaveArgs) {
  const rig = await ownedRig(db, args.userId, args.rigId);
  const refusal = await rigFilingRefusal(db, rig.id);
  if (refusal) throw new AppError(refusal, 400, { field: "rig" });
  const protocol = await protocolFor(db, args.protocolRef);
  const model = await db
    .selectFrom("tool_models")
    .select(["id", "category_id", "blows_per_minute"])
    .where("id", "=", args.input.toolModelId)
    .executeTakeFirst();
  if (!model || model.category_id !== protocol.category_id)
    throw new AppError("Choose a tool of the kind this protocol measures", 400, { field: "toolModelId" });
  const traces = await checkTraces(args, rig.sensor_capacity, protocol.blows_discarded);

  const session = await db
    .selectFrom("rig_check_readings")
    .select("in_control")
    .where("rig_id", "=", rig.id)
    .where("session_on", "<=", sql<Date>`${args.input.runOn}::date`)
    .orderBy("session_on", "desc")
    .executeTakeFirst();
  const flags = new Set<string>();
  if (session && !session.in_control) flags.add("check_standard_out_of_control");
  for (const t of traces.values()) {
    if (t.clipped > 0) flags.add("trace_clipped");
    if (model.blows_per_minute && !blowRateAgreement(t.bpm, model.blows_per_minute).withinTolerance)
      flags.add("blow_rate_off_stated");
  }

  return db
    .transaction()
    .execute(async (trx) => {
      const now = new Date();
      const status = args.submit ? ("submitted" as const) : ("draft" as const);
      const fields = {
        rig_id: rig.id,
        protocol_id: protocol.id,
        tool_model_id: model.id,
        unit_serial: args.input.unitSerial,
        unit_condition: args.input.unitCondition,
        unit_hours: args.input.unitCondition === "new" ? null : args.input.unitHours,
        run_on: args.input.runOn,
        operator: args.input.operator,
        ambient_c: args.input.ambientC,
        notes: args.input.notes,
        flags: [...flags],
        status,
        updated_at: now,
        submitted_at: args.submit ? now : null,
      };
      let runId: number;
      if (args.runId != null) {
        const existing = await trx
          .selectFrom("bench_runs")
          .select(["id", "status", "filed_by"])
          .where("id", "=", args.runId)
          .forUpdate()
          .executeTakeFirst();
        if (!existing || existing.filed_by !== args.userId) throw new AppError("No such bench run among yours", 404);
        if (existing.status !== "draft" && existing.status !== "returned")
          throw new AppError(`This run is ${existing.status}; only a draft or a returned run can be changed`, 409);
        await trx.deleteFrom("bench_run_series").where("run_id", "=", existing.id).execute();
        await trx
          .updateTable("bench_runs")
          .set({ ...fields, version: sql<number>`version + 1` })
          .where("id", "=", existing.id)
          .execute();
        runId = existing.id;
      } else {
        ({ id: runId } = await trx
          .insertInto("bench_runs")
          .values({ ...fields, filed_by: args.userId })
          .returning("id")
          .executeTakeFirstOrThrow());
      }
      if (args.submit) await freezeProtocol(trx, protocol.id, now);
      for (const s of args.input.series) {
        const series = protocol.series.find((p) => p.position === s.position)!;
        const { id: runSeriesId } = await trx
          .insertInto("bench_run_series")
          .values({
            run_id: runId,
            protocol_id: protocol.id,
            series_id: series.id,
            static_inlet_kpa: Math.round(s.staticKpa * 10) / 10,
            running_inlet_kpa: Math.round(s.runningKpa * 10) / 10,
          })
          .returning("id")
          .executeTakeFirstOrThrow();
        await trx
          .insertInto("bench_trials")
          .values(
            s.trials.map((t) => {
              const trace = traces.get(`s${s.position}_t${t.trial}_trace`);
              return trace
                ? {
                    run_series_id: runSeriesId,
                    trial_number: t.trial,
                    peaks: trace.peaks,
                    trace_key: trace.key,
                    rate_hz: trace.rateHz,
                    blows_per_minute: trace.bpm == null ? null : Math.round(trace.bpm),
                  }
                : {
                    run_series_id: runSeriesId,
                    trial_number: t.trial,
                    peaks: t.peaksSi.map((p) => Math.round(p * 10) / 10),
                  };
            }),
          )
          .execute();
      }
      return runId;
    })
    .then(async (runId) => {
      // The uploads are read no more; a failed delete leaves only clutter.
      await Promise.all([
        ...args.input.series.flatMap((s) =>
          s.trials.flatMap((t) => (t.traceKey ? [deleteObject(t.traceKey).catch(() => {})] : [])),
        ),
      ]);
      return runId;
    });
}

/** The run as its filer's form shows it again (edit), or null when it is not theirs to change. */
export async function runForEdit(db: Db, userId: number, runId: number) {
  const run = await db
    .selectFrom("bench_runs")
    .selectAll()
    .select(sql<string>`to_char(run_on, 'YYYY-MM-DD')`.as("run_day"))
    .where("id", "=", runId)
    .where("filed_by", "=", userId)
    .executeTakeFirst();
  if (!run) return null;
  const protocol = await getProtocolById(db, run.protocol_id);
  const series = await db
    .selectFrom("bench_run_series as rs")
    .innerJoin("bench_protocol_series as ps", "ps.id", "rs.series_id")
    .select(["rs.id", "ps.position", "rs.static_inlet_kpa", "rs.running_inlet_kpa"])
    .where("rs.run_id", "=", runId)
    .execute();
  const trials = await db
    .selectFrom("bench_trials as t")
    .innerJoin("bench_run_series as rs", "rs.id", "t.run_series_id")
    .select(["t.run_series_id", "t.trial_number", "t.peaks", "t.trace_key"])
    .where("rs.run_id", "=", runId)
    .execute();
  return { run, protocol: protocol!, series, trials };
}
