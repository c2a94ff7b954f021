// Protocols: declared, versioned, frozen once a run uses them. A change to a frozen version is a new
// version with the same slug; an unfrozen one is still a draft of its author and may change in place.
import { type Insertable, sql } from "kysely";
import type { Db, Trx } from "../../db/database";
import type { BenchProtocolSeriesTable, BenchProtocolsTable } from "../../db/schema";

function protocolsBase(db: Db) {
  return db
    .selectFrom("bench_protocols as p")
    .innerJoin("tool_categories as c", "c.id", "p.category_id")
    .select([
      "p.id",
      "p.slug",
      "p.version",
      "p.title",
      "p.quantity",
      "p.trials_per_series",
      "p.blows_per_trial",
      "p.seconds_per_trial",
      "p.blows_discarded",
      "p.attachment",
      "p.warm_up",
      "p.oiling",
      "p.summary",
      "p.frozen_at",
      "p.created_at",
      "p.category_id",
      "c.name as category_name",
      "c.slug as category_slug",
    ]);
}

/** The series of the protocol versions, by protocol and position (the pages and the feed read them so). */
export function protocolSeries(db: Db, protocolIds: readonly number[]) {
  if (protocolIds.length === 0) return Promise.resolve([]);
  return db
    .selectFrom("bench_protocol_series")
    .selectAll()
    .where("protocol_id", "in", protocolIds)
    .orderBy("protocol_id")
    .orderBy("position")
    .execute();
}

export type ProtocolSeries = Awaited<ReturnType<typeof protocolSeries>>[number];

/** Protocol versions with their series in position order, read in one query for all of them. */
async function withSeries<P extends { id: number }>(db: Db, protocols: P[]) {
  const series = await protocolSeries(
    db,
    protocols.map((p) => p.id),
  );
  return protocols.map((p) => ({ ...p, series: series.filter((s) => s.protocol_id === p.id) }));
}

/** The newest version of every protocol, with its series and how many accepted runs use any version. */
export async function listProtocols(db: Db) {
  const rows = await protocolsBase(db)
    .distinctOn("p.slug")
    .select((eb) =>
      eb
        .selectFrom("bench_runs as br")
        .innerJoin("bench_protocols as pv", "pv.id", "br.protocol_id")
        .whereRef("pv.slug", "=", "p.slug")
        .where("br.status", "=", "accepted")
        .select(sql<number>`count(*)::int`.as("n"))
        .as("accepted_runs"),
    )
    .orderBy("p.slug")
    .orderBy("p.version", "desc")
    .execute();
  return withSeries(
    db,
    rows.map((p) => ({ ...p, accepted_runs: p.accepted_runs ?? 0 })),
  );
}

/** Every version of one protocol, newest first, each with its series; null when the slug is unknown. */
export async function protocolVersions(db: Db, slug: string) {
  const rows = await protocolsBase(db)
    .select((eb) =>
      eb
        .selectFrom("bench_runs as br")
        .whereRef("br.protocol_id", "=", "p.id")
        .where("br.status", "=", "accepted")
        .select(sql<number>`count(*)::int`.as("n"))
        .as("accepted_runs"),
    )
    .where("p.slug", "=", slug)
    .orderBy("p.version", "desc")
    .execute();
  if (rows.length === 0) return null;
  return withSeries(
    db,
    rows.map((p) => ({ ...p, accepted_runs: p.accepted_runs ?? 0 })),
  );
}

/** One version by slug and number, with its series; null when there is no such version. */
export async function getProtocol(db: Db, slug: string, version: number) {
  const p = await protocolsBase(db).where("p.slug", "=", slug).where("p.version", "=", version).executeTakeFirst();
  return p ? (await withSeries(db, [p]))[0]! : null;
}

export async function getProtocolById(db: Db, id: number) {
  const p = await protocolsBase(db).where("p.id", "=", id).executeTakeFirst();
  return p ? (await withSeries(db, [p]))[0]! : null;
}

/** Freezes the version a run is about to use; a frozen version never changes again. */
export async function freezeProtocol(trx: Trx, protocolId: number, at = new Date()) {
  await trx
    .updateTable("bench_protocols")
    .set({ frozen_at: at })
    .where("id", "=", protocolId)
    .where("frozen_at", "is", null)
    .execute();
}

export type ProtocolDeclaration = Omit<
  Insertable<BenchProtocolsTable>,
  "id" | "version" | "frozen_at" | "created_at"
> & {
  series: Omit<Insertable<BenchProtocolSeriesTable>, "id" | "protocol_id">[];
};

/**
 * Declares a protocol: a new slug starts at version 1; a change to a frozen version becomes the next
 * version; an unfrozen newest version is rewritten in place. Returns the version's id and number.
 */
export async function declareProtocol(trx: Trx, declaration: ProtocolDeclaration) {
  const { series, ...fields } = declaration;
  const newest = await trx
    .selectFrom("bench_protocols")
    .select(["id", "version", "frozen_at"])
    .where("slug", "=", fields.slug)
    .orderBy("version", "desc")
    .forUpdate()
    .executeTakeFirst();
  let id: number;
  let version: number;
  if (newest && newest.frozen_at == null) {
    ({ id, version } = newest);
    await trx.updateTable("bench_protocols").set(fields).where("id", "=", id).execute();
    await trx.deleteFrom("bench_protocol_series").where("protocol_id", "=", id).execute();
  } else {
    version = (newest?.version ?? 0) + 1;
    ({ id } = await trx
      .insertInto("bench_protocols")
      .values({ ...fields, version })
      .returning("id")
      .executeTakeFirstOrThrow());
  }
  if (series.length) {
    await trx
      .insertInto("bench_protocol_series")
      .values(series.map((s) => ({ ...s, protocol_id: id })))
      .execute();
  }
  return { id, version };
}
