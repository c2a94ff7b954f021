// The open feed's record types, field by field: the one description from which the JSON Schemas,
// the OpenAPI document, the Data Package's Table Schemas, the CSV columns and the /data page's
// dictionary are all made. Units are SI throughout.
import {
  BIT_RETAINERS,
  CORROSION_LEVELS,
  COUPLER_PROFILES,
  FITTINGS,
  INLET_SOURCES,
  type Range,
  RANGES,
  OUTCOMES,
  SLUG_PATTERN,
  SPEC_SOURCES,
  VEHICLE_CLASSES,
} from "~/domain";
import {
  BENCH_FIGURE_FIELDS,
  BENCH_PROTOCOL_FIELDS,
  BENCH_RUN_FIELDS,
  BENCH_TRIAL_ROW_FIELDS,
  RIG_FIELDS,
} from "./bench-fields";

export type FieldType =
  | "integer"
  | "number"
  | "string"
  | "boolean"
  | "datetime"
  | "date"
  | "string-array"
  | "number-array"
  | "object"
  | "object-array";

export interface Field {
  name: string;
  type: FieldType;
  description: string;
  nullable?: boolean;
  /** SI unit symbol, where the value is a quantity. */
  unit?: string;
  enum?: readonly string[];
  minimum?: number;
  /** The value must be more than `minimum` (JSON Schema's exclusiveMinimum). */
  minimumExclusive?: boolean;
  maximum?: number;
  pattern?: string;
  /** For "object" fields, and each item of an "object-array": their own fields. */
  fields?: Field[];
}

const slug = (name: string, description: string): Field => ({
  name,
  type: "string",
  pattern: SLUG_PATTERN,
  description,
});
/** A field's unit and range, as the forms check them (app/domain/ranges.ts). */
const within = ({ unit, min, max, aboveMin }: Range) => ({
  ...(unit ? { unit } : {}),
  minimum: min,
  maximum: max,
  ...(aboveMin ? { minimumExclusive: true } : {}),
});

export const REPORT_FIELDS: Field[] = [
  {
    name: "id",
    type: "integer",
    minimum: 1,
    description: "The report's number; stable, and the key of /api/v1/reports/{id}.",
  },
  slug("model", "Tool model slug (see /api/v1/models)."),
  slug("maker", "Maker slug."),
  slug("category", "Tool category slug."),
  slug("job", "Job type slug (see /api/v1/job-types)."),
  {
    name: "reporter",
    type: "string",
    pattern: "^rp_[0-9a-f]{16}$",
    description: "Pseudonymous reporter id: stable across reports of one person, unrelated to their account.",
  },
  {
    name: "accepted_at",
    type: "datetime",
    description: "When a moderator accepted the report (UTC, microseconds). With id, the feed's sort order.",
  },
  { name: "version", type: "integer", minimum: 1, description: "Which submitted version of the report was accepted." },
  {
    name: "vehicle_class",
    type: "string",
    enum: VEHICLE_CLASSES,
    description: "Class of vehicle or machine worked on.",
  },
  {
    name: "component_age_years",
    type: "number",
    nullable: true,
    ...within(RANGES.componentAge),
    description: "Age of the part worked on, in years.",
  },
  {
    name: "corrosion_level",
    type: "string",
    enum: CORROSION_LEVELS,
    description: "Corrosion of the joint, as the reporter judged it.",
  },
  { name: "attachment", type: "string", nullable: true, description: "Bit or socket used, in the reporter's words." },
  {
    name: "attachment_length_mm",
    type: "number",
    nullable: true,
    ...within(RANGES.attachmentLength),
    description: "Length of the bit or extension, in millimetres.",
  },
  {
    name: "regulator_kpa",
    type: "number",
    ...within(RANGES.gaugePressure),
    description: "Regulator set pressure, gauge, in kilopascals.",
  },
  {
    name: "inlet_kpa",
    type: "number",
    ...within(RANGES.gaugePressure),
    description: "Pressure at the tool inlet under load, gauge, in kilopascals.",
  },
  { name: "inlet_source", type: "string", enum: INLET_SOURCES, description: "How the inlet pressure was obtained." },
  {
    name: "hose_id_mm",
    type: "number",
    ...within(RANGES.hoseBore),
    description: "Hose inside diameter, in millimetres.",
  },
  { name: "hose_length_m", type: "number", ...within(RANGES.hoseLength), description: "Hose length, in metres." },
  {
    name: "coupler_profile",
    type: "string",
    nullable: true,
    enum: COUPLER_PROFILES,
    description: "Quick-coupler profile on the line.",
  },
  {
    name: "coupler_count",
    type: "integer",
    ...within(RANGES.couplerCount),
    description: "Number of couplers between regulator and tool.",
  },
  {
    name: "compressor_lps",
    type: "number",
    nullable: true,
    ...within(RANGES.compressorDelivery),
    description: "Compressor free-air delivery, in litres per second.",
  },
  {
    name: "tank_l",
    type: "number",
    nullable: true,
    ...within(RANGES.tankVolume),
    description: "Receiver (tank) volume, in litres.",
  },
  { name: "outcome", type: "string", enum: OUTCOMES, description: "How the job ended." },
  {
    name: "time_to_result_s",
    type: "number",
    ...within(RANGES.timeToResult),
    description: "Time from first blow to the result, in seconds.",
  },
  { name: "attempts", type: "integer", ...within(RANGES.attempts), description: "Separate attempts made." },
  {
    name: "trigger_control",
    type: "integer",
    nullable: true,
    ...within(RANGES.triggerControl),
    description: "Reporter's rating of trigger control, 1 (poor) to 5 (fine).",
  },
  { name: "notes", type: "string", nullable: true, description: "The reporter's notes, as accepted." },
  {
    name: "evidence_count",
    type: "integer",
    minimum: 0,
    description: "Video and photo files that came with the report.",
  },
  {
    name: "evidence_urls",
    type: "string-array",
    description:
      "Links to the evidence files the reporter chose to publish (each redirects to the file). In CSV, a JSON array.",
  },
];

