// The typed schema Kysely checks queries against, written by hand so text columns with a CHECK carry
// their values. db/schema-check.ts holds it to db/generated.ts (kysely-codegen's reading of the
// migrated database), and tests/integration/schema-matches-database.test.ts keeps that file current.
import type { ColumnType, Generated, Insertable, Selectable } from "kysely";
import type { BenchFiguresTables } from "./bench-figures-schema";

type Timestamp = ColumnType<Date, Date | string | undefined, Date | string>;
type TextArray = ColumnType<string[], string[] | undefined, string[]>;

export type Trade = "automotive" | "fleet" | "heavy_equipment";
export type PressureUnit = "psi" | "bar" | "kPa";
export type Fitting = "shank-0.401" | "shank-0.498" | "drive-1/4" | "drive-3/8" | "drive-1/2" | "drive-3/4" | "drive-1";
export type ReportStatus = "draft" | "submitted" | "returned" | "accepted" | "rejected" | "withdrawn";
export type VehicleClass =
  "passenger_car" | "light_truck" | "heavy_truck" | "bus" | "trailer" | "agricultural" | "construction";
export type CorrosionLevel = "none" | "light" | "moderate" | "heavy" | "severe";
export type InletSource = "measured_at_inlet" | "read_at_regulator" | "estimated";
export type CouplerProfile = "industrial_m" | "automotive_t" | "high_flow_v" | "iso_6150_b" | "other";
export type SpecSource = "maker_sheet" | "measured" | "estimated";
export type BitRetainer = "beehive_spring" | "quick_change" | "friction_ring" | "detent_pin" | "none";
export type Outcome = "freed" | "freed_with_help" | "not_freed";
export type EvidenceStatus = "pending" | "uploaded" | "verified" | "failed_verification";
export type DecisionAction = "accept" | "return" | "reject" | "claim" | "verify_evidence" | "fail_evidence";

export interface ShopsTable {
  id: Generated<number>;
  name: string;
  city: string;
  region: string;
  trade: Trade;
}

export interface UsersTable {
  id: Generated<number>;
  email: string;
  handle: string;
  shop_id: number | null;
  /** One system per user (CHECK users_one_unit_system): in · psi · lbf, or mm · kPa|bar · N. */
  pressure_unit: ColumnType<PressureUnit, PressureUnit | undefined, PressureUnit>;
  length_unit: ColumnType<"in" | "mm", "in" | "mm" | undefined, "in" | "mm">;
  force_unit: ColumnType<"lbf" | "N", "lbf" | "N" | undefined, "lbf" | "N">;
  banned_at: Date | null;
  created_at: Timestamp;
  /** The reporter's stable public id in the open feed (migration 2026-12-02T00.00). */
  feed_pseudonym: Generated<string>;
}

export interface RolesTable {
  name: string;
  description: string;
}

export interface UserRolesTable {
  user_id: number;
  role: "moderator" | "admin";
  granted_by: number | null;
  granted_at: Timestamp;
}

export interface MakersTable {
  id: Generated<number>;
  slug: string;
  name: string;
  country: string | null;
}

export interface ToolCategoriesTable {
  id: Generated<number>;
  slug: string;
  name: string;
  action: "percussive" | "rotary";
  description: string;
}

export interface ToolModelsTable {
  id: Generated<number>;
  slug: string;
  maker_id: number;
  category_id: number;
  model_code: string;
  name: string;
  fitting: Fitting;
  bore_mm: number | null;
  stroke_mm: number | null;
  blows_per_minute: number | null;
  free_speed_rpm: number | null;
  max_torque_nm: number | null;
  weight_kg: number;
  length_mm: number;
  street_price_cents: number | null;
  air_inlet: string;
  rated_air_lps: number;
  max_inlet_kpa: ColumnType<number, number | undefined, number>;
  measured_specs: TextArray;
  /** Air use while running (hammering, impacting), l/s free air at 90 psi; migration 2026-12-02T12.30. */
  running_air_lps: number | null;
  running_air_source: "maker_sheet" | "measured" | "estimated" | null;
  /** Set only when the source is "estimated": running = rated × factor. */
  running_air_factor: number | null;
  created_at: Timestamp;
  /**
   * Declared exposure figures (migration 2026-12-02T19.00), each with its source; null: not known yet.
   * Vibration total value a_hv and K in m/s², with the ISO 28927 part (required of a maker's sheet).
   */
  vibration_ahv_ms2: number | null;
  vibration_k_ms2: number | null;
  vibration_iso28927_part: number | null;
  vibration_source: SpecSource | null;
  /** A-weighted emission sound pressure level L_pA and its K, dB (ISO 15744). */
  sound_pressure_db: number | null;
  sound_pressure_k_db: number | null;
  sound_pressure_source: SpecSource | null;
  /** A-weighted sound power level L_WA and its K, dB (ISO 15744). */
  sound_power_db: number | null;
  sound_power_k_db: number | null;
  sound_power_source: SpecSource | null;
  bit_retainer: BitRetainer | null;
  /** Never below weight_kg (CHECK tool_models_weight_with_whip_sourced). */
  weight_with_whip_kg: number | null;
  weight_with_whip_source: SpecSource | null;
}

