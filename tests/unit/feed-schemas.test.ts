// The feed's schemas are made from one field list (app/feed/fields.ts): they must compile under
// ajv's strict mode (JSON Schema 2020-12), accept a well-formed record and refuse a wrong one.
import Ajv2020 from "ajv/dist/2020.js";
import addFormats from "ajv-formats";
import { describe, expect, it } from "vitest";
import { tableField } from "../../app/feed/documents";
import { REPORT_FIELDS } from "../../app/feed/fields";
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
