import { type Kysely, sql } from "kysely";

// Frozen: never edit after it has landed; add a new migration instead.
// One unit system per user (issue 18): length_unit names the system, and pressure_unit and
// force_unit follow it — in · psi · lbf, or mm · kPa|bar · N. Rows that mixed them take their
// length unit's system (a metric reader who had psi gets kPa). Reports keep the units the reporter
// typed in, so a moderator can read "3/8 in" for a bore entered in inches; reports filed before
// this take their reporter's units of today (the form has always used them).
export async function up(db: Kysely<any>): Promise<void> {
  await sql`update users set force_unit = case when length_unit = 'in' then 'lbf' else 'N' end,
    pressure_unit = case when length_unit = 'in' then 'psi' when pressure_unit = 'psi' then 'kPa' else pressure_unit end`.execute(
    db,
  );
  await sql`alter table users add constraint users_one_unit_system check (
    (length_unit = 'in' and pressure_unit = 'psi' and force_unit = 'lbf')
    or (length_unit = 'mm' and pressure_unit in ('kPa', 'bar') and force_unit = 'N'))`.execute(db);

  await db.schema
    .alterTable("reports")
    .addColumn("entered_pressure_unit", "text", (c) => c.check(sql`entered_pressure_unit in ('psi', 'bar', 'kPa')`))
    .addColumn("entered_length_unit", "text", (c) => c.check(sql`entered_length_unit in ('in', 'mm')`))
    .execute();
  await sql`update reports r set entered_pressure_unit = u.pressure_unit, entered_length_unit = u.length_unit
    from users u where u.id = r.reporter_id`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("reports").dropColumn("entered_pressure_unit").dropColumn("entered_length_unit").execute();
  await sql`alter table users drop constraint users_one_unit_system`.execute(db);
}
