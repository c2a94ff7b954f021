// JSON Schemas (2020-12) of the feed's records and responses, made from fields.ts. Published at
// /api/v1/schema/<name>.json; the OpenAPI document embeds the same objects.
import { type Field, RECORD_TYPES, type RecordType } from "./fields";

export const DRAFT_2020_12 = "https://json-schema.org/draft/2020-12/schema";
type Json = Record<string, unknown>;
/** How a schema points at another: a file name next to it, or an OpenAPI component. */
type RefStyle = (name: SchemaName) => string;

export const PAGE_SCHEMAS = [
  "report-page",
  "model-list",
  "job-type-list",
  "stat-list",
  "bench-run-page",
  "rig-list",
  "bench-protocol-list",
  "bench-figure-list",
  "error",
] as const;
export const SCHEMA_NAMES = [...(Object.keys(RECORD_TYPES) as RecordType[]), ...PAGE_SCHEMAS];
export type SchemaName = (typeof SCHEMA_NAMES)[number];

const base: Record<Field["type"], Json> = {
  integer: { type: "integer" },
  number: { type: "number" },
  string: { type: "string" },
  boolean: { type: "boolean" },
  datetime: { type: "string", format: "date-time" },
  date: { type: "string", format: "date" },
  "string-array": { type: "array", items: { type: "string" } },
  "number-array": { type: "array", items: { type: "number" } },
  object: { type: "object" },
  "object-array": { type: "array" },
};

function fieldSchema(f: Field): Json {
  const s: Json = { ...base[f.type], description: f.unit ? `${f.description} Unit: ${f.unit}.` : f.description };
  if (f.fields && f.type === "object-array") s.items = objectOf(f.fields);
  else if (f.fields) Object.assign(s, objectOf(f.fields));
  if (f.enum) s.enum = f.nullable ? [...f.enum, null] : [...f.enum];
  if (f.pattern) s.pattern = f.pattern;
  if (f.minimum !== undefined) s[f.minimumExclusive ? "exclusiveMinimum" : "minimum"] = f.minimum;
  if (f.maximum !== undefined) s.maximum = f.maximum;
  if (f.nullable) s.type = [s.type, "null"];
  return s;
}

function objectOf(fields: Field[]): Json {
  return {
    type: "object",
    additionalProperties: false,
    required: fields.map((f) => f.name),
    properties: Object.fromEntries(fields.map((f) => [f.name, fieldSchema(f)])),
  };
}

const list = (item: SchemaName, ref: RefStyle, extra: Json = {}, required: string[] = []) => ({
  type: "object",
  additionalProperties: false,
  required: ["data", ...required],
  properties: { data: { type: "array", items: { $ref: ref(item) } }, ...extra },
});

/** A page of a cursor walk: the records, the next page's cursor and the walk's fixed horizon. */
const cursorPage = (item: SchemaName, what: string, ref: RefStyle) =>
  list(
    item,
    ref,
    {
      next_cursor: {
        type: ["string", "null"],
        description: "Pass as `cursor` for the next page; null on the last page.",
      },
      as_of: {
        type: "string",
        format: "date-time",
        description: `The walk covers ${what} accepted up to this moment; fixed for all its pages.`,
      },
    },
    ["next_cursor", "as_of"],
  );

function body(name: SchemaName, ref: RefStyle): Json {
  if (name in RECORD_TYPES) {
    const t = RECORD_TYPES[name as RecordType];
    return { title: t.title, ...objectOf(t.fields) };
  }
  switch (name) {
    case "report-page":
      return { title: "A page of accepted reports", ...cursorPage("report", "reports", ref) };
    case "bench-run-page":
      return { title: "A page of accepted bench runs", ...cursorPage("bench-run", "bench runs", ref) };
    case "rig-list":
      return { title: "Rigs", ...list("rig", ref) };
    case "bench-protocol-list":
      return { title: "Bench protocol versions", ...list("bench-protocol", ref) };
    case "bench-figure-list":
      return { title: "Bench figures across rigs", ...list("bench-figure", ref) };
    case "model-list":
      return { title: "Tool models", ...list("model", ref) };
    case "job-type-list":
      return { title: "Job types", ...list("job-type", ref) };
    case "stat-list":
      return { title: "Stats cells", ...list("stat", ref) };
    default:
      return {
        title: "Error",
        type: "object",
        additionalProperties: false,
        required: ["error"],
        properties: {
          error: {
            type: "object",
            additionalProperties: false,
            required: ["code", "message"],
            properties: {
              code: { type: "string", description: "Stable, machine-readable reason." },
              message: { type: "string", description: "What went wrong, for people." },
              parameter: { type: "string", description: "The query parameter at fault, when one is." },
            },
          },
        },
      };
  }
}

/** The published schema document for `name`, with its $id under `origin`. */
export function jsonSchema(name: SchemaName, origin: string): Json {
  return { $schema: DRAFT_2020_12, $id: `${origin}/api/v1/schema/${name}.json`, ...body(name, (n) => `${n}.json`) };
}

/** The same schema as an OpenAPI component, pointing at its siblings by component. */
export function componentSchema(name: SchemaName): Json {
  return body(name, (n) => `#/components/schemas/${n}`);
}

export const isSchemaName = (name: string): name is SchemaName => (SCHEMA_NAMES as readonly string[]).includes(name);
