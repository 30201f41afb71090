"use client";
// The lead's form for a new project; the slack rule and other settings start at the defaults shown on Settings.
import { useState } from "react";
import { useRouter } from "next/navigation";
import { sendJson } from "@/lib/client/fetcher";
import { projectCreateSchema } from "@/lib/validation/projects";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";

export function NewProjectForm() {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [name, setName] = useState("");
  const [prefix, setPrefix] = useState("W");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const parsed = projectCreateSchema.safeParse({ name, wireIdPrefix: prefix });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message ?? "Check the form.");
    setBusy(true);
    try {
      const p = await sendJson<{ id: string }>("/api/projects", "POST", parsed.data);
      router.push(`/projects/${p.id}`);
    } catch (err) {
      setError(err instanceof Error ? err.message : "The project was not created.");
      setBusy(false);
    }
  }

  if (!open) return <Button onClick={() => setOpen(true)}>New project</Button>;
  return (
    <form
      onSubmit={(e) => void submit(e)}
      className="flex flex-wrap items-end gap-3 rounded-lg border border-line bg-white p-4"
      aria-label="New project"
    >
      <div className="w-64">
        <Field
          id="np-name"
          label="Project name"
          value={name}
          onChange={(e) => setName(e.target.value)}
          error={error ?? undefined}
          autoFocus
        />
      </div>
      <div className="w-36">
        <Field
          id="np-prefix"
          label="Wire-ID prefix"
          value={prefix}
          onChange={(e) => setPrefix(e.target.value)}
          hint="e.g. HR3-"
        />
      </div>
      <Button type="submit" disabled={busy}>
        {busy ? "Creating…" : "Create"}
      </Button>
      <Button type="button" variant="quiet" onClick={() => setOpen(false)}>
        Cancel
      </Button>
    </form>
  );
}
