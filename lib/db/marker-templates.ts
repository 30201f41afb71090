// A team's own marker templates.
import { db, type Db } from "@/lib/db/knex";
import type { MarkerTemplate } from "@/lib/domain/marker-templates";

export interface TeamTemplateRow {
  id: string;
  name: string;
  body: Omit<MarkerTemplate, "id" | "name">;
  version: number;
}

export async function listTeamTemplates(teamId: string, q: Db = db()): Promise<TeamTemplateRow[]> {
  return (await q("markerTemplate")
    .where({ teamId })
    .orderBy("name")
    .select("id", "name", "body", "version")) as TeamTemplateRow[];
}

export async function getTeamTemplate(
  teamId: string,
  id: string,
  q: Db = db(),
): Promise<TeamTemplateRow | null> {
  const row = (await q("markerTemplate").where({ teamId, id }).first("id", "name", "body", "version")) as
    TeamTemplateRow | undefined;
  return row ?? null;
}

export async function insertTeamTemplate(q: Db, teamId: string, name: string, body: object): Promise<string> {
  const [row] = (await q("markerTemplate")
    .insert({ teamId, name, body: JSON.stringify(body) })
    .returning("id")) as [{ id: string }];
  return row.id;
}

export async function updateTeamTemplateIfVersion(
  q: Db,
  teamId: string,
  id: string,
  version: number,
  name: string,
  body: object,
): Promise<boolean> {
  const n = await q("markerTemplate")
    .where({ teamId, id, version })
    .update({ name, body: JSON.stringify(body), version: version + 1, updatedAt: q.fn.now() });
  return Number(n) === 1;
}

export async function deleteTeamTemplate(q: Db, teamId: string, id: string): Promise<boolean> {
  return Number(await q("markerTemplate").where({ teamId, id }).delete()) === 1;
}

export async function setTeamPageSize(q: Db, teamId: string, pageSize: "A4" | "Letter"): Promise<void> {
  await q("team").where({ id: teamId }).update({ pageSize });
}
