// Test results of runs (continuity and insulation, pass or fail, with a value and a note, by whom and when), and
// indexes for what a trace page reads of the other runs: runs on the same devices, and return runs.
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
  // The device of a reference is the part before ':' (runsOnDevices compares exactly these expressions).
  await knex.raw(`create index run_end_a_device_idx on run (project_id, split_part(end_a, ':', 1))`);
  await knex.raw(`create index run_end_b_device_idx on run (project_id, split_part(end_b, ':', 1))`);
  await knex.raw(
    `create index run_return_run_idx on run (project_id, return_run_wire_id) where return_kind = 'run'`,
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`drop index if exists run_return_run_idx`);
  await knex.raw(`drop index if exists run_end_b_device_idx`);
  await knex.raw(`drop index if exists run_end_a_device_idx`);
  await knex.schema.dropTableIfExists("run_test");
}
