// The parts of the open-data page (/data) that describe the feed itself: the daily snapshot's files
// and the data dictionary, both made from the feed's own descriptions (app/feed).
import type { SnapshotInfo } from "~/feed/documents";
import { type Field, RECORD_TYPES, type RecordType } from "~/feed/fields";
import { DataTable } from "./ui";

const TYPE_LABEL: Record<Field["type"], string> = {
  integer: "integer",
  number: "number",
  string: "text",
  boolean: "true/false",
  datetime: "date-time (UTC)",
  "string-array": "list of text",
  object: "object",
};

export function SnapshotSection({ snapshot, origin }: { snapshot: SnapshotInfo | null; origin: string }) {
  return (
    <section aria-labelledby="snapshot" className="space-y-2">
      <h2 id="snapshot" className="text-lg font-semibold">
        Daily snapshot
      </h2>
      {!snapshot ? (
        <p className="text-sm text-stone-600">
          The first snapshot has not been written yet. One is written every day at 03:15 UTC.
        </p>
      ) : (
        <>
          <p className="max-w-prose text-sm">
            Every report accepted as of <strong>{snapshot.createdAt.replace("T", " ").slice(0, 19)} UTC</strong> (
            {snapshot.reportCount} reports), gzipped, open to anyone — no account or key. A new snapshot is written
            every day at 03:15 UTC; these links name this one, so the SHA-256 below always matches what you download.
          </p>
          <DataTable
            label="Snapshot files"
            framed={false}
            head={
              <tr className="border-b">
                <th className="py-1 pr-3">File</th>
                <th className="py-1 pr-3">Size</th>
                <th className="py-1">SHA-256</th>
              </tr>
            }
          >
            {snapshot.files.map((f) => (
              <tr key={f.format} className="border-b border-stone-100 align-top">
                <td className="py-1 pr-3">
                  <a className="underline" href={f.path} download>
                    {f.path.split("/").pop()}
                  </a>{" "}
                  <span className="text-stone-500">({f.format.toUpperCase()})</span>
                </td>
                <td className="py-1 pr-3 whitespace-nowrap">{formatBytes(f.bytes)}</td>
                <td className="py-1 break-all font-mono text-xs">{f.sha256}</td>
              </tr>
            ))}
          </DataTable>
          <pre
            tabIndex={0}
            aria-label="Checking a snapshot"
            className="overflow-x-auto rounded bg-stone-900 p-3 text-xs text-stone-100"
          >
            {[
              `curl -s -O '${origin}${snapshot.files[0]!.path}'`,
              `echo '${snapshot.files[0]!.sha256}  reports.${snapshot.files[0]!.format}.gz' | sha256sum -c`,
            ].join("\n")}
          </pre>
        </>
      )}
    </section>
  );
}

/** A file size in the unit a person reads (powers of 1024, as `ls -h` shows them). */
function formatBytes(bytes: number) {
  const units = ["bytes", "KiB", "MiB", "GiB"];
  let value = bytes;
  let unit = 0;
  while (value >= 1024 && unit < units.length - 1) {
    value /= 1024;
    unit++;
  }
  return unit === 0 ? `${bytes} bytes` : `${value.toFixed(1)} ${units[unit]}`;
}

/** Every record type's fields: name, type, SI unit, meaning, allowed values and range. */
export function DataDictionary() {
  return (
    <section aria-labelledby="dictionary" className="space-y-6">
      <h2 id="dictionary" className="text-lg font-semibold">
        Data dictionary
      </h2>
      {(Object.keys(RECORD_TYPES) as RecordType[]).map((type) => (
        <RecordFields key={type} type={type} />
      ))}
    </section>
  );
}

function RecordFields({ type }: { type: RecordType }) {
  const t = RECORD_TYPES[type];
  const rows = t.fields.flatMap((f) => [f, ...(f.fields ?? []).map((g) => ({ ...g, name: `${f.name}.${g.name}` }))]);
  return (
    <div>
      <h3 className="font-semibold">
        {t.title}{" "}
        <a className="text-sm font-normal underline" href={`/api/v1/schema/${type}.json`}>
          {type}.json
        </a>
      </h3>
      <DataTable
        label={`${t.title}: fields`}
        framed={false}
        className="mt-1"
        head={
          <tr className="border-b">
            <th className="py-1 pr-3">Field</th>
            <th className="py-1 pr-3">Type</th>
            <th className="py-1 pr-3">Unit (SI)</th>
            <th className="py-1">Meaning</th>
          </tr>
        }
      >
        {rows.map((f) => (
          <tr key={f.name} className="border-b border-stone-100 align-top">
            <td className="py-1 pr-3 font-mono text-xs">{f.name}</td>
            <td className="py-1 pr-3">
              {TYPE_LABEL[f.type]}
              {f.nullable ? ", may be empty" : ""}
            </td>
            <td className="py-1 pr-3">{f.unit ?? "—"}</td>
            <td className="py-1">
              {f.description}
              {f.enum && <span className="block text-xs text-stone-600">One of: {f.enum.join(", ")}</span>}
              {(f.minimum !== undefined || f.maximum !== undefined) && (
                <span className="block text-xs text-stone-600">
                  Range: {f.minimum ?? "…"} to {f.maximum ?? "…"}
                </span>
              )}
            </td>
          </tr>
        ))}
      </DataTable>
    </div>
  );
}
