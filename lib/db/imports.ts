// Stored run-list imports (preview → commit), reached only through a project of the caller's team.
import { db, type Db, type Tx } from "@/lib/db/knex";
import type { ImportPreview, ImportTable } from "@/lib/import";

export interface ImportRecord {
  id: string;
  projectId: string;
  createdBy: string | null;
  filename: string;
  status: "preview" | "committed" | "discarded";
  sourceTable: ImportTable;
  preview: ImportPreview;
  version: number;
  createdAt: string;
  committedAt: string | null;
}

function scoped(q: Db, teamId: string, projectId: string) {
  return q("runImport as i")
    .join("project as p", "p.id", "i.projectId")
    .where({ "p.teamId": teamId, "i.projectId": projectId });
}

const COLUMNS = [
  "i.id",
  "i.projectId",
  "i.createdBy",
  "i.filename",
  "i.status",
  "i.version",
  "i.createdAt",
  "i.committedAt",
];

export async function insertImport(
  projectId: string,
  userId: string,
  filename: string,
  table: ImportTable,
  preview: ImportPreview,
): Promise<{ id: string; createdAt: string }> {
  const [row] = (await db()("runImport")
    .insert({
      projectId,
      createdBy: userId,
      filename,
      sourceTable: JSON.stringify(table),
      preview: JSON.stringify(preview),
    })
    .returning(["id", "createdAt"])) as [{ id: string; createdAt: string }];
  return row;
}

export async function getImport(
  teamId: string,
  projectId: string,
  importId: string,
  opts: { withTable?: boolean; forUpdate?: Tx } = {},
): Promise<ImportRecord | null> {
  const q = opts.forUpdate ?? db();
  const row = (await scoped(q, teamId, projectId)
    .where("i.id", importId)
    .select([...COLUMNS, "i.preview", ...(opts.withTable ? ["i.sourceTable"] : [])])
    .modify((b) => {
      if (opts.forUpdate) b.forUpdate("i");
    })
    .first()) as ImportRecord | undefined;
  return row ?? null;
}

export async function savePreview(q: Db, importId: string, preview: ImportPreview): Promise<void> {
  await q("runImport")
    .where({ id: importId })
    .update({ preview: JSON.stringify(preview), version: q.raw("version + 1") });
}

export async function markCommitted(tx: Tx, importId: string): Promise<void> {
  await tx("runImport").where({ id: importId }).update({ status: "committed", committedAt: tx.fn.now() });
}
