import { type Kysely, sql } from "kysely";

// Frozen: never edit after it has landed; add a new migration instead.
// A tool model's declared exposure figures (issue 21), each with where it came from (the maker's sheet,
// measured, or estimated — as running_air_source records it):
// - vibration total value a_hv (m/s²), its uncertainty K and the ISO 28927 part it was measured under;
// - A-weighted emission sound pressure level L_pA and sound power level L_WA (dB), each with K (ISO 15744);
// - the bit (or socket) retainer the tool comes with, and its weight with the hose whip fitted (kg).
// Null: not known yet. A figure's K and test part need the figure; a figure needs its source; a maker's
// declared vibration names the part it was measured under. The bit shank is the existing `fitting`.
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table tool_models
    add column vibration_ahv_ms2 double precision check (vibration_ahv_ms2 > 0 and vibration_ahv_ms2 <= 100),
    add column vibration_k_ms2 double precision check (vibration_k_ms2 >= 0 and vibration_k_ms2 <= 50),
    add column vibration_iso28927_part smallint check (vibration_iso28927_part between 1 and 13),
    add column vibration_source text check (vibration_source in ('maker_sheet', 'measured', 'estimated')),
    add column sound_pressure_db double precision check (sound_pressure_db >= 40 and sound_pressure_db <= 140),
    add column sound_pressure_k_db double precision check (sound_pressure_k_db >= 0 and sound_pressure_k_db <= 10),
    add column sound_pressure_source text check (sound_pressure_source in ('maker_sheet', 'measured', 'estimated')),
    add column sound_power_db double precision check (sound_power_db >= 50 and sound_power_db <= 160),
    add column sound_power_k_db double precision check (sound_power_k_db >= 0 and sound_power_k_db <= 10),
    add column sound_power_source text check (sound_power_source in ('maker_sheet', 'measured', 'estimated')),
    add column bit_retainer text check (bit_retainer in ('beehive_spring', 'quick_change', 'friction_ring', 'detent_pin', 'none')),
    add column weight_with_whip_kg double precision check (weight_with_whip_kg > 0 and weight_with_whip_kg <= 50),
    add column weight_with_whip_source text check (weight_with_whip_source in ('maker_sheet', 'measured', 'estimated')),
    add constraint tool_models_vibration_sourced check (case
      when vibration_ahv_ms2 is null then vibration_k_ms2 is null and vibration_iso28927_part is null and vibration_source is null
      when vibration_source = 'maker_sheet' then vibration_iso28927_part is not null
      else vibration_source is not null end),
    add constraint tool_models_sound_pressure_sourced check (case
      when sound_pressure_db is null then sound_pressure_k_db is null and sound_pressure_source is null
      else sound_pressure_source is not null end),
    add constraint tool_models_sound_power_sourced check (case
      when sound_power_db is null then sound_power_k_db is null and sound_power_source is null
      else sound_power_source is not null end),
    add constraint tool_models_weight_with_whip_sourced check (case
      when weight_with_whip_kg is null then weight_with_whip_source is null
      else weight_with_whip_source is not null and weight_with_whip_kg >= weight_kg end)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table tool_models
    drop constraint tool_models_vibration_sourced, drop constraint tool_models_sound_pressure_sourced,
    drop constraint tool_models_sound_power_sourced, drop constraint tool_models_weight_with_whip_sourced,
    drop column vibration_ahv_ms2, drop column vibration_k_ms2, drop column vibration_iso28927_part,
    drop column vibration_source, drop column sound_pressure_db, drop column sound_pressure_k_db,
    drop column sound_pressure_source, drop column sound_power_db, drop column sound_power_k_db,
    drop column sound_power_source, drop column bit_retainer, drop column weight_with_whip_kg,
    drop column weight_with_whip_source`.execute(db);
}
