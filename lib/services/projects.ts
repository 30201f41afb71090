// Project look-ups and changes shared by handlers and pages: a project of another team is simply not found.
import { db } from "@/lib/db/knex";
import { recordAudit } from "@/lib/db/audit";
import {
  getProject,
  insertProject,
  projectNameTaken,
  updateProjectIfVersion,
  type ProjectRecord,
  type ProjectWrite,
} from "@/lib/db/projects";
import type { TeamMe } from "@/lib/auth/guards";
import { conflict, notFound } from "@/lib/http/errors";
import { uuidSchema } from "@/lib/validation/common";
import type { ProjectCreateInput, ProjectPatchInput } from "@/lib/validation/projects";

export async function requireProject(teamId: string, projectId: string | undefined): Promise<ProjectRecord> {
  if (!projectId || !uuidSchema.safeParse(projectId).success) throw notFound("That project");
  const p = await getProject(teamId, projectId);
  if (!p) throw notFound("That project");
  return p;
}

export async function createProject(me: TeamMe, input: ProjectCreateInput): Promise<ProjectRecord> {
  const id = await db().transaction(async (tx) => {
    if (await projectNameTaken(tx, me.teamId, input.name)) {
      throw conflict(`A project called "${input.name}" already exists in this team.`);
    }
    const projectId = await insertProject(tx, me.teamId, input);
    await recordAudit(tx, {
      teamId: me.teamId,
      actorUserId: me.user.id,
      action: "project.create",
      entityType: "project",
      entityId: projectId,
      detail: { name: input.name },
    });
    return projectId;
  });
  return requireProject(me.teamId, id);
}

export async function patchProject(
  me: TeamMe,
  projectId: string,
  input: ProjectPatchInput,
): Promise<ProjectRecord> {
  const current = await requireProject(me.teamId, projectId);
  const { version, archived, ...rest } = input;
  const data: ProjectWrite = { ...rest };
  if (archived !== undefined) data.archivedAt = archived ? new Date() : null;
  await db().transaction(async (tx) => {
    if (rest.name && (await projectNameTaken(tx, me.teamId, rest.name, projectId))) {
      throw conflict(`A project called "${rest.name}" already exists in this team.`);
    }
    if (!(await updateProjectIfVersion(tx, me.teamId, projectId, version, data))) {
      const fresh = await getProject(me.teamId, projectId, tx);
      throw conflict("Someone else changed this project since you opened it.", { current: fresh ?? current });
    }
    await recordAudit(tx, {
      teamId: me.teamId,
      actorUserId: me.user.id,
      action:
        archived === true ? "project.archive" : archived === false ? "project.restore" : "project.update",
      entityType: "project",
      entityId: projectId,
      detail: { changed: Object.keys(data) },
    });
  });
  return requireProject(me.teamId, projectId);
}
