// The open feed's bench record types, field by field (issue 19 item 8, issue 20 item 6): accepted bench
// runs with their series and trials, the rigs, the protocol versions and the stored figures across rigs.
// Made into schemas, OpenAPI, Table Schemas and the /data dictionary exactly as fields.ts is.
// Bench values are peak forces (N) or peak torques (N·m): each record names its quantity and unit.
import { COUPLER_PROFILES, SLUG_PATTERN } from "~/domain";
import { INLET_LABELS, QUANTITY_LABELS, RIG_KIND_LABELS, RIG_STATUS_LABELS, TRIGGER_LABELS } from "~/bench/terms";
import type { Field } from "./fields";

const keys = <T extends object>(labels: T) => Object.keys(labels) as readonly string[];

/** The unit of a bench value, as the record's `value_unit` names it. */
export const BENCH_UNITS = { peak_force_n: "N", peak_torque_nm: "N·m" } as const;
const VALUE_UNIT = "N or N·m";

const slug = (name: string, description: string): Field => ({
  name,
  type: "string",
  pattern: SLUG_PATTERN,
  description,
});
const id = (name: string, description: string): Field => ({ name, type: "integer", minimum: 1, description });
const pseudonym = (name: string, description: string): Field => ({
  name,
  type: "string",
  pattern: "^rp_[0-9a-f]{16}$",
  description: `${description} The same pseudonymous id as a report's reporter: stable for one person, unrelated to their account.`,
});
const quantity: Field = {
  name: "quantity",
  type: "string",
  enum: keys(QUANTITY_LABELS),
  description: "What is measured: the peak force of each blow (N) or the peak torque of each impact (N·m).",
};
const valueUnit: Field = {
  name: "value_unit",
  type: "string",
  enum: Object.values(BENCH_UNITS),
  description: "The unit of this record's bench values: N for peak force, N·m for peak torque.",
};
const value = (name: string, description: string, nullable = false): Field => ({
  name,
  type: "number",
  unit: VALUE_UNIT,
  description: `${description} In the record's value_unit.`,
  ...(nullable ? { nullable } : {}),
});
const kpa = (name: string, description: string, nullable = false): Field => ({
  name,
  type: "number",
  unit: "kPa",
  minimum: 0,
  maximum: 2000,
  description,
  ...(nullable ? { nullable } : {}),
});
const trigger: Field = {
  name: "trigger",
  type: "string",
  enum: keys(TRIGGER_LABELS),
  description: "Full trigger, or the lightest steady blow the trigger can hold.",
};
const inlet: Field = {
  name: "inlet",
  type: "string",
  enum: keys(INLET_LABELS),
  description:
    "Inlet regulated at the tool to inlet_kpa, or an open line from a regulator set to inlet_kpa with a declared hose and couplers.",
};
const setInlet: Field = {
  name: "inlet_kpa",
  type: "number",
  unit: "kPa",
  minimum: 100,
  maximum: 1400,
  description:
    "The protocol's pressure, gauge: at the tool inlet when regulated, the regulator setting on an open line.",
};

export const BENCH_TRIAL_FIELDS: Field[] = [
  { name: "trial", type: "integer", minimum: 1, maximum: 20, description: "The trial's number within its series." },
  {
    name: "source",
    type: "string",
    enum: ["typed", "trace"],
    description: "Peaks typed in by the filer, or found by Bayproof's analysis of the raw trace the filer uploaded.",
  },
  { name: "blows", type: "integer", minimum: 1, description: "Blows (or impacts) counted in the trial." },
  {
    name: "peaks",
    type: "number-array",
    unit: VALUE_UNIT,
    description:
      "Each blow's peak, in order, after the protocol's discarded blows, in the run's value_unit (rounded to 0.1). In CSV, a JSON array.",
  },
  value("mean_peak", "Mean of the trial's peaks: the trial's value (the trial is the unit of replication)."),
  value("median_peak", "Median of the peaks."),
  value("p10_peak", "10th percentile of the peaks (linear interpolation, Hyndman & Fan type 7)."),
  value("p90_peak", "90th percentile of the peaks."),
  {
    name: "blows_per_minute",
    type: "number",
    nullable: true,
    unit: "1/min",
    minimum: 0,
    description: "Blow rate measured from the spacing of the trace's blows; null where none was measured.",
  },
  {
    name: "trace_rate_hz",
    type: "number",
    nullable: true,
    unit: "Hz",
    minimum: 100,
    maximum: 100000,
    description: "Sample rate of the raw trace; null for typed peaks.",
  },
  {
    name: "trace_url",
    type: "string",
    nullable: true,
    description:
      "Link to the raw trace (CSV of time and force or torque; redirects to the file); null for typed peaks.",
  },
];

