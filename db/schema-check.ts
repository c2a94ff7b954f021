// Compile-time agreement between the hand-written `Database` (schema.ts) and the one kysely-codegen
// makes of the migrated database (generated.ts): same tables, same columns, the same columns
// nullable, and no column optional on insert that has no default in the database. The schema may be
// narrower by hand: a text column with a CHECK becomes a union of its values, and a column the
// database would default may still be required of the app (stats_cells.time_n). A mismatch fails
// `npm run typecheck` and tests/integration/schema-matches-database.test.ts; the error names it.
import type { Insertable, Selectable } from "kysely";
import type { DB } from "./generated";
import type { Database } from "./schema";

/** Tables of the database that the app reaches without Kysely (rate-limiter-flexible's counts). */
type NotModelled = "feed_rate_limits";

type NullableKeys<T> = { [K in keyof T]-?: null extends T[K] ? K : never }[keyof T];
type OptionalKeys<T> = { [K in keyof T]-?: Record<never, never> extends Pick<T, K> ? K : never }[keyof T];

/** `true`, or what differs for one table. */
type Agrees<Hand, Made> = [
  Exclude<keyof Hand, keyof Made>,
  Exclude<keyof Made, keyof Hand>,
  Exclude<NullableKeys<Selectable<Hand>>, NullableKeys<Selectable<Made>>>,
  Exclude<NullableKeys<Selectable<Made>>, NullableKeys<Selectable<Hand>>>,
  Exclude<OptionalKeys<Insertable<Hand>>, OptionalKeys<Insertable<Made>>>,
] extends [never, never, never, never, never]
  ? true
  : {
      columnsNotInDatabase: Exclude<keyof Hand, keyof Made>;
      columnsNotInSchema: Exclude<keyof Made, keyof Hand>;
      nullableOnlyInSchema: Exclude<NullableKeys<Selectable<Hand>>, NullableKeys<Selectable<Made>>>;
      nullableOnlyInDatabase: Exclude<NullableKeys<Selectable<Made>>, NullableKeys<Selectable<Hand>>>;
      optionalOnInsertWithoutDefault: Exclude<OptionalKeys<Insertable<Hand>>, OptionalKeys<Insertable<Made>>>;
    };

type Tables = { [T in keyof Database]: T extends keyof DB ? Agrees<Database[T], DB[T]> : "not in the database" };

export const tablesAgree: { [T in keyof Database]: true } = null as unknown as Tables;
export const everyTableModelled: Exclude<keyof DB, keyof Database | NotModelled> extends never
  ? true
  : Exclude<keyof DB, keyof Database | NotModelled> = true;
