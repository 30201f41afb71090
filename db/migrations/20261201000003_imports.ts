// Run-list imports: the table read from the upload, the column mapping and the checked preview, until committed.
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("run_import", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("project_id").notNullable().references("project.id").onDelete("CASCADE");
    t.text("created_by").nullable().references("app_user.id").onDelete("SET NULL");
    t.text("filename").notNullable();
    t.text("status").notNullable().defaultTo("preview");
    // json, not jsonb: these documents are stored and returned whole, never queried inside.
    t.json("source_table").notNullable();
    t.json("preview").notNullable();
    t.integer("version").notNullable().defaultTo(1);
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("committed_at", { useTz: true }).nullable();
    t.index(["project_id", "created_at"]);
  });
  await knex.raw(
    `alter table run_import add constraint run_import_status_check check (status in ('preview','committed','discarded'))`,
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("run_import");
}
