// Spool plans: the planner's result for a project, the run and spool versions it was made from, and its commit.
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("spool_plan", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("project_id").notNullable().references("project.id").onDelete("CASCADE");
    t.text("created_by").nullable().references("app_user.id").onDelete("SET NULL");
    t.text("status").notNullable().defaultTo("draft");
    // The view the screens, the cut sheet and the commit read: spools, cuts, purchases, bound and gap.
    t.json("result").notNullable();
    // { runId: version } and { spoolId: version } at planning time, for stale detection and the commit.
    t.json("run_versions").notNullable();
    t.json("spool_versions").notNullable();
    t.integer("cost_cents").notNullable();
    t.integer("lower_bound_cents").notNullable();
    t.double("gap_pct").nullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("committed_at", { useTz: true }).nullable();
    t.text("committed_by").nullable().references("app_user.id").onDelete("SET NULL");
    t.index(["project_id", "created_at"]);
  });
  await knex.raw(
    `alter table spool_plan add constraint spool_plan_status_check check (status in ('draft','committed'))`,
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("spool_plan");
}