/** A catalogue figure (null: not known yet) and the field saying where it came from. */
const sourced = (name: string, source: string, f: Omit<Field, "name" | "type" | "nullable">): Field[] => [
  { name, type: "number", nullable: true, ...f },
  {
    name: source,
    type: "string",
    nullable: true,
    enum: SPEC_SOURCES,
    description: `Where ${name} came from: the maker's sheet, measured, or estimated; null when ${name} is.`,
  },
];

export const MODEL_FIELDS: Field[] = [
  slug("slug", "The model's slug; its key."),
  slug("maker", "Maker slug."),
  { name: "maker_name", type: "string", description: "Maker name." },
  slug("category", "Tool category slug."),
  { name: "model_code", type: "string", description: "The maker's model code." },
  { name: "name", type: "string", description: "The model's name." },
  { name: "fitting", type: "string", enum: FITTINGS, description: "Bit shank (inches) or square drive size." },
  {
    name: "bore_mm",
    type: "number",
    nullable: true,
    unit: "mm",
    minimum: 0,
    description: "Piston bore, in millimetres.",
  },
  {
    name: "stroke_mm",
    type: "number",
    nullable: true,
    unit: "mm",
    minimum: 0,
    description: "Piston stroke, in millimetres.",
  },
  {
    name: "blows_per_minute",
    type: "number",
    nullable: true,
    unit: "1/min",
    minimum: 0,
    description: "Blow rate at rated pressure.",
  },
  {
    name: "free_speed_rpm",
    type: "number",
    nullable: true,
    unit: "1/min",
    minimum: 0,
    description: "Free speed at rated pressure.",
  },
  {
    name: "max_torque_nm",
    type: "number",
    nullable: true,
    unit: "N·m",
    minimum: 0,
    description: "Maker's maximum torque, in newton metres.",
  },
  { name: "weight_kg", type: "number", unit: "kg", minimum: 0, description: "Weight, in kilograms." },
  { name: "length_mm", type: "number", unit: "mm", minimum: 0, description: "Overall length, in millimetres." },
  {
    name: "street_price_cents",
    type: "integer",
    nullable: true,
    minimum: 0,
    description: "Typical street price in US cents (demo figures are invented).",
  },
  { name: "air_inlet", type: "string", description: "Air inlet thread." },
  {
    name: "rated_air_lps",
    type: "number",
    unit: "L/s",
    minimum: 0,
    description: "Rated air consumption, free air, in litres per second at 620.5 kPa (90 psi) inlet.",
  },
  {
    name: "max_inlet_kpa",
    type: "number",
    unit: "kPa",
    minimum: 0,
    description: "Maker's maximum inlet pressure, gauge, in kilopascals.",
  },
  ...sourced("running_air_lps", "running_air_source", {
    unit: "L/s",
    minimum: 0,
    minimumExclusive: true,
    description:
      "Air use while the tool runs (hammering, impacting), free air, in litres per second at 620.5 kPa (90 psi) inlet.",
  }),
  {
    name: "running_air_factor",
    type: "number",
    nullable: true,
    minimum: 1,
    maximum: 10,
    description: "Where running_air_source is estimated: running air use = rated_air_lps × this factor; else null.",
  },
  ...sourced("vibration_ahv_ms2", "vibration_source", {
    ...within(RANGES.vibrationTotal),
    description: "Declared vibration total value a_hv (ISO 28927), in metres per second squared.",
  }),
  {
    name: "vibration_k_ms2",
    type: "number",
    nullable: true,
    ...within(RANGES.vibrationK),
    description: "Uncertainty K of the declared a_hv, in metres per second squared.",
  },
  {
    name: "vibration_iso28927_part",
    type: "integer",
    nullable: true,
    ...within(RANGES.iso28927Part),
    description:
      "The part of ISO 28927 (the vibration test code) a_hv was measured under; always given for a maker's sheet.",
  },
  ...sourced("sound_pressure_db", "sound_pressure_source", {
    ...within(RANGES.soundPressure),
    description: "Declared A-weighted emission sound pressure level L_pA (ISO 15744), in decibels.",
  }),
  {
    name: "sound_pressure_k_db",
    type: "number",
    nullable: true,
    ...within(RANGES.soundK),
    description: "Uncertainty K of L_pA, in decibels.",
  },
  ...sourced("sound_power_db", "sound_power_source", {
    ...within(RANGES.soundPower),
    description: "Declared A-weighted sound power level L_WA (ISO 15744), in decibels.",
  }),
  {
    name: "sound_power_k_db",
    type: "number",
    nullable: true,
    ...within(RANGES.soundK),
    description: "Uncertainty K of L_WA, in decibels.",
  },
  {
    name: "bit_retainer",
    type: "string",
    nullable: true,
    enum: BIT_RETAINERS,
    description: "The bit (or socket) retainer the tool comes with; null where not known.",
  },
  ...sourced("weight_with_whip_kg", "weight_with_whip_source", {
    ...within(RANGES.weightWithWhip),
    description: "Weight with the hose whip fitted, in kilograms (never below weight_kg).",
  }),
  {
    name: "measured_specs",
    type: "string-array",
    description: "Spec fields measured by Bayproof rather than taken from the maker's sheet.",
  },
  { name: "accepted_reports", type: "integer", minimum: 0, description: "Accepted reports of this model in the feed." },
];

