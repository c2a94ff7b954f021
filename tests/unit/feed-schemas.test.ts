// The feed's schemas are made from one field list (app/feed/fields.ts): they must compile under
// ajv's strict mode (JSON Schema 2020-12), accept a well-formed record and refuse a wrong one.
import Ajv2020 from "ajv/dist/2020.js";
import addFormats from "ajv-formats";
import { describe, expect, it } from "vitest";
import { tableField } from "../../app/feed/documents";
import { BENCH_TRIAL_ROW_FIELDS } from "../../app/feed/bench-fields";
import { MODEL_FIELDS, REPORT_FIELDS } from "../../app/feed/fields";
import { jsonSchema, SCHEMA_NAMES } from "../../app/feed/schemas";

const origin = "https://bayproof.test";
const ajv = new Ajv2020({ strict: true, allErrors: true });
addFormats(ajv);
for (const name of SCHEMA_NAMES) ajv.addSchema(jsonSchema(name, origin));
const validate = (name: string, value: unknown) => ajv.validate(`${origin}/api/v1/schema/${name}.json`, value);

const report = {
  id: 12,
  model: "brackwater-bh-150",
  maker: "brackwater",
  category: "air-hammer",
  job: "ball-joint-separation",
  reporter: "rp_0123456789abcdef",
  accepted_at: "2026-11-30T08:15:02.123456Z",
  version: 1,
  vehicle_class: "light_truck",
  component_age_years: 9,
  corrosion_level: "heavy",
  attachment: null,
  attachment_length_mm: null,
  regulator_kpa: 758.4,
  inlet_kpa: 610.2,
  inlet_source: "measured_at_inlet",
  hose_id_mm: 9.525,
  hose_length_m: 15.24,
  coupler_profile: null,
  coupler_count: 2,
  compressor_lps: null,
  tank_l: null,
  outcome: "freed",
  time_to_result_s: 42,
  attempts: 1,
  trigger_control: null,
  notes: null,
  evidence_count: 2,
  evidence_urls: [`${origin}/api/v1/evidence/7`],
};

const trial = {
  trial: 1,
  source: "typed",
  blows: 3,
  peaks: [4100.5, 4210, 4050.2],
  mean_peak: 4120.233333333333,
  median_peak: 4100.5,
  p10_peak: 4060.26,
  p90_peak: 4188.1,
  blows_per_minute: null,
  trace_rate_hz: null,
  trace_url: null,
};
const benchRun = {
  id: 4,
  accepted_at: "2026-11-28T10:00:00.000001Z",
  version: 1,
  model: "brackwater-bh-150",
  maker: "brackwater",
  category: "air-hammer",
  rig: 2,
  protocol: "hammer-force-bench",
  protocol_version: 1,
  quantity: "peak_force_n",
  value_unit: "N",
  unit_serial: "BW-0042",
  unit_condition: "used",
  unit_hours: 120,
  run_on: "2026-11-27",
  operator: "rp_0123456789abcdef",
  ambient_c: 19.5,
  check_standard_in_control: true,
  series: [
    {
      series: 11,
      position: 1,
      label: "Full trigger, inlet regulated to 90 psi at the tool",
      trigger: "full",
      inlet: "regulated_at_tool",
      inlet_kpa: 620.5,
      static_inlet_kpa: 621,
      running_inlet_kpa: 598.2,
      mean: 4120.2,
      lower: null,
      upper: null,
      trials: [
        trial,
        {
          ...trial,
          trial: 2,
          source: "trace",
          blows_per_minute: 2950,
          trace_rate_hz: 10000,
          trace_url: `${origin}/api/v1/bench-traces/9`,
        },
      ],
    },
  ],
};