export const BENCH_SERIES_FIELDS: Field[] = [
  id("series", "The protocol series' id (see the protocol's series in /api/v1/bench-protocols)."),
  { name: "position", type: "integer", minimum: 1, maximum: 12, description: "The series' place in the protocol." },
  { name: "label", type: "string", description: "What the series does, in the protocol's words." },
  trigger,
  inlet,
  setInlet,
  kpa("static_inlet_kpa", "Pressure at the tool inlet with the tool stopped, gauge, as measured in this run."),
  kpa("running_inlet_kpa", "Pressure at the tool inlet while the tool ran, gauge, as measured in this run."),
  value("mean", "Mean of the trial means; null with no trial.", true),
  value("lower", "Lower limit of the t interval of that mean (95 %); null under two trials.", true),
  value("upper", "Upper limit of the same; null under two trials.", true),
  {
    name: "trials",
    type: "object-array",
    description: "The series' trials, in order.",
    fields: BENCH_TRIAL_FIELDS,
  },
];

const RUN_HEAD: Field[] = [
  id("id", "The bench run's number; stable, and the key of /api/v1/bench-runs/{id}."),
  {
    name: "accepted_at",
    type: "datetime",
    description: "When a moderator accepted the run (UTC, microseconds). With id, the feed's sort order.",
  },
  { name: "version", type: "integer", minimum: 1, description: "Which submitted version of the run was accepted." },
  slug("model", "Tool model slug (see /api/v1/models)."),
  slug("maker", "Maker slug."),
  slug("category", "Tool category slug."),
  id("rig", "The rig the run was measured on (see /api/v1/rigs)."),
  slug("protocol", "The protocol's slug (see /api/v1/bench-protocols)."),
  { name: "protocol_version", type: "integer", minimum: 1, description: "The protocol version the run followed." },
  quantity,
  valueUnit,
  { name: "unit_serial", type: "string", description: "Serial number of the tool unit measured." },
  { name: "unit_condition", type: "string", enum: ["new", "used"], description: "Whether the unit was new or used." },
  {
    name: "unit_hours",
    type: "number",
    nullable: true,
    unit: "h",
    minimum: 0,
    maximum: 100000,
    description: "Hours of use of a used unit, where known; null when unknown, 0 or null for a new one.",
  },
  { name: "run_on", type: "date", description: "The day the run was measured." },
  pseudonym("operator", "Who filed the run (the rig's owner)."),
  {
    name: "ambient_c",
    type: "number",
    unit: "°C",
    minimum: -30,
    maximum: 60,
    description: "Ambient temperature during the run, in degrees Celsius.",
  },
  {
    name: "check_standard_in_control",
    type: "boolean",
    description:
      "False when the rig's check-standard reading of that session fell outside its control limits (the run was held for review, and a moderator accepted it all the same).",
  },
];

export const BENCH_RUN_FIELDS: Field[] = [
  ...RUN_HEAD,
  {
    name: "series",
    type: "object-array",
    description: "The run's series, in the protocol's order, each with its trials.",
    fields: BENCH_SERIES_FIELDS,
  },
];

/**
 * One row of bench-runs.csv: a trial, with its run's and series' columns repeated. The run's id is
 * `run`; the series' columns carry a `series_` prefix.
 */
export const BENCH_TRIAL_ROW_FIELDS: Field[] = [
  ...RUN_HEAD.map((f) => (f.name === "id" ? { ...f, name: "run", description: "The bench run's number." } : f)),
  ...BENCH_SERIES_FIELDS.filter((f) => f.name !== "trials").map((f) =>
    f.name === "series" ? f : { ...f, name: `series_${f.name}` },
  ),
  ...BENCH_TRIAL_FIELDS,
];

const CALIBRATION_FIELDS: Field[] = [
  { name: "calibrated_on", type: "date", description: "The day of the calibration." },
  { name: "verified", type: "boolean", description: "Whether a moderator has verified the calibration." },
  {
    name: "expires_on",
    type: "date",
    description: "The day the calibration stops counting (calibrated_on plus the rig's calibration_max_age_months).",
  },
  {
    name: "degree",
    type: "integer",
    minimum: 1,
    maximum: 2,
    description: "The least-squares fit: 1 for a straight line, 2 where the residuals called for a quadratic.",
  },
  {
    name: "coefficients",
    type: "number-array",
    description: "reading = c0 + c1·reference (+ c2·reference²), reference and reading in the rig's value_unit.",
  },
  value("residual_sd", "Residual standard deviation of the fit."),
  {
    name: "r_squared",
    type: "number",
    nullable: true,
    minimum: 0,
    maximum: 1,
    description: "Coefficient of determination of the fit.",
  },
  { name: "points", type: "integer", minimum: 3, description: "Reference loads (or torques) in the calibration." },
];