export const JOB_TYPE_FIELDS: Field[] = [
  slug("slug", "The job type's slug; its key."),
  slug("category", "Tool category slug the job belongs to."),
  { name: "name", type: "string", description: "The job's name." },
  { name: "description", type: "string", description: "What the job is." },
  { name: "seized", type: "boolean", description: "Whether the job is about freeing a seized part." },
];

const proportion = { type: "number" as const, minimum: 0, maximum: 1 };

const interval = (what: string, unit?: string): Field[] => [
  {
    name: "lower",
    type: "number",
    nullable: true,
    unit,
    description: `Lower limit of ${what}; null where the data cannot reach the stated level.`,
  },
  {
    name: "upper",
    type: "number",
    nullable: true,
    unit,
    description: `Upper limit of ${what}; null where the data cannot reach the stated level.`,
  },
];

export const STAT_FIELDS: Field[] = [
  slug("model", "Tool model slug."),
  slug("job", "Job type slug."),
  {
    name: "n",
    type: "integer",
    minimum: 1,
    description: "Accepted reports in the figures (reports set aside are not counted here).",
  },
  { name: "successes", type: "integer", minimum: 0, description: "Reports with outcome freed." },
  { name: "estimate", ...proportion, description: "Success rate, successes / n." },
  { name: "lower", ...proportion, description: "Lower limit of the interval." },
  { name: "upper", ...proportion, description: "Upper limit of the interval." },
  {
    name: "method",
    type: "string",
    enum: ["wilson_score"],
    description:
      "Interval method: the Wilson score interval worked at the effective sample size n / design_effect (Korn & Graubard 1998).",
  },
  { name: "confidence", ...proportion, description: "Confidence level of the intervals." },
  {
    name: "reporters",
    type: "integer",
    minimum: 1,
    description: "Reporters behind the n reports (the clusters of the design effect).",
  },
  {
    name: "design_effect",
    type: "number",
    minimum: 1,
    description:
      "Cluster-robust variance of the rate over the binomial variance, reports clustered by reporter, floored at 1.",
  },
  { name: "effective_n", type: "number", description: "n / design_effect: the sample size the interval is worked at." },
  {
    name: "set_aside",
    type: "integer",
    minimum: 0,
    description:
      "Accepted reports flagged as run above the tool's rated inlet pressure: listed in the feed, kept out of every figure here.",
  },
  {
    name: "time_freed",
    type: "object",
    nullable: true,
    description:
      "Median time of the jobs freed (the tool alone), with the distribution-free order-statistic interval; null with no freed job.",
    fields: [
      { name: "n", type: "integer", minimum: 1, description: "Times in the median." },
      { name: "median", type: "number", unit: "s", description: "Median time to result of the jobs freed." },
      ...interval("the order-statistic interval (null with 5 times or fewer at 95 %)", "s"),
      {
        name: "coverage",
        type: "number",
        nullable: true,
        minimum: 0,
        maximum: 1,
        description: "Exact achieved coverage of the interval under Binomial(n, 1/2), never below confidence.",
      },
      { name: "method", type: "string", enum: ["order_statistic"], description: "How the interval was computed." },
    ],
  },
  {
    name: "time_to_free",
    type: "object",
    nullable: true,
    description:
      "Kaplan–Meier median time to free it, counting give-ups: jobs not freed and freed with help are censored at the time reported.",
    fields: [
      { name: "n", type: "integer", minimum: 1, description: "Reports in the curve." },
      { name: "censored", type: "integer", minimum: 0, description: "Of them, jobs the tool gave up on (censored)." },
      {
        name: "median",
        type: "number",
        nullable: true,
        unit: "s",
        description: "Median time to free it; null where the curve does not reach one half.",
      },
      ...interval("the Brookmeyer–Crowley interval (log-log)", "s"),
      {
        name: "method",
        type: "string",
        enum: ["kaplan_meier_brookmeyer_crowley"],
        description: "How it was computed.",
      },
    ],
  },
  {
    name: "pressure_adjusted",
    type: "object",
    nullable: true,
    description:
      "Success predicted at the reference inlet pressure by the job's pooled logistic fit, where 620.5 kPa lies between the 10th and 90th percentile of the model's known inlet pressures on the job; null otherwise (see pressure_adjusted_reason).",
    fields: [
      {
        name: "inlet_kpa",
        type: "number",
        unit: "kPa",
        description: "The reference inlet pressure (620.5 kPa, 90 psi).",
      },
      { name: "estimate", ...proportion, description: "Predicted success at that pressure." },
      { name: "lower", ...proportion, description: "Lower limit (Wald interval on the logit scale)." },
      { name: "upper", ...proportion, description: "Upper limit." },
      {
        name: "method",
        type: "string",
        enum: ["pooled_logistic_firth_wald"],
        description:
          "How it was computed: one Firth-penalised logistic fit per job type, an intercept per model, a common slope on inlet pressure.",
      },
    ],
  },
  {
    name: "pressure_adjusted_reason",
    type: "string",
    nullable: true,
    description: "Why there is no pressure-adjusted figure, when there is none.",
  },
  {
    name: "pressure_fit",
    type: "object",
    nullable: true,
    description:
      "The job's pooled pressure fit as it bears on this model; null where the job has no fit or the model no report with a known inlet pressure.",
    fields: [
      {
        name: "job_reports",
        type: "integer",
        minimum: 0,
        description: "Inlet-measured reports in the job's fit (all models).",
      },
      { name: "job_models", type: "integer", minimum: 0, description: "Models in the job's fit." },
      {
        name: "slope_per_bar",
        type: "number",
        description: "Common slope: change in the log-odds of freeing per bar of inlet pressure.",
      },
      { name: "slope_se", type: "number", description: "Standard error of the slope." },
      {
        name: "model_reports",
        type: "integer",
        minimum: 1,
        description: "This model's reports with a known inlet pressure in the fit.",
      },
      {
        name: "p10_kpa",
        type: "number",
        unit: "kPa",
        description: "10th percentile of this model's known inlet pressures on the job.",
      },
      { name: "p90_kpa", type: "number", unit: "kPa", description: "90th percentile of the same." },
      { name: "min_kpa", type: "number", unit: "kPa", description: "Lowest of the same." },
      { name: "max_kpa", type: "number", unit: "kPa", description: "Highest of the same." },
    ],
  },
  {
    name: "order",
    type: "object",
    description:
      "Where the model stands on the job's page and how it compares with the job's top tool: the same rule drives the job page and /compare.",
    fields: [
      { name: "position", type: "integer", minimum: 1, description: "Position on the job page (1 = first)." },
      {
        name: "job_basis",
        type: "string",
        enum: ["pressure_adjusted", "rate"],
        description:
          "What the job's list is ordered by: the lower limit of pressure_adjusted where the job has a fit, else the lower limit of the rate.",
      },
      {
        name: "ordered_by",
        type: "string",
        enum: ["pressure_adjusted", "rate"],
        description: "What this model was ordered by (models without a pressure-adjusted figure follow by their rate).",
      },
      {
        name: "mark",
        type: "string",
        enum: ["top", "not_told_apart", "behind", "ahead", "too_few"],
        description:
          "Against the job's top tool: the top tool itself; can't be told apart yet; behind it; ahead of it though ordered below; too few reports (under 10) to compare.",
      },
      {
        ...slug("top_model", "The job's top tool (the first with 10 reports or more); null where none has 10."),
        nullable: true,
      },
      {
        name: "told_apart_from_top",
        type: "boolean",
        nullable: true,
        description:
          "Whether the difference interval with the top tool excludes 0; null for the top tool and for too few reports.",
      },
    ],
  },
  {
    name: "difference_from_top",
    type: "object",
    nullable: true,
    description: "Top tool's rate minus this model's, with its interval; null where not compared.",
    fields: [
      { name: "estimate", type: "number", minimum: -1, maximum: 1, description: "Difference of rates." },
      { name: "lower", type: "number", minimum: -1, maximum: 1, description: "Lower limit." },
      { name: "upper", type: "number", minimum: -1, maximum: 1, description: "Upper limit." },
      {
        name: "method",
        type: "string",
        enum: ["newcombe_hybrid_score_effective_n"],
        description: "Newcombe's hybrid score interval with each rate's Wilson limits at its effective sample size.",
      },
    ],
  },
  { name: "computed_at", type: "datetime", description: "When the cell was last computed (UTC)." },
];

export const RECORD_TYPES = {
  report: { title: "Accepted report", fields: REPORT_FIELDS, key: "id" },
  model: { title: "Tool model", fields: MODEL_FIELDS, key: "slug" },
  "job-type": { title: "Job type", fields: JOB_TYPE_FIELDS, key: "slug" },
  stat: { title: "Stats cell (one tool model on one job type)", fields: STAT_FIELDS, key: null },
  "bench-run": { title: "Accepted bench run", fields: BENCH_RUN_FIELDS, key: "id" },
  "bench-trial-row": {
    title: "Bench trial (one row of bench-runs.csv, with its run and series)",
    fields: BENCH_TRIAL_ROW_FIELDS,
    key: null,
  },
  rig: { title: "Rig", fields: RIG_FIELDS, key: "id" },
  "bench-protocol": { title: "Bench protocol version", fields: BENCH_PROTOCOL_FIELDS, key: null },
  "bench-figure": {
    title: "Bench figure across rigs (one tool model in one protocol series)",
    fields: BENCH_FIGURE_FIELDS,
    key: null,
  },
} as const;

export type RecordType = keyof typeof RECORD_TYPES;
