// Run-list imports: upload → stored preview (editable mapping) → commit of all rows in one transaction or none.
import { db } from "@/lib/db/knex";
import { recordAudit, recordAudits } from "@/lib/db/audit";
import { getImport, insertImport, markCommitted, savePreview, type ImportRecord } from "@/lib/db/imports";
import { settingsOf, type ProjectRecord } from "@/lib/db/projects";
import { listAllRuns, touchProject, updateRunsEach } from "@/lib/db/runs";
import type { TeamMe } from "@/lib/auth/guards";
import type { RunData } from "@/lib/domain/types";
import type { RunFieldKey, UnitHint } from "@/lib/domain/run-fields";
import {
  MAX_UPLOAD_BYTES,
  buildPreview,
  isImportFileError,
  matchHeaders,
  readTable,
  wireIdKey,
  type ColumnMapping,
  type ImportPreview,
} from "@/lib/import";
import { AppError, conflict, invalid, notFound, tooLarge } from "@/lib/http/errors";
import { uuidSchema } from "@/lib/validation/common";
import type { ImportMappingInput } from "@/lib/validation/imports";
import { createRunsInTx } from "@/lib/services/runs";

export interface ImportView {
  id: string;
  filename: string;
  status: ImportRecord["status"];
  createdAt: string;
  committedAt: string | null;
  preview: ImportPreview;
}

function view(r: ImportRecord): ImportView {
  return {
    id: r.id,
    filename: r.filename,
    status: r.status,
    createdAt: r.createdAt,
    committedAt: r.committedAt,
    preview: r.preview,
  };
}

async function existingRuns(teamId: string, projectId: string): Promise<RunData[]> {
  return listAllRuns(teamId, projectId);
}

export async function uploadImport(me: TeamMe, project: ProjectRecord, file: File): Promise<ImportView> {
  if (file.size > MAX_UPLOAD_BYTES) {
    throw tooLarge(`The file is ${(file.size / 1048576).toFixed(1)} MB; the limit is 10 MB.`);
  }
  const buffer = Buffer.from(await file.arrayBuffer());
  let table;
  try {
    table = await readTable(buffer, file.name || "upload", file.type || undefined);
  } catch (e) {
    if (isImportFileError(e)) throw new AppError(e.status, e.code, e.message, e.details ?? undefined);
    throw e;
  }
  const match = matchHeaders(table.headers);
  const preview = buildPreview(table, match, await existingRuns(me.teamId, project.id), settingsOf(project));
  const { id, createdAt } = await insertImport(project.id, me.user.id, table.filename, table, preview);
  return { id, filename: table.filename, status: "preview", createdAt, committedAt: null, preview };
}

export async function requireImport(me: TeamMe, project: ProjectRecord, importId: string | undefined) {
  if (!importId || !uuidSchema.safeParse(importId).success) throw notFound("That import");
  const r = await getImport(me.teamId, project.id, importId);
  if (!r) throw notFound("That import");
  return r;
}

/** Applies the user's column mapping and checks every row again against the current runs. */
export async function remapImport(
  me: TeamMe,
  project: ProjectRecord,
  importId: string,
  input: ImportMappingInput,
): Promise<ImportView> {
  const r = await getImport(me.teamId, project.id, importId, { withTable: true });
  if (!r) throw notFound("That import");
  if (r.status !== "preview") throw conflict("This import was already committed.");
  const byIndex = new Map(input.columns.map((c) => [c.index, c]));
  const columns: ColumnMapping[] = r.preview.columns.map((c) => {
    const u = byIndex.get(c.index);
    if (!u) return c;
    return {
      ...c,
      field: u.field as RunFieldKey | null,
      unit: (u.unit as UnitHint | null | undefined) ?? c.unit,
      matchedBy: u.field ? "user" : null,
      ignored: false,
    };
  });
  const preview = buildPreview(
    r.sourceTable,
    { columns },
    await existingRuns(me.teamId, project.id),
    settingsOf(project),
  );
  await savePreview(db(), importId, preview);
  return { ...view(r), preview };
}

export interface CommitResult {
  added: number;
  changed: number;
  unchanged: number;
  missing: string[];
}

/** Writes every row of the import in one transaction, or nothing (422) while any error is left. */
export async function commitImport(
  me: TeamMe,
  project: ProjectRecord,
  importId: string,
): Promise<CommitResult> {
  return db().transaction(async (tx) => {
    const r = await getImport(me.teamId, project.id, importId, { withTable: true, forUpdate: tx });
    if (!r) throw notFound("That import");
    if (r.status !== "preview") throw conflict("This import was already committed.");
    const current = await listAllRuns(me.teamId, project.id, tx);
    // Check again against the runs as they are now: someone may have edited them since the preview.
    const preview = buildPreview(r.sourceTable, { columns: r.preview.columns }, current, settingsOf(project));
    if (!preview.canCommit) {
      const rowErrors = preview.rows.flatMap((row) => row.errors);
      const issues = [...preview.fileErrors, ...rowErrors];
      throw invalid(
        `The import still has ${issues.length} error${issues.length === 1 ? "" : "s"}; nothing was written. ${issues[0]?.message ?? ""}`.trim(),
        { errors: issues.slice(0, 500), total: issues.length },
      );
    }
    const byKey = new Map(current.map((run) => [wireIdKey(run.wireId), run]));
    const changedKeys = new Set(preview.diff.changed.map((c) => wireIdKey(c.wireId)));
    const addedRows = preview.rows.filter((row) => row.status === "added" && row.run);
    const changedRows = preview.rows.filter((row) => row.status === "changed" && row.run);

    await createRunsInTx(
      tx,
      me,
      project,
      addedRows.map((row) => ({ ...row.run!, wireId: row.run!.wireId || null })),
    );
    const updates = changedRows.flatMap((row) => {
      const key = wireIdKey(row.run!.wireId);
      const existing = byKey.get(key);
      if (!existing || !changedKeys.has(key)) return [];
      const changes = preview.diff.changed.find((c) => wireIdKey(c.wireId) === key)!.changes;
      const patch: Record<string, unknown> = {};
      for (const ch of changes) patch[ch.field] = ch.new;
      return [{ id: (existing as RunData & { id: string }).id, changes: patch as Partial<RunData> }];
    });
    const updated = await updateRunsEach(tx, updates);
    await recordAudits(
      tx,
      updated.map((u) => ({
        teamId: me.teamId,
        actorUserId: me.user.id,
        action: "run.update",
        entityType: "run",
        entityId: u.id,
        detail: { projectId: project.id, wireId: u.wireId, via: "import", importId },
      })),
    );
    await recordAudit(tx, {
      teamId: me.teamId,
      actorUserId: me.user.id,
      action: "import.commit",
      entityType: "run_import",
      entityId: importId,
      detail: {
        projectId: project.id,
        filename: r.filename,
        added: addedRows.length,
        changed: updated.length,
      },
    });
    await markCommitted(tx, importId);
    await touchProject(tx, project.id);
    return {
      added: addedRows.length,
      changed: updated.length,
      unchanged: preview.diff.unchanged.length,
      missing: preview.diff.missing,
    };
  });
}
