import { type Kysely, sql } from "kysely";

// Frozen: never edit after it has landed; add a new migration instead.
// The open feed: a stable pseudonym per reporter (random, so it says nothing about the account),
// the secret that signs page cursors (made here so every app server shares it), and the
// counters of the feed's rate limits (the table layout rate-limiter-flexible expects).
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table users add column feed_pseudonym text
    not null default 'rp_' || substr(replace(gen_random_uuid()::text, '-', ''), 1, 16)`.execute(db);
  await sql`alter table users add constraint users_feed_pseudonym_key unique (feed_pseudonym)`.execute(db);
  await sql`create table app_secrets (name text primary key, value text not null, created_at timestamptz not null default now())`.execute(
    db,
  );
  await sql`insert into app_secrets (name, value)
    values ('feed-cursor', replace(gen_random_uuid()::text, '-', '') || replace(gen_random_uuid()::text, '-', ''))`.execute(
    db,
  );
  await sql`create table feed_rate_limits (key varchar(255) primary key, points integer not null default 0, expire bigint)`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop table feed_rate_limits`.execute(db);
  await sql`drop table app_secrets`.execute(db);
  await sql`alter table users drop column feed_pseudonym`.execute(db);
}
