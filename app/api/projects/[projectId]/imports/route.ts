import { json, route } from "@/lib/http/handler";
import { invalid, tooLarge } from "@/lib/http/errors";
import { requireProject } from "@/lib/services/projects";
import { uploadImport } from "@/lib/services/imports";
import { MAX_UPLOAD_BYTES } from "@/lib/import";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** Multipart upload (field `file`, .csv or .xlsx) → a stored, checked preview. Nothing is written to the runs. */
export const POST = route("POST /api/projects/[projectId]/imports", async ({ me, params, req }) => {
  const project = await requireProject(me.teamId, params.projectId);
  const length = Number(req.headers.get("content-length") ?? "0");
  if (length > MAX_UPLOAD_BYTES + 64 * 1024) throw tooLarge("The upload is larger than 10 MB.");
  let form: FormData;
  try {
    form = await req.formData();
  } catch {
    throw invalid('Send the file as multipart/form-data in a field named "file".');
  }
  const file = form.get("file");
  if (!(file instanceof File)) throw invalid('Send the file as multipart/form-data in a field named "file".');
  return json(await uploadImport(me, project, file), 201);
});