export interface JobTypesTable {
  id: Generated<number>;
  slug: string;
  category_id: number;
  name: string;
  description: string;
  seized: ColumnType<boolean, boolean | undefined, boolean>;
}

/** What a report and a bench run share: the moderation lifecycle, its optimistic version and its times. */
interface ModeratedTable {
  status: ColumnType<ReportStatus, ReportStatus | undefined, ReportStatus>;
  version: ColumnType<number, number | undefined, number>;
  flags: TextArray;
  created_at: Timestamp;
  updated_at: Timestamp;
  submitted_at: Date | string | null;
  decided_at: Date | string | null;
  accepted_at: Date | string | null;
}

/**
 * CHECK reports_complete_unless_draft: every job column and submitted_at are set, except on a
 * draft and on a withdrawn report that was never submitted (a draft withdrawn as it stood).
 */
export interface ReportsTable extends ModeratedTable {
  id: Generated<number>;
  reporter_id: number;
  tool_model_id: number;
  category_id: number;
  job_type_id: number;
  vehicle_class: VehicleClass | null;
  component_age_years: number | null;
  corrosion_level: CorrosionLevel | null;
  attachment: string | null;
  attachment_length_mm: number | null;
  regulator_kpa: number | null;
  inlet_kpa: number | null;
  inlet_source: InletSource | null;
  hose_id_mm: number | null;
  hose_length_m: number | null;
  coupler_profile: CouplerProfile | null;
  coupler_count: number | null;
  compressor_lps: number | null;
  tank_l: number | null;
  outcome: Outcome | null;
  time_to_result_s: number | null;
  attempts: number | null;
  trigger_control: number | null;
  notes: string | null;
  /** The units the reporter typed in (migration 2026-12-02T15.00); values are stored in SI. */
  entered_pressure_unit: PressureUnit | null;
  entered_length_unit: "in" | "mm" | null;
}

export interface EvidenceTable {
  id: Generated<number>;
  report_id: number;
  /** Pending: the upload key (uploads/…) its presigned URL writes. Checked: the copy under evidence/…, never uploads/ (CHECK). */
  object_key: string;
  kind: "video" | "photo";
  content_type: string | null;
  size_bytes: ColumnType<string | null, number | null | undefined, number | null>;
  sha256: string | null;
  status: ColumnType<EvidenceStatus, EvidenceStatus | undefined, EvidenceStatus>;
  is_public: ColumnType<boolean, boolean | undefined, boolean>;
  created_at: Timestamp;
}

export interface DecisionsTable {
  id: Generated<number>;
  report_id: number;
  moderator_id: number;
  action: DecisionAction;
  reason_code: string;
  note: string | null;
  report_version: number;
  created_at: Timestamp;
  evidence_id: number | null;
  checklist: ColumnType<Record<string, boolean> | null, string | null | undefined, never>;
}

export interface ReportClaimsTable {
  report_id: number;
  moderator_id: number;
  claimed_at: Timestamp;
  expires_at: Date | string;
}

export interface NoticesTable {
  id: Generated<number>;
  user_id: number;
  report_id: number | null;
  message: string;
  created_at: Timestamp;
  read_at: Date | string | null;
}

export interface Database extends BenchFiguresTables {
  shops: ShopsTable;
  users: UsersTable;
  roles: RolesTable;
  user_roles: UserRolesTable;
  makers: MakersTable;
  tool_categories: ToolCategoriesTable;
  tool_models: ToolModelsTable;
  job_types: JobTypesTable;
  reports: ReportsTable;
  evidence: EvidenceTable;
  decisions: DecisionsTable;
  sessions: SessionsTable;
  oauth_accounts: OauthAccountsTable;
  sign_in_links: SignInLinksTable;
  api_keys: ApiKeysTable;
  role_changes: RoleChangesTable;
  ban_changes: BanChangesTable;
  report_versions: ReportVersionsTable;
  report_claims: ReportClaimsTable;
  notices: NoticesTable;
  stats_cells: StatsCellsTable;
  stats_jobs: StatsJobsTable;
  app_secrets: AppSecretsTable;
  feed_snapshots: FeedSnapshotsTable;
  rigs: RigsTable;
  rig_calibrations: RigCalibrationsTable;
  rig_check_readings: RigCheckReadingsTable;
  bench_protocols: BenchProtocolsTable;
  bench_protocol_series: BenchProtocolSeriesTable;
  bench_runs: BenchRunsTable;
  bench_run_series: BenchRunSeriesTable;
  bench_trials: BenchTrialsTable;
  bench_decisions: BenchDecisionsTable;
}

