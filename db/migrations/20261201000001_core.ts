// Core schema: teams, users, memberships with roles, sessions, projects and runs.
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("team", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.text("name").notNullable();
    t.text("page_size").notNullable().defaultTo("A4");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`alter table team add constraint team_page_size_check check (page_size in ('A4','Letter'))`);

  await knex.schema.createTable("app_user", (t) => {
    t.text("id").primary();
    t.text("email").notNullable();
    t.text("name").notNullable();
    t.text("password_hash").notNullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`create unique index app_user_email_lower_idx on app_user (lower(email))`);

  await knex.schema.createTable("membership", (t) => {
    t.uuid("team_id").notNullable().references("team.id").onDelete("CASCADE");
    t.text("user_id").notNullable().references("app_user.id").onDelete("CASCADE");
    t.text("role").notNullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(["team_id", "user_id"]);
    t.index(["user_id"]);
  });
  await knex.raw(
    `alter table membership add constraint membership_role_check check (role in ('lead','builder','technician'))`,
  );

  // Lucia needs exactly id, user_id, expires_at; team_id is a session attribute (the team being worked in).
  await knex.schema.createTable("user_session", (t) => {
    t.text("id").primary();
    t.text("user_id").notNullable().references("app_user.id").onDelete("CASCADE");
    t.timestamp("expires_at", { useTz: true }).notNullable();
    t.uuid("team_id").nullable().references("team.id").onDelete("SET NULL");
    t.index(["user_id"]);
  });

  await knex.schema.createTable("project", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("team_id").notNullable().references("team.id").onDelete("CASCADE");
    t.text("name").notNullable();
    t.text("wire_id_prefix").notNullable().defaultTo("W");
    t.double("supply_v").notNullable().defaultTo(24);
    t.double("conductor_temp_c").notNullable().defaultTo(60);
    t.text("gauge_system").notNullable().defaultTo("awg");
    t.double("slack_pct").notNullable().defaultTo(5);
    t.integer("slack_min_mm").notNullable().defaultTo(50);
    t.integer("service_loop_mm").notNullable().defaultTo(25);
    t.integer("rounding_mm").notNullable().defaultTo(5);
    t.integer("end_discard_mm").notNullable().defaultTo(100);
    t.integer("keep_remnant_mm").notNullable().defaultTo(1000);
    t.integer("marker_repeat_mm").nullable();
    t.text("default_drop_class").notNullable().defaultTo("standard");
    t.integer("version").notNullable().defaultTo(1);
    t.timestamp("archived_at", { useTz: true }).nullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(["team_id"]);
  });
  await knex.raw(
    `alter table project add constraint project_gauge_system_check check (gauge_system in ('awg','metric'))`,
  );
  await knex.raw(`create unique index project_team_name_idx on project (team_id, lower(name))`);

  await knex.schema.createTable("run", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("project_id").notNullable().references("project.id").onDelete("CASCADE");
    t.text("wire_id").notNullable();
    t.text("end_a").notNullable();
    t.text("end_b").notNullable();
    t.text("end_a_termination").nullable();
    t.text("end_b_termination").nullable();
    t.integer("end_a_strip_mm").nullable();
    t.integer("end_b_strip_mm").nullable();
    t.text("circuit").nullable();
    t.text("gauge").notNullable();
    t.text("colour").notNullable();
    t.text("insulation").nullable();
    t.double("insulation_temp_c").nullable();
    t.integer("bundle_size").nullable();
    t.boolean("hot_space").notNullable().defaultTo(false);
    t.integer("routed_length_mm").notNullable();
    t.double("current_a").nullable();
    t.double("peak_current_a").nullable();
    t.double("supply_v").nullable();
    t.text("drop_class").notNullable().defaultTo("standard");
    t.double("drop_limit_pct").nullable();
    t.double("fuse_a").nullable();
    t.text("return_kind").notNullable().defaultTo("same");
    t.text("return_run_wire_id").nullable();
    t.double("return_resistance_ohm").nullable();
    t.double("led_forward_v").nullable();
    t.double("led_current_a").nullable();
    t.text("state").notNullable().defaultTo("planned");
    t.text("notes").nullable();
    t.text("trace_code").notNullable().unique();
    t.integer("version").notNullable().defaultTo(1);
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(["project_id", "wire_id"]);
  });
  await knex.raw(`alter table run add constraint run_routed_length_check check (routed_length_mm > 0)`);
  await knex.raw(
    `alter table run add constraint run_state_check check (state in ('planned','cut','marked','terminated','tested','failed'))`,
  );
  await knex.raw(
    `alter table run add constraint run_drop_class_check check (drop_class in ('critical','standard','motor','custom'))`,
  );
  await knex.raw(
    `alter table run add constraint run_return_kind_check check (return_kind in ('same','run','chassis'))`,
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("run");
  await knex.schema.dropTableIfExists("project");
  await knex.schema.dropTableIfExists("user_session");
  await knex.schema.dropTableIfExists("membership");
  await knex.schema.dropTableIfExists("app_user");
  await knex.schema.dropTableIfExists("team");
}
