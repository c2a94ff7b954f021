// The stored bench figures (migration 2026-12-02T20.00), kept apart from db/schema.ts so the bench
// runs' tables and these can grow without touching each other. Recomputed by app/bench/figures.server.ts.
import type { ColumnType, Generated } from "kysely";

type Timestamp = ColumnType<Date, Date | string | undefined, Date | string>;
type Confidence = ColumnType<number, number | undefined, number>;
type Json<T> = ColumnType<T, string, string>;

export interface BenchPooledFiguresTable {
  tool_model_id: number;
  series_id: number;
  protocol_id: number;
  figure: "force" | "trigger_range";
  estimate: number;
  lower: number;
  upper: number;
  standard_error: number;
  tau2: number;
  i2: number;
  prediction_lower: number | null;
  prediction_upper: number | null;
  runs: number;
  rigs: number;
  method: string;
  confidence: Confidence;
  computed_at: Timestamp;
}

export interface BenchRigAgreementTable {
  id: Generated<number>;
  tool_model_id: number;
  source: "check_readings" | "runs";
  /** CHECK: null exactly when the source is the check-standard readings. */
  series_id: number | null;
  repeatability_sd: number;
  reproducibility_sd: number;
  between_rig_sd: number;
  grand_mean: number;
  rigs: number;
  readings: number;
  confidence: Confidence;
  computed_at: Timestamp;
}

export interface BenchRigBiasTable {
  agreement_id: number;
  rig_id: number;
  n: number;
  mean: number;
  bias: number;
  lower: number;
  upper: number;
}

export interface PressurePointRow {
  pressureKpa: number;
  force: number;
  rigId: number;
}

export interface BandPointRow {
  pressureKpa: number;
  fit: number;
  lower: number;
  upper: number;
}

export interface BenchPressureSlopesTable {
  tool_model_id: number;
  protocol_id: number;
  slope: number;
  slope_lower: number;
  slope_upper: number;
  intercept: number;
  at_kpa: number;
  predicted: number;
  predicted_lower: number;
  predicted_upper: number;
  residual_sd: number;
  n: number;
  points: Json<PressurePointRow[]>;
  band: Json<BandPointRow[]>;
  confidence: Confidence;
  computed_at: Timestamp;
}

export interface BenchJobForceTable {
  job_type_id: number;
  quantity: "peak_force_n" | "peak_torque_nm";
  intercept: number;
  slope: number;
  var_intercept: number;
  cov_intercept_slope: number;
  var_slope: number;
  ed50: number;
  ed50_lower: number | null;
  ed50_upper: number | null;
  method: "Fieller" | "delta";
  firth: boolean;
  converged: boolean;
  reports: number;
  models: number;
  force_min: number;
  force_max: number;
  confidence: Confidence;
  computed_at: Timestamp;
}

export interface BenchFiguresTables {
  bench_pooled_figures: BenchPooledFiguresTable;
  bench_rig_agreement: BenchRigAgreementTable;
  bench_rig_bias: BenchRigBiasTable;
  bench_pressure_slopes: BenchPressureSlopesTable;
  bench_job_force: BenchJobForceTable;
}