export const RIG_FIELDS: Field[] = [
  id("id", "The rig's number; the rig of a bench run."),
  { name: "name", type: "string", description: "The rig's name, as its owner gave it." },
  {
    name: "kind",
    type: "string",
    enum: keys(RIG_KIND_LABELS),
    description: "Percussive force rig, or impact torque fixture.",
  },
  {
    name: "sensor_kind",
    type: "string",
    enum: ["load_cell", "torque_transducer"],
    description: "A force rig reads a load cell; a torque fixture, a torque transducer.",
  },
  valueUnit,
  { ...value("sensor_capacity", "The sensor's rated capacity."), minimum: 0, minimumExclusive: true },
  {
    name: "sample_rate_hz",
    type: "number",
    unit: "Hz",
    minimum: 100,
    maximum: 100000,
    description: "The sensor's sample rate.",
  },
  { name: "fixture", type: "string", description: "The anvil or fixture the tool works against." },
  {
    name: "shop_name",
    type: "string",
    nullable: true,
    description: "The shop the rig belongs to, where one is named.",
  },
  { name: "shop_city", type: "string", nullable: true, description: "The shop's city." },
  pseudonym("owner", "The rig's owner."),
  {
    name: "calibration_status",
    type: "string",
    enum: keys(RIG_STATUS_LABELS),
    description:
      "current: the latest calibration is verified and within its age (runs count); unverified: awaiting a moderator; expired: older than its age; uncalibrated: none on record. As of the answer.",
  },
  {
    name: "calibration_max_age_months",
    type: "integer",
    minimum: 1,
    maximum: 36,
    description: "How long a verified calibration counts.",
  },
  {
    name: "calibration",
    type: "object",
    nullable: true,
    description: "The latest calibration; null where there is none.",
    fields: CALIBRATION_FIELDS,
  },
  {
    ...slug(
      "check_model",
      "The reference tool the rig measures at the start of every session; null where none is named.",
    ),
    nullable: true,
  },
  { name: "last_check_on", type: "date", nullable: true, description: "The latest check-standard session." },
  {
    name: "last_check_in_control",
    type: "boolean",
    nullable: true,
    description: "Whether that session's reading fell within the individuals chart's 3-sigma limits.",
  },
  { name: "accepted_runs", type: "integer", minimum: 0, description: "Accepted bench runs measured on the rig." },
];

const PROTOCOL_SERIES_FIELDS: Field[] = [
  id("id", "The series' id: the series of a bench run and of a bench figure."),
  { name: "position", type: "integer", minimum: 1, maximum: 12, description: "The series' place in the protocol." },
  { name: "label", type: "string", description: "What the series does." },
  trigger,
  inlet,
  setInlet,
  {
    name: "hose_length_m",
    type: "number",
    nullable: true,
    unit: "m",
    minimum: 0,
    minimumExclusive: true,
    maximum: 100,
    description: "Open line: hose length between regulator and tool; null when regulated at the tool.",
  },
  {
    name: "hose_id_mm",
    type: "number",
    nullable: true,
    unit: "mm",
    minimum: 4,
    maximum: 25,
    description: "Open line: hose inside diameter.",
  },
  {
    name: "coupler_count",
    type: "integer",
    nullable: true,
    minimum: 0,
    maximum: 10,
    description: "Open line: couplers between regulator and tool.",
  },
  {
    name: "coupler_profile",
    type: "string",
    nullable: true,
    enum: COUPLER_PROFILES,
    description: "Open line: the couplers' profile.",
  },
];

export const BENCH_PROTOCOL_FIELDS: Field[] = [
  slug("slug", "The protocol's slug; with version, its key."),
  {
    name: "version",
    type: "integer",
    minimum: 1,
    description: "The version; a change to a frozen version is a new one.",
  },
  { name: "title", type: "string", description: "The protocol's title." },
  slug("category", "The tool category it is for."),
  quantity,
  valueUnit,
  {
    name: "trials_per_series",
    type: "integer",
    minimum: 2,
    maximum: 20,
    description: "Trials in each series.",
  },
  {
    name: "blows_per_trial",
    type: "integer",
    nullable: true,
    minimum: 5,
    maximum: 2000,
    description: "Blows counted in a trial; null where a trial is timed instead.",
  },
  {
    name: "seconds_per_trial",
    type: "number",
    nullable: true,
    unit: "s",
    minimum: 0,
    minimumExclusive: true,
    maximum: 120,
    description: "Length of a timed trial; null where a trial counts blows instead.",
  },
  {
    name: "blows_discarded",
    type: "integer",
    minimum: 0,
    maximum: 100,
    description: "Blows left out at the start of each trial.",
  },
  { name: "attachment", type: "string", description: "The bit or socket used." },
  { name: "warm_up", type: "string", description: "How the tool is warmed up." },
  { name: "oiling", type: "string", description: "How the tool is oiled." },
  { name: "summary", type: "string", description: "The protocol in a few sentences." },
  { name: "frozen", type: "boolean", description: "Whether a run uses this version (it can then never change)." },
  { name: "frozen_at", type: "datetime", nullable: true, description: "When the first run froze it." },
  { name: "accepted_runs", type: "integer", minimum: 0, description: "Accepted bench runs under this version." },
  {
    name: "series",
    type: "object-array",
    description: "The series every run measures, in order.",
    fields: PROTOCOL_SERIES_FIELDS,
  },
];

