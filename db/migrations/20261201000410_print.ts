// Marker templates a team's lead saves (the built-in defaults live in code, lib/domain/marker-templates.ts).
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("marker_template", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("team_id").notNullable().references("team.id").onDelete("CASCADE");
    t.text("name").notNullable();
    // Every field of MarkerTemplate but its id, checked by validateTemplate before it is stored.
    t.json("body").notNullable();
    t.integer("version").notNullable().defaultTo(1);
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(
    `create unique index marker_template_team_name_idx on marker_template (team_id, lower(name))`,
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("marker_template");
}