// The open feed (migration 2026-12-02T00.00); feed_rate_limits belongs to rate-limiter-flexible.
export interface AppSecretsTable {
  name: string;
  value: string;
  created_at: Timestamp;
}

// The open data's daily snapshots (migration 2026-12-02T10.30). Sizes are bigint: text when read.
type Bytes = ColumnType<string, number | string, number | string>;
export interface FeedSnapshotsTable {
  id: Generated<number>;
  created_at: Timestamp;
  report_count: number;
  ndjson_key: string;
  ndjson_bytes: Bytes;
  ndjson_sha256: string;
  csv_key: string;
  csv_bytes: Bytes;
  csv_sha256: string;
}

export type Report = Selectable<ReportsTable>;
export type NewReport = Insertable<ReportsTable>;
export type NewDecision = Insertable<DecisionsTable>;

// Sign-in (migration 2026-12-01T00.02).
export interface SessionsTable {
  id_hash: string;
  user_id: number;
  created_at: Timestamp;
  last_seen_at: Timestamp;
  expires_at: Date | string;
  user_agent: string | null;
  sign_in_method: "oidc" | "email_link";
}

export interface OauthAccountsTable {
  provider: string;
  subject: string;
  user_id: number;
  email_at_link: string | null;
  created_at: Timestamp;
}

export interface SignInLinksTable {
  token_hash: string;
  email: string;
  client_key: string;
  created_at: Timestamp;
  expires_at: Date | string;
  used_at: Date | string | null;
}

export interface ApiKeysTable {
  id: Generated<number>;
  user_id: number;
  name: string;
  key_hash: string;
  key_prefix: string;
  created_at: Timestamp;
  last_used_at: Date | string | null;
  revoked_at: Date | string | null;
}

export interface RoleChangesTable {
  id: Generated<number>;
  user_id: number;
  role: "moderator" | "admin";
  change: "grant" | "revoke";
  changed_by: number | null;
  created_at: Timestamp;
}

// Bans and unbans, append-only (migration 2026-12-02T10.00).
export interface BanChangesTable {
  id: Generated<number>;
  user_id: number;
  change: "ban" | "unban";
  reason: string;
  changed_by: number | null;
  created_at: Timestamp;
}

// Report versions (migration 2026-12-01T00.03).
export interface ReportVersionsTable {
  report_id: number;
  version: number;
  snapshot: ColumnType<Record<string, unknown>, string, never>;
  created_at: Timestamp;
}

// Stats cells (migration 2026-12-01T00.05).
export interface StatsCellsTable {
  tool_model_id: number;
  job_type_id: number;
  n: number;
  successes: number;
  estimate: number;
  lower: number;
  upper: number;
  shrunk_estimate: number | null;
  shrunk_lower: number | null;
  shrunk_upper: number | null;
  time_n: number;
  time_median_s: number | null;
  time_lower_s: number | null;
  time_upper_s: number | null;
  adj_estimate: number | null;
  adj_lower: number | null;
  adj_upper: number | null;
  adj_reason: string | null;
  fit: ColumnType<PressureFit | null, string | null, string | null>;
  measured_share: number;
  estimated_share: number;
  confidence: ColumnType<number, number | undefined, number>;
  computed_at: Timestamp;
  // Second edition (migration 2026-12-02T12.00).
  reporters: ColumnType<number, number | undefined, number>;
  design_effect: ColumnType<number, number | undefined, number>;
  effective_n: number | null;
  set_aside: ColumnType<number, number | undefined, number>;
  time_coverage: number | null;
  km_n: ColumnType<number, number | undefined, number>;
  km_median_s: number | null;
  km_lower_s: number | null;
  km_upper_s: number | null;
}

/** A model's share of its job's pooled pressure fit: all the browser needs to predict at any pressure (app/stats/predict.ts). */
export interface PressureFit {
  intercept: number;
  slope: number;
  /** Arrowhead inverse of the information (pooledLogisticFit().inverse): d of the model, its r, and σ. */
  d: number;
  r: number;
  sigma: number;
  /** The model's reports with a known inlet pressure in the fit, and their pressures (10th, 90th percentile, range). */
  n: number;
  p10Kpa: number;
  p90Kpa: number;
  minKpa: number;
  maxKpa: number;
}
export type StatsCell = Selectable<StatsCellsTable>;