const SLOPE_FIELDS: Field[] = [
  {
    name: "slope",
    type: "number",
    unit: "N/kPa or N·m/kPa",
    description: "Change of the full-trigger force (or torque) per kPa of running inlet pressure.",
  },
  {
    name: "slope_lower",
    type: "number",
    unit: "N/kPa or N·m/kPa",
    description: "Lower limit of the slope (t interval).",
  },
  { name: "slope_upper", type: "number", unit: "N/kPa or N·m/kPa", description: "Upper limit of the slope." },
  value("intercept", "The line's value at 0 kPa (a parameter of the line, not a prediction)."),
  {
    name: "at_kpa",
    type: "number",
    unit: "kPa",
    description: "The pressure of the prediction below, gauge: the rating point, 620.5 kPa (90 psi).",
  },
  value("predicted", "Predicted force (or torque) at at_kpa."),
  value("predicted_lower", "Lower limit of the predicted mean (t interval)."),
  value("predicted_upper", "Upper limit of the predicted mean."),
  value("residual_sd", "Residual standard deviation of the line."),
  { name: "n", type: "integer", minimum: 3, description: "Runs (points) in the fit." },
  { name: "confidence", type: "number", minimum: 0, maximum: 1, description: "Confidence level of the intervals." },
];

export const BENCH_FIGURE_FIELDS: Field[] = [
  slug("model", "Tool model slug."),
  slug("protocol", "Protocol slug."),
  { name: "protocol_version", type: "integer", minimum: 1, description: "Protocol version." },
  id("series", "The protocol series' id."),
  { name: "series_label", type: "string", description: "What the series does." },
  trigger,
  inlet,
  setInlet,
  {
    name: "figure",
    type: "string",
    enum: ["force", "trigger_range"],
    description:
      "force: the series' mean force (or torque) across runs; trigger_range: full trigger minus this lightest-steady series, per run, across runs.",
  },
  quantity,
  valueUnit,
  value("estimate", "Pooled estimate across runs (random effects)."),
  value("lower", "Lower limit of the pooled estimate's interval."),
  value("upper", "Upper limit of the pooled estimate's interval."),
  { ...value("standard_error", "Standard error of the pooled estimate."), minimum: 0 },
  {
    name: "tau2",
    type: "number",
    unit: "N² or (N·m)²",
    minimum: 0,
    description: "Between-run variance τ² (DerSimonian–Laird): how far rigs and units differ beyond their trials.",
  },
  {
    name: "i2",
    type: "number",
    minimum: 0,
    maximum: 1,
    description: "I²: the share of the spread between runs not explained by within-run variation.",
  },
  value("prediction_lower", "Lower limit of the prediction interval for the next rig; null under three runs.", true),
  value("prediction_upper", "Upper limit of the same; null under three runs.", true),
  {
    name: "method",
    type: "string",
    enum: ["DerSimonian-Laird", "DerSimonian-Laird with Hartung-Knapp-Sidik-Jonkman"],
    description: "How the runs were combined; Hartung–Knapp–Sidik–Jonkman where there are few runs.",
  },
  { name: "confidence", type: "number", minimum: 0, maximum: 1, description: "Confidence level of the intervals." },
  {
    name: "runs",
    type: "integer",
    minimum: 1,
    description: "Accepted runs combined (on rigs whose calibration counts).",
  },
  { name: "rigs", type: "integer", minimum: 1, description: "Rigs behind those runs." },
  { name: "computed_at", type: "datetime", description: "When the figure was last computed (UTC)." },
  {
    name: "pressure_slope",
    type: "object",
    nullable: true,
    description:
      "The model's full-trigger force against running inlet pressure under this protocol version (simple linear regression), on its full-trigger force figures where runs at several pressures allow one; null otherwise.",
    fields: SLOPE_FIELDS,
  },
];
