import { type Kysely, sql } from "kysely";

// Frozen: never edit after it has landed; add a new migration instead.
// Stored report values are rounded to the precision they are entered at (issue 17), so the feed
// publishes 661.9, not 661.9000000000001: pressures 0.1 kPa, bit lengths 0.1 mm, hose bores 0.01 mm
// (inch sizes: 1/4 in is 6.35 mm, and the drop goes with the bore to the fifth), hose lengths 0.01 m, compressor delivery 0.01 l/s, tanks 0.1 l, times 1 s. A value that would round
// to zero (below every column's lower bound) is left as it is.
const STEPS: [column: string, digits: number][] = [
  ["regulator_kpa", 1],
  ["inlet_kpa", 1],
  ["hose_id_mm", 2],
  ["attachment_length_mm", 1],
  ["hose_length_m", 2],
  ["compressor_lps", 2],
  ["tank_l", 1],
  ["time_to_result_s", 0],
];

export async function up(db: Kysely<any>): Promise<void> {
  const sets = STEPS.map(([column, digits]) => {
    const c = sql.ref(column);
    const rounded = sql`round(${c}::numeric, ${sql.lit(digits)})::double precision`;
    return sql`${c} = case when ${rounded} > 0 then ${rounded} else ${c} end`;
  });
  await sql`update reports set ${sql.join(sets)}`.execute(db);
}

export async function down(): Promise<void> {
  // Rounding cannot be undone; nothing to do.
}