/** One job type's pooled pressure fit and what its refresh set aside (migration 2026-12-02T12.00). */
export interface StatsJobsTable {
  job_type_id: number;
  fit_n: number;
  fit_models: number;
  slope: number | null;
  slope_se: number | null;
  converged: boolean;
  fit_reason: string | null;
  set_aside: number;
  prior_alpha: number | null;
  prior_beta: number | null;
  computed_at: Timestamp;
}

// Bench runs (migration 2026-12-02T18.00). Forces in N, torques in N·m, pressures in kPa gauge.
type DateOnly = ColumnType<Date, Date | string, Date | string>;
type Json<T> = ColumnType<T, string, string>;

export type RigKind = "percussive_force" | "impact_torque";
export type BenchQuantity = "peak_force_n" | "peak_torque_nm";
export type BenchTrigger = "full" | "lightest_steady";
export type BenchInlet = "regulated_at_tool" | "open_line";

export interface RigsTable {
  id: Generated<number>;
  owner_id: number;
  shop_id: number | null;
  name: string;
  kind: RigKind;
  /** CHECK rigs_sensor_fits_kind: a force rig reads a load cell, a torque fixture a transducer. */
  sensor_kind: "load_cell" | "torque_transducer";
  /** N for a load cell, N·m for a torque transducer. */
  sensor_capacity: number;
  sample_rate_hz: number;
  fixture: string;
  check_tool_model_id: number | null;
  /** How long a verified calibration counts (12 months by default). */
  check_interval_months: ColumnType<number, number | undefined, number>;
  created_at: Timestamp;
}

/** One calibration point: the reference load (or torque) applied and what the rig read. */
export interface CalibrationPoint {
  reference: number;
  reading: number;
}

export interface RigCalibrationsTable {
  id: Generated<number>;
  rig_id: number;
  calibrated_on: DateOnly;
  points: Json<CalibrationPoint[]>;
  degree: 1 | 2;
  coefficients: ColumnType<number[], number[], number[]>;
  residual_sd: number;
  r_squared: number | null;
  certificate_key: string | null;
  verified_by: number | null;
  verified_at: Date | string | null;
  created_at: Timestamp;
}

export interface RigCheckReadingsTable {
  id: Generated<number>;
  rig_id: number;
  session_on: DateOnly;
  value: number;
  in_control: boolean;
  created_at: Timestamp;
}

export interface BenchProtocolsTable {
  id: Generated<number>;
  slug: string;
  version: number;
  title: string;
  category_id: number;
  quantity: BenchQuantity;
  trials_per_series: number;
  /** CHECK bench_protocols_one_trial_length: blows or seconds, never both. */
  blows_per_trial: number | null;
  seconds_per_trial: number | null;
  blows_discarded: ColumnType<number, number | undefined, number>;
  attachment: string;
  warm_up: string;
  oiling: string;
  summary: string;
  /** Set by the first run that uses this version; a change after that is a new version. */
  frozen_at: Date | string | null;
  created_at: Timestamp;
}

export interface BenchProtocolSeriesTable {
  id: Generated<number>;
  protocol_id: number;
  position: number;
  label: string;
  trigger: BenchTrigger;
  inlet: BenchInlet;
  /** Regulated: the pressure at the tool inlet. Open line: the regulator setting. */
  inlet_kpa: number;
  hose_length_m: number | null;
  hose_id_mm: number | null;
  coupler_count: number | null;
  coupler_profile: CouplerProfile | null;
}

export interface BenchRunsTable extends ModeratedTable {
  id: Generated<number>;
  rig_id: number;
  protocol_id: number;
  tool_model_id: number;
  filed_by: number;
  unit_serial: string;
  unit_condition: "new" | "used";
  unit_hours: number | null;
  run_on: DateOnly;
  operator: string;
  ambient_c: number;
  video_key: string | null;
  notes: string | null;
}

export interface BenchRunSeriesTable {
  id: Generated<number>;
  run_id: number;
  protocol_id: number;
  series_id: number;
  static_inlet_kpa: number;
  running_inlet_kpa: number;
}

export interface BenchTrialsTable {
  id: Generated<number>;
  run_series_id: number;
  trial_number: number;
  peaks: ColumnType<number[], number[], number[]>;
  trace_key: string | null;
  rate_hz: number | null;
  blows_per_minute: number | null;
}

export interface BenchDecisionsTable {
  id: Generated<number>;
  run_id: number;
  moderator_id: number;
  action: "accept" | "return" | "reject";
  reason_code: string;
  note: string | null;
  checklist: ColumnType<Record<string, boolean> | null, string | null | undefined, never>;
  run_version: number;
  created_at: Timestamp;
}
