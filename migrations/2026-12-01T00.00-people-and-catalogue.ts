import { type Kysely, sql } from "kysely";

// Frozen: never edit after it has landed; add a new migration instead.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("shops")
    .addColumn("id", "integer", (c) => c.primaryKey().generatedByDefaultAsIdentity())
    .addColumn("name", "text", (c) =>
      c
        .notNull()
        .unique()
        .check(sql`length(name) between 2 and 120`),
    )
    .addColumn("city", "text", (c) => c.notNull())
    .addColumn("region", "text", (c) => c.notNull())
    .addColumn("trade", "text", (c) => c.notNull().check(sql`trade in ('automotive', 'fleet', 'heavy_equipment')`))
    .execute();

  await db.schema
    .createTable("users")
    .addColumn("id", "integer", (c) => c.primaryKey().generatedByDefaultAsIdentity())
    .addColumn("email", "text", (c) =>
      c.notNull().check(sql`email = lower(email) and email like '%_@_%' and length(email) <= 254`),
    )
    .addColumn("handle", "text", (c) => c.notNull().check(sql`handle ~ '^[a-z0-9][a-z0-9_-]{2,29}$'`))
    .addColumn("shop_id", "integer", (c) => c.references("shops.id").onDelete("set null"))
    .addColumn("pressure_unit", "text", (c) =>
      c
        .notNull()
        .defaultTo("psi")
        .check(sql`pressure_unit in ('psi', 'bar', 'kPa')`),
    )
    .addColumn("length_unit", "text", (c) =>
      c
        .notNull()
        .defaultTo("in")
        .check(sql`length_unit in ('in', 'mm')`),
    )
    .addColumn("force_unit", "text", (c) =>
      c
        .notNull()
        .defaultTo("lbf")
        .check(sql`force_unit in ('lbf', 'N')`),
    )
    .addColumn("banned_at", "timestamptz")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex("users_email_key").on("users").column("email").unique().execute();
  await db.schema.createIndex("users_handle_key").on("users").column("handle").unique().execute();

  // Reporter is every signed-in user; only the extra roles are granted.
  await db.schema
    .createTable("roles")
    .addColumn("name", "text", (c) => c.primaryKey())
    .addColumn("description", "text", (c) => c.notNull())
    .execute();
  await db
    .insertInto("roles")
    .values([
      { name: "moderator", description: "Reviews submitted reports and edits the catalogue" },
      { name: "admin", description: "Manages users, roles, API key limits and catalogue merges" },
    ])
    .execute();
  await db.schema
    .createTable("user_roles")
    .addColumn("user_id", "integer", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("role", "text", (c) => c.notNull().references("roles.name"))
    .addColumn("granted_by", "integer", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("granted_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("user_roles_pkey", ["user_id", "role"])
    .execute();

  await db.schema
    .createTable("makers")
    .addColumn("id", "integer", (c) => c.primaryKey().generatedByDefaultAsIdentity())
    .addColumn("slug", "text", (c) =>
      c
        .notNull()
        .unique()
        .check(sql`slug ~ '^[a-z0-9]+(-[a-z0-9]+)*$'`),
    )
    .addColumn("name", "text", (c) =>
      c
        .notNull()
        .unique()
        .check(sql`length(name) between 2 and 80`),
    )
    .addColumn("country", "text")
    .execute();

  await db.schema
    .createTable("tool_categories")
    .addColumn("id", "integer", (c) => c.primaryKey().generatedByDefaultAsIdentity())
    .addColumn("slug", "text", (c) =>
      c
        .notNull()
        .unique()
        .check(sql`slug ~ '^[a-z0-9]+(-[a-z0-9]+)*$'`),
    )
    .addColumn("name", "text", (c) => c.notNull().unique())
    .addColumn("action", "text", (c) => c.notNull().check(sql`action in ('percussive', 'rotary')`))
    .addColumn("description", "text", (c) => c.notNull())
    .execute();

  await db.schema
    .createTable("tool_models")
    .addColumn("id", "integer", (c) => c.primaryKey().generatedByDefaultAsIdentity())
    .addColumn("slug", "text", (c) =>
      c
        .notNull()
        .unique()
        .check(sql`slug ~ '^[a-z0-9]+(-[a-z0-9]+)*$'`),
    )
    .addColumn("maker_id", "integer", (c) => c.notNull().references("makers.id"))
    .addColumn("category_id", "integer", (c) => c.notNull().references("tool_categories.id"))
    .addColumn("model_code", "text", (c) => c.notNull().check(sql`length(model_code) between 1 and 40`))
    .addColumn("name", "text", (c) => c.notNull())
    // Round hammer shanks (0.401 in, 0.498 in) or square drives (1/4 in to 1 in).
    .addColumn("fitting", "text", (c) =>
      c
        .notNull()
        .check(
          sql`fitting in ('shank-0.401', 'shank-0.498', 'drive-1/4', 'drive-3/8', 'drive-1/2', 'drive-3/4', 'drive-1')`,
        ),
    )
    .addColumn("bore_mm", "double precision", (c) => c.check(sql`bore_mm > 0 and bore_mm < 100`))
    .addColumn("stroke_mm", "double precision", (c) => c.check(sql`stroke_mm > 0 and stroke_mm < 300`))
    .addColumn("blows_per_minute", "integer", (c) => c.check(sql`blows_per_minute between 100 and 20000`))
    .addColumn("free_speed_rpm", "integer", (c) => c.check(sql`free_speed_rpm between 50 and 30000`))
    .addColumn("max_torque_nm", "double precision", (c) => c.check(sql`max_torque_nm > 0 and max_torque_nm < 10000`))
    .addColumn("weight_kg", "double precision", (c) => c.notNull().check(sql`weight_kg > 0 and weight_kg < 50`))
    .addColumn("length_mm", "double precision", (c) => c.notNull().check(sql`length_mm > 0 and length_mm < 2000`))
    .addColumn("street_price_cents", "integer", (c) => c.check(sql`street_price_cents >= 0`))
    .addColumn("air_inlet", "text", (c) => c.notNull())
    // Rated consumption at 6.2 bar (90 psi) gauge at the inlet, free air.
    .addColumn("rated_air_lps", "double precision", (c) =>
      c.notNull().check(sql`rated_air_lps > 0 and rated_air_lps < 200`),
    )
    .addColumn("max_inlet_kpa", "double precision", (c) =>
      c
        .notNull()
        .defaultTo(620.5)
        .check(sql`max_inlet_kpa > 0 and max_inlet_kpa <= 2000`),
    )
    // Spec values come from the maker's sheet unless listed here as measured.
    .addColumn("measured_specs", sql`text[]`, (c) =>
      c
        .notNull()
        .defaultTo(sql`'{}'`)
        .check(
          sql`measured_specs <@ array['bore_mm','stroke_mm','blows_per_minute','free_speed_rpm','max_torque_nm','weight_kg','length_mm','rated_air_lps']::text[]`,
        ),
    )
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint("tool_models_maker_code_key", ["maker_id", "model_code"])
    // Lets reports prove their job type belongs to the tool's category.
    .addUniqueConstraint("tool_models_id_category_key", ["id", "category_id"])
    .addCheckConstraint("tool_models_speed_given", sql`blows_per_minute is not null or free_speed_rpm is not null`)
    .execute();

  await db.schema
    .createTable("job_types")
    .addColumn("id", "integer", (c) => c.primaryKey().generatedByDefaultAsIdentity())
    .addColumn("slug", "text", (c) =>
      c
        .notNull()
        .unique()
        .check(sql`slug ~ '^[a-z0-9]+(-[a-z0-9]+)*$'`),
    )
    .addColumn("category_id", "integer", (c) => c.notNull().references("tool_categories.id"))
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("description", "text", (c) => c.notNull())
    .addColumn("seized", "boolean", (c) => c.notNull().defaultTo(true))
    .addUniqueConstraint("job_types_category_name_key", ["category_id", "name"])
    .addUniqueConstraint("job_types_id_category_key", ["id", "category_id"])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const t of ["job_types", "tool_models", "tool_categories", "makers", "user_roles", "roles", "users", "shops"]) {
    await db.schema.dropTable(t).execute();
  }
}
