// Team and mail: invitations, password resets, failed sign-in attempts and the development mailbox's caught mail.
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("invitation", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("team_id").notNullable().references("team.id").onDelete("CASCADE");
    t.text("email").notNullable();
    t.text("role").notNullable();
    // sha-256 of the token in the mailed link; the token itself is never stored.
    t.text("token_hash").notNullable().unique();
    t.text("invited_by").nullable().references("app_user.id").onDelete("SET NULL");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("expires_at", { useTz: true }).notNullable();
    t.timestamp("sent_at", { useTz: true }).nullable();
    t.text("send_error").nullable();
    t.timestamp("accepted_at", { useTz: true }).nullable();
    t.text("accepted_by").nullable().references("app_user.id").onDelete("SET NULL");
    t.timestamp("revoked_at", { useTz: true }).nullable();
    t.index(["team_id", "created_at"]);
  });
  await knex.raw(
    `alter table invitation add constraint invitation_role_check check (role in ('lead','builder','technician'))`,
  );
  // At most one open invitation per address and team.
  await knex.raw(
    `create unique index invitation_open_email_idx on invitation (team_id, lower(email)) where accepted_at is null and revoked_at is null`,
  );

  await knex.schema.createTable("password_reset", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.text("user_id").notNullable().references("app_user.id").onDelete("CASCADE");
    t.text("token_hash").notNullable().unique();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("expires_at", { useTz: true }).notNullable();
    t.timestamp("used_at", { useTz: true }).nullable();
    t.index(["user_id"]);
  });

  // Failed sign-in attempts, counted per address and per client over a sliding window.
  await knex.schema.createTable("sign_in_failure", (t) => {
    t.bigIncrements("id").primary();
    t.text("email").notNullable();
    t.text("client_ip").notNullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(["email", "created_at"]);
    t.index(["client_ip", "created_at"]);
    t.index(["created_at"]);
  });

  // Mail caught by the local fake mail server (development, demo and tests only; empty in production).
  await knex.schema.createTable("dev_mail", (t) => {
    t.bigIncrements("id").primary();
    t.text("message_id").nullable();
    t.text("from_address").notNullable();
    t.specificType("to_addresses", "text[]").notNullable();
    t.text("subject").notNullable();
    t.text("text").notNullable();
    t.text("html").nullable();
    t.timestamp("received_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(["received_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("dev_mail");
  await knex.schema.dropTableIfExists("sign_in_failure");
  await knex.schema.dropTableIfExists("password_reset");
  await knex.schema.dropTableIfExists("invitation");
}
