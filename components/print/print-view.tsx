"use client";
// The Print screen: choose runs and a template, preview the marker strip in the browser, then download it.
import { useMemo, useState } from "react";
import useSWR from "swr";
import { fetcher } from "@/lib/client/fetcher";
import { useRuns } from "@/lib/client/use-runs";
import type { TemplateView } from "@/lib/services/print";
import type { Role } from "@/lib/auth/roles";
import { sendJson } from "@/lib/client/fetcher";
import { TemplateEditor } from "@/components/print/template-editor";
import { BENCH_STATES } from "@/lib/domain/types";
import { Button, buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { SkeletonRows } from "@/components/ui/skeleton";

type Mode = "all" | "state" | "type" | "list";

export function PrintView({
  projectId,
  initialRuns,
  role,
  pageSize,
}: {
  projectId: string;
  initialRuns: string;
  role: Role;
  pageSize: "A4" | "Letter";
}) {
  const templates = useSWR<{ items: TemplateView[] }>("/api/print/templates", fetcher);
  const [paper, setPaper] = useState(pageSize);
  const [editing, setEditing] = useState(false);
  const runs = useRuns(projectId);
  const [mode, setMode] = useState<Mode>(initialRuns ? "list" : "all");
  const [state, setState] = useState<string>("planned");
  const [wireType, setWireType] = useState<string>("");
  const [list, setList] = useState(initialRuns.split(",").filter(Boolean).join("\n"));
  const [templateId, setTemplateId] = useState("a4-proof-mixed");
  const [preview, setPreview] = useState<string | null>(null);
  const [loading, setLoading] = useState(false);
  const [error, setError] = useState<string | null>(null);

  const all = runs.data?.items;
  const typeKey = (r: { gauge: string; colour: string; insulation: string | null }) =>
    `${r.gauge} ${r.colour}${r.insulation ? ` ${r.insulation}` : ""}`;
  const types = useMemo(() => [...new Set((all ?? []).map(typeKey))].sort(), [all]);
  const typeRuns = useMemo(
    () => (all ?? []).filter((r) => typeKey(r) === (wireType || types[0])).map((r) => r.wireId),
    [all, wireType, types],
  );
  const chosen = useMemo(() => {
    if (!all) return 0;
    if (mode === "state") return all.filter((r) => r.state === state).length;
    if (mode === "type") return typeRuns.length;
    if (mode === "list") {
      const ids = new Set(list.split(/[\s,]+/).filter(Boolean));
      return all.filter((r) => ids.has(r.wireId) || ids.has(r.id)).length;
    }
    return all.length;
  }, [all, mode, state, typeRuns, list]);

  const url = useMemo(() => {
    const p = new URLSearchParams({ template: templateId });
    if (mode === "state") p.set("state", state);
    if (mode === "type") p.set("runs", typeRuns.join(","));
    if (mode === "list")
      p.set(
        "runs",
        list
          .split(/[\s,]+/)
          .filter(Boolean)
          .join(","),
      );
    return `/api/projects/${projectId}/markers.pdf?${p.toString()}`;
  }, [projectId, templateId, mode, state, typeRuns, list]);

  async function showPreview() {
    setError(null);
    setLoading(true);
    // Ask once for the answer's status so a refusal shows as a message, not as a broken frame.
    try {
      const res = await fetch(url, { method: "GET" });
      if (!res.ok) {
        const body = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
        throw new Error(body?.error?.message ?? `The server answered ${res.status}.`);
      }
      const blob = await res.blob();
      setPreview(URL.createObjectURL(blob));
    } catch (e) {
      setError(e instanceof Error ? e.message : "The preview could not be made.");
    } finally {
      setLoading(false);
    }
  }

  if (templates.error || runs.error) {
    return <Notice tone="error">The print options could not be loaded. Reload the page to try again.</Notice>;
  }
  if (!templates.data || !all) return <SkeletonRows rows={5} label="Loading print options" />;
  const template = templates.data.items.find((t) => t.id === templateId);

  return (
    <div className="grid gap-6 lg:grid-cols-[22rem_1fr]">
      <form
        className="flex flex-col gap-4 rounded-lg border border-line bg-white p-5"
        aria-label="Print options"
        onSubmit={(e) => {
          e.preventDefault();
          void showPreview();
        }}
      >
        <fieldset className="flex flex-col gap-2">
          <legend className="mb-1 text-sm font-semibold">Markers for</legend>
          {(
            [
              ["all", `every run (${all.length})`],
              ["state", "runs in a state"],
              ["type", "one wire type"],
              ["list", "these wire IDs (reprint)"],
            ] as const
          ).map(([m, label]) => (
            <label key={m} className="flex items-center gap-2 text-sm">
              <input type="radio" name="mode" checked={mode === m} onChange={() => setMode(m)} />
              {label}
            </label>
          ))}
          {mode === "state" ? (
            <select
              aria-label="State"
              value={state}
              onChange={(e) => setState(e.target.value)}
              className="h-10 rounded-md border border-line-strong px-2 capitalize"
            >
              {BENCH_STATES.map((s) => (
                <option key={s}>{s}</option>
              ))}
            </select>
          ) : null}
          {mode === "type" ? (
            <select
              aria-label="Wire type"
              value={wireType || types[0]}
              onChange={(e) => setWireType(e.target.value)}
              className="h-10 rounded-md border border-line-strong px-2"
            >
              {types.map((g) => (
                <option key={g}>{g}</option>
              ))}
            </select>
          ) : null}
          {mode === "list" ? (
            <textarea
              aria-label="Wire IDs"
              value={list}
              onChange={(e) => setList(e.target.value)}
              rows={5}
              placeholder="HR3-001, HR3-002 …"
              className="rounded-md border border-line-strong p-2 font-mono text-sm"
            />
          ) : null}
          <p className="text-xs text-ink-faint">{chosen} runs chosen; each gets a marker at both ends.</p>
        </fieldset>

        <label className="flex flex-col gap-1 text-sm font-semibold">
          Template
          <select
            value={templateId}
            onChange={(e) => setTemplateId(e.target.value)}
            className="h-10 rounded-md border border-line-strong px-2 font-normal"
          >
            {templates.data.items.map((t) => (
              <option key={t.id} value={t.id}>
                {t.name}
              </option>
            ))}
          </select>
        </label>
        {template ? (
          <p className="text-xs text-ink-faint">
            {template.kind === "sheet" ? "Sheet" : "Continuous strip"} · printer offset{" "}
            {template.printerOffsetXMm} / {template.printerOffsetYMm} mm ·{" "}
            <a className="underline" href={`/api/print/templates/${template.id}/calibration.pdf`}>
              calibration page
            </a>
          </p>
        ) : null}

        {role === "lead" && template ? (
          <details open={editing} onToggle={(e) => setEditing((e.target as HTMLDetailsElement).open)}>
            <summary className="cursor-pointer text-sm font-semibold">Save a copy as a team template</summary>
            <div className="mt-2">
              <TemplateEditor
                key={template.id}
                base={template}
                onSaved={(t) => {
                  void templates.mutate();
                  setTemplateId(t.id);
                  setEditing(false);
                }}
              />
            </div>
          </details>
        ) : null}
        {role === "lead" && template && !template.builtIn ? (
          <Button
            type="button"
            size="sm"
            variant="quiet"
            onClick={() =>
              void sendJson(`/api/print/templates/${template.id}`, "DELETE").then(() => {
                setTemplateId("a4-proof-mixed");
                void templates.mutate();
              })
            }
          >
            Delete this team template
          </Button>
        ) : null}

        <Button type="submit" disabled={loading || chosen === 0}>
          {loading ? `Preparing ${chosen * 2}+ markers…` : "Preview"}
        </Button>
        <a className={buttonClass("secondary")} href={url} download>
          Download marker PDF
        </a>
        {error ? <Notice tone="error">{error}</Notice> : null}
        {role === "lead" ? (
          <label className="flex items-center justify-between gap-2 text-sm">
            Cut sheets print on
            <select
              aria-label="Cut sheet paper"
              value={paper}
              onChange={(e) => {
                const v = e.target.value as "A4" | "Letter";
                setPaper(v);
                void sendJson("/api/team/page-size", "PATCH", { pageSize: v });
              }}
              className="h-9 rounded-md border border-line-strong px-2"
            >
              <option value="A4">A4</option>
              <option value="Letter">US Letter</option>
            </select>
          </label>
        ) : null}
        <p className="text-xs text-ink-faint">
          Print at 100 % (no fit-to-page). Barcodes encode each run&apos;s trace link, or its 8-character code
          on sleeves too small for the link.
        </p>
      </form>

      <section aria-label="Preview" className="min-h-[60vh] rounded-lg border border-line bg-paper-deep">
        {preview ? (
          <iframe title="Marker preview" src={preview} className="h-[80vh] w-full rounded-lg" />
        ) : (
          <div className="flex h-full min-h-[60vh] items-center justify-center p-6 text-center text-sm text-ink-soft">
            Choose runs and a template, then Preview to see the pages here before printing.
          </div>
        )}
      </section>
    </div>
  );
}
