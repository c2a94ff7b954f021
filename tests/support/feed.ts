// Calling the open feed as a named client (the stack trusts X-Forwarded-For, so each test file
// counts against its own rate-limit bucket), and checking answers against the feed's own
// published JSON Schemas with ajv.
import Ajv2020 from "ajv/dist/2020.js";
import addFormats from "ajv-formats";
import { baseUrl } from "./http";

let nextClient = 1;
/** A fresh client address from TEST-NET-3 (RFC 5737), so rate limits start from zero. */
export const newClientAddress = () => `203.0.113.${(process.pid % 50) * 5 + nextClient++}`;

export function feedClient(address = newClientAddress(), key?: string) {
  return (path: string, headers: Record<string, string> = {}) =>
    fetch(new URL(path, baseUrl()), {
      redirect: "manual",
      headers: { "x-forwarded-for": address, ...(key ? { authorization: `Bearer ${key}` } : {}), ...headers },
    });
}

export const SCHEMAS = [
  "report",
  "model",
  "job-type",
  "stat",
  "bench-run",
  "bench-trial-row",
  "rig",
  "bench-protocol",
  "bench-figure",
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

/** An ajv (draft 2020-12) loaded with every schema the feed publishes, fetched from it. */
export async function publishedSchemas() {
  const get = feedClient();
  const ajv = new Ajv2020({ strict: true, allErrors: true });
  addFormats(ajv);
  for (const name of SCHEMAS) {
    const res = await get(`/api/v1/schema/${name}.json`);
    if (res.status !== 200) throw new Error(`schema ${name}: ${res.status}`);
    ajv.addSchema(await res.json());
  }
  return (name: (typeof SCHEMAS)[number], value: unknown) => {
    const validate = ajv.getSchema(`${baseUrl()}/api/v1/schema/${name}.json`)!;
    const ok = validate(value);
    return ok ? [] : (validate.errors ?? []).map((e) => `${e.instancePath} ${e.message}`);
  };
}
