// Test results of runs: continuity and insulation, pass or fail, with a value and a note, by whom and when.
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("run_test", (t) => {
    t.bigIncrements("id").primary();
    t.uuid("run_id").notNullable().references("run.id").onDelete("CASCADE");
    t.text("kind").notNullable();
    t.boolean("passed").notNullable();
    // Ω for continuity, MΩ for insulation (the unit follows the kind); null when only pass/fail was noted.
    t.double("value").nullable();
    t.text("note").nullable();
    t.text("tested_by").nullable().references("app_user.id").onDelete("SET NULL");
    t.timestamp("tested_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    // The run's version after the change that recorded this result.
    t.integer("run_version").notNullable();
    t.index(["run_id", "id"]);
  });
  await knex.raw(
    `alter table run_test add constraint run_test_kind_check check (kind in ('continuity','insulation'))`,
  );
  await knex.raw(
    `alter table run_test add constraint run_test_value_check check (value is null or value >= 0)`,
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("run_test");
}
