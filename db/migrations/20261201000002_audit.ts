// Audit trail: who did what to which record in which team, written in the same transaction as the change.
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("audit_events", (t) => {
    t.bigIncrements("id").primary();
    t.uuid("team_id").notNullable().references("team.id").onDelete("CASCADE");
    t.text("actor_user_id").nullable().references("app_user.id").onDelete("SET NULL");
    t.text("action").notNullable();
    t.text("entity_type").notNullable();
    t.text("entity_id").nullable();
    t.jsonb("detail").notNullable().defaultTo("{}");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(["team_id", "created_at"]);
    t.index(["team_id", "entity_type", "entity_id"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("audit_events");
}