describe("the feed's JSON Schemas", () => {
  it("compile in strict mode, every one of them", () => {
    for (const name of SCHEMA_NAMES) expect(ajv.getSchema(`${origin}/api/v1/schema/${name}.json`), name).toBeTruthy();
  });

  it("accept a well-formed report and a page of them", () => {
    expect(validate("report", report)).toBe(true);
    expect(validate("report-page", { data: [report], next_cursor: null, as_of: "2026-11-30T08:15:00Z" })).toBe(true);
  });

  it("refuse an unknown field, a value out of range, a null where the field is required, a bad slug", () => {
    expect(validate("report", { ...report, email: "x@y.z" })).toBe(false);
    expect(validate("report", { ...report, inlet_kpa: 2500 })).toBe(false);
    expect(validate("report", { ...report, vehicle_class: null })).toBe(false);
    expect(validate("report", { ...report, outcome: "maybe" })).toBe(false);
    expect(validate("report", { ...report, model: "Not A Slug" })).toBe(false);
    expect(validate("report", { ...report, reporter: "rustbelt-ana" })).toBe(false);
    const { notes: _n, ...missing } = report;
    expect(validate("report", missing)).toBe(false);
  });

  it("give each quantity its SI unit in the Table Schema, and leave optional fields unrequired", () => {
    const byName = Object.fromEntries(REPORT_FIELDS.map((f) => [f.name, tableField(f)]));
    expect(byName.hose_length_m).toMatchObject({ type: "number", unit: "m" });
    expect(byName.compressor_lps).toMatchObject({ unit: "L/s" });
    expect(byName.time_to_result_s).toMatchObject({
      unit: "s",
      constraints: { required: true, minimum: 1, maximum: 28800 },
    });
    expect((byName.trigger_control!.constraints as Record<string, unknown>).required).toBeUndefined();
    expect(byName.accepted_at).toMatchObject({ type: "datetime" });
    expect(byName.evidence_urls).toMatchObject({ type: "array" });
  });
});

describe("the bench schemas", () => {
  it("accept a well-formed bench run and a page of them", () => {
    expect(ajv.validate(`${origin}/api/v1/schema/bench-run.json`, benchRun), JSON.stringify(ajv.errors)).toBe(true);
    expect(validate("bench-run-page", { data: [benchRun], next_cursor: "x.y", as_of: "2026-11-30T08:15:00Z" })).toBe(
      true,
    );
  });

  it("refuse an account field, a named operator, a nested unknown field and a bad date", () => {
    expect(validate("bench-run", { ...benchRun, email: "x@y.z" })).toBe(false);
    expect(validate("bench-run", { ...benchRun, operator: "J. Ortega" })).toBe(false);
    expect(validate("bench-run", { ...benchRun, run_on: "27/11/2026" })).toBe(false);
    const [series] = benchRun.series;
    expect(validate("bench-run", { ...benchRun, series: [{ ...series, notes: "x" }] })).toBe(false);
    expect(
      validate("bench-run", { ...benchRun, series: [{ ...series, trials: [{ ...trial, source: "guess" }] }] }),
    ).toBe(false);
  });

  it("describe the CSV's trial rows with the run's and the series' columns, each quantity with its unit", () => {
    const names = BENCH_TRIAL_ROW_FIELDS.map((f) => f.name);
    expect(names.slice(0, 3)).toEqual(["run", "accepted_at", "version"]);
    expect(names).toContain("series_running_inlet_kpa");
    expect(names).not.toContain("series_trials");
    expect(names.at(-1)).toBe("trace_url");
    expect(new Set(names).size).toBe(names.length);
    const byName = Object.fromEntries(BENCH_TRIAL_ROW_FIELDS.map((f) => [f.name, tableField(f)]));
    expect(byName.series_running_inlet_kpa).toMatchObject({ type: "number", unit: "kPa" });
    expect(byName.ambient_c).toMatchObject({ unit: "°C" });
    expect(byName.run_on).toMatchObject({ type: "date" });
    expect(byName.peaks).toMatchObject({ type: "array", unit: "N or N·m" });
    const { series: _s, id, ...run } = benchRun;
    const { trials: _t, series: seriesId, ...s } = benchRun.series[0]!;
    const full = {
      run: id,
      ...run,
      series: seriesId,
      ...Object.fromEntries(Object.entries(s).map(([k, v]) => [`series_${k}`, v])),
      ...trial,
    };
    expect(validate("bench-trial-row", full)).toBe(true);
  });

  it("give the model's declared exposure figures their units and sources", () => {
    const byName = Object.fromEntries(MODEL_FIELDS.map((f) => [f.name, tableField(f)]));
    expect(byName.vibration_ahv_ms2).toMatchObject({ unit: "m/s²", constraints: { maximum: 100 } });
    expect(byName.sound_power_db).toMatchObject({ unit: "dB", constraints: { minimum: 50, maximum: 160 } });
    for (const source of ["vibration_source", "sound_pressure_source", "sound_power_source", "weight_with_whip_source"])
      expect(byName[source]).toMatchObject({ constraints: { enum: ["maker_sheet", "measured", "estimated"] } });
    expect(byName.bit_retainer).toMatchObject({ type: "string" });
  });
});
