// Stock: wire types, their purchasable put-ups, the spools and remnants on the shelf, and every length adjustment.
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("wire_type", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("team_id").notNullable().references("team.id").onDelete("CASCADE");
    t.text("gauge").notNullable(); // canonical label, lib/domain/gauge.ts
    t.double("nominal_area_mm2").notNullable(); // from the gauge, for ordering thin → thick
    t.text("colour").notNullable(); // IEC 60757 code, lib/domain/colour.ts
    t.text("insulation").nullable(); // spec text; null when not stated
    t.text("conductor_material").notNullable().defaultTo("copper");
    t.boolean("tinned").notNullable().defaultTo(false);
    t.double("outer_diameter_mm").nullable();
    t.double("insulation_temp_c").nullable();
    t.text("notes").nullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    // Lets spools carry (wire_type_id, team_id) as one foreign key, so a spool can never cross teams.
    t.unique(["id", "team_id"]);
  });
  await knex.raw(
    `create unique index wire_type_team_spec_idx on wire_type (team_id, gauge, colour, lower(coalesce(insulation, '')))`,
  );
  await knex.raw(
    `alter table wire_type add constraint wire_type_conductor_material_check check (conductor_material in ('copper','aluminium'))`,
  );
  await knex.raw(
    `alter table wire_type add constraint wire_type_outer_diameter_check check (outer_diameter_mm is null or outer_diameter_mm > 0)`,
  );

  await knex.schema.createTable("put_up", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("wire_type_id").notNullable().references("wire_type.id").onDelete("CASCADE");
    t.integer("nominal_length_mm").notNullable();
    t.integer("price_cents").notNullable();
    t.text("currency").notNullable().defaultTo("USD");
    t.text("supplier_name").notNullable();
    t.text("supplier_part_no").nullable();
    t.boolean("active").notNullable().defaultTo(true);
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(["wire_type_id"]);
    t.unique(["id", "wire_type_id"]);
  });
  await knex.raw(`alter table put_up add constraint put_up_length_check check (nominal_length_mm > 0)`);
  await knex.raw(`alter table put_up add constraint put_up_price_check check (price_cents >= 0)`);
  await knex.raw(`alter table put_up add constraint put_up_currency_check check (currency ~ '^[A-Z]{3}$')`);

  await knex.schema.createTable("spool", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("team_id").notNullable().references("team.id").onDelete("CASCADE");
    t.uuid("wire_type_id").notNullable();
    t.integer("length_mm").notNullable(); // measured remaining length
    t.integer("initial_length_mm").notNullable(); // when it came onto the shelf (a new spool or a remnant)
    t.text("lot").nullable();
    t.text("location").nullable();
    t.text("state").notNullable().defaultTo("open");
    t.uuid("source_put_up_id").nullable(); // a put-up of the same wire type; see the foreign key below
    t.text("origin_note").nullable(); // e.g. "remnant of plan …"
    t.integer("version").notNullable().defaultTo(1);
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.foreign(["wire_type_id", "team_id"])
      .references(["id", "team_id"])
      .inTable("wire_type")
      .onDelete("RESTRICT");
    t.index(["team_id", "wire_type_id", "state"]);
  });
  // Deleting the put-up forgets where the spool came from but keeps the spool (PostgreSQL 15: SET NULL (col)).
  await knex.raw(
    `alter table spool add constraint spool_source_put_up_fk foreign key (source_put_up_id, wire_type_id)
       references put_up (id, wire_type_id) on delete set null (source_put_up_id)`,
  );
  await knex.raw(`alter table spool add constraint spool_length_check check (length_mm >= 0)`);
  await knex.raw(
    `alter table spool add constraint spool_initial_length_check check (initial_length_mm >= 0)`,
  );
  await knex.raw(
    `alter table spool add constraint spool_state_check check (state in ('open','reserved','used_up'))`,
  );

  await knex.schema.createTable("spool_adjustment", (t) => {
    t.bigIncrements("id").primary();
    t.uuid("spool_id").notNullable().references("spool.id").onDelete("CASCADE");
    t.text("user_id").nullable().references("app_user.id").onDelete("SET NULL");
    t.integer("old_length_mm").notNullable();
    t.integer("new_length_mm").notNullable();
    t.text("reason").notNullable();
    t.timestamp("adjusted_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(["spool_id", "adjusted_at"]);
  });
  await knex.raw(
    `alter table spool_adjustment add constraint spool_adjustment_length_check check (old_length_mm >= 0 and new_length_mm >= 0)`,
  );
  await knex.raw(
    `alter table spool_adjustment add constraint spool_adjustment_reason_check check (length(btrim(reason)) > 0)`,
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("spool_adjustment");
  await knex.schema.dropTableIfExists("spool");
  await knex.schema.dropTableIfExists("put_up");
  await knex.schema.dropTableIfExists("wire_type");
}
