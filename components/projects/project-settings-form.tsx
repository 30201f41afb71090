"use client";
// A project's settings: name, wire-ID prefix, supply, check temperature, the slack rule and plan settings.
import { useState } from "react";
import { useRouter } from "next/navigation";
import { ApiError, sendJson } from "@/lib/client/fetcher";
import { projectPatchSchema } from "@/lib/validation/projects";
import type { ProjectRecord } from "@/lib/db/projects";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";

type Key =
  | "name"
  | "wireIdPrefix"
  | "supplyV"
  | "conductorTempC"
  | "gaugeSystem"
  | "slackPct"
  | "slackMinMm"
  | "serviceLoopMm"
  | "roundingMm"
  | "endDiscardMm"
  | "keepRemnantMm"
  | "markerRepeatMm"
  | "defaultDropClass";

const FIELDS: { key: Key; label: string; hint: string; options?: string[] }[] = [
  { key: "name", label: "Project name", hint: "" },
  {
    key: "wireIdPrefix",
    label: "Wire-ID prefix",
    hint: "New runs without a wire ID get the next number after it.",
  },
  {
    key: "supplyV",
    label: "Supply (V)",
    hint: "Default for runs that give none. Low-voltage DC up to 60 V.",
  },
  {
    key: "conductorTempC",
    label: "Conductor temperature for checks (°C)",
    hint: "Resistance is corrected to this temperature (IEC 60028 coefficient). Default 60 °C.",
  },
  { key: "gaugeSystem", label: "Gauge system for suggestions", hint: "", options: ["awg", "metric"] },
  { key: "slackPct", label: "Slack, percent of routed length", hint: "Default 5 % (common practice)." },
  { key: "slackMinMm", label: "Slack, at least (mm)", hint: "Default 50 mm (common practice)." },
  { key: "serviceLoopMm", label: "Service loop per end (mm)", hint: "Default 25 mm (common practice)." },
  { key: "roundingMm", label: "Round cut lengths up to (mm)", hint: "Default 5 mm." },
  { key: "endDiscardMm", label: "End discard per new spool (mm)", hint: "Default 100 mm (common practice)." },
  {
    key: "keepRemnantMm",
    label: "Keep leftovers from (mm)",
    hint: "Shorter leftovers are scrap. Default 1000 mm (common practice).",
  },
  { key: "markerRepeatMm", label: "Repeat markers every (mm)", hint: "Blank: markers at both ends only." },
  {
    key: "defaultDropClass",
    label: "Default drop class",
    hint: "critical 3 %, standard 10 % (ABYC E-11); motor 5 % (common practice).",
    options: ["critical", "standard", "motor", "custom"],
  },
];

export function ProjectSettingsForm({ project, canEdit }: { project: ProjectRecord; canEdit: boolean }) {
  const router = useRouter();
  const [values, setValues] = useState<Record<Key, string>>(
    () =>
      Object.fromEntries(
        FIELDS.map((f) => [f.key, project[f.key] === null ? "" : String(project[f.key])]),
      ) as Record<Key, string>,
  );
  const [version, setVersion] = useState(project.version);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ tone: "ok" | "error" | "caution"; text: string } | null>(null);

  async function save(extra: Record<string, unknown> = {}) {
    const body: Record<string, unknown> = { version, ...extra };
    for (const f of FIELDS) {
      const v = values[f.key].trim();
      body[f.key] = v === "" ? (f.key === "markerRepeatMm" ? null : undefined) : v;
    }
    const parsed = projectPatchSchema.safeParse(body);
    if (!parsed.success) {
      const e: Record<string, string> = {};
      for (const i of parsed.error.issues) e[String(i.path[0])] ??= i.message;
      return setErrors(e);
    }
    try {
      const p = await sendJson<ProjectRecord>(`/api/projects/${project.id}`, "PATCH", parsed.data);
      setVersion(p.version);
      setErrors({});
      setMessage({
        tone: "ok",
        text: extra.archived ? "Project archived." : "Settings saved; checks and cut lengths use them now.",
      });
      router.refresh();
      if (extra.archived) router.push("/projects");
    } catch (e) {
      const stale = e instanceof ApiError && e.status === 409;
      setMessage({ tone: stale ? "caution" : "error", text: e instanceof Error ? e.message : "Not saved." });
      if (stale) router.refresh();
    }
  }

  return (
    <form
      className="flex max-w-2xl flex-col gap-4"
      aria-label="Project settings"
      onSubmit={(e) => {
        e.preventDefault();
        void save();
      }}
    >
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
      {FIELDS.map((f) => (
        <div key={f.key} className="grid gap-1 sm:grid-cols-[18rem_1fr] sm:items-center">
          <label htmlFor={`ps-${f.key}`} className="text-sm font-semibold">
            {f.label}
          </label>
          <div>
            {f.options ? (
              <select
                id={`ps-${f.key}`}
                disabled={!canEdit}
                value={values[f.key]}
                onChange={(e) => setValues({ ...values, [f.key]: e.target.value })}
                className="h-10 w-full rounded-md border border-line-strong bg-white px-2"
              >
                {f.options.map((o) => (
                  <option key={o}>{o}</option>
                ))}
              </select>
            ) : (
              <input
                id={`ps-${f.key}`}
                disabled={!canEdit}
                value={values[f.key]}
                onChange={(e) => setValues({ ...values, [f.key]: e.target.value })}
                aria-invalid={errors[f.key] ? true : undefined}
                className={`h-10 w-full rounded-md border bg-white px-3 disabled:bg-paper ${errors[f.key] ? "border-fail" : "border-line-strong"}`}
              />
            )}
            {errors[f.key] ? <p className="text-sm text-fail">{errors[f.key]}</p> : null}
            {f.hint ? <p className="text-xs text-ink-faint">{f.hint}</p> : null}
          </div>
        </div>
      ))}
      {canEdit ? (
        <div className="flex gap-2">
          <Button type="submit">Save settings</Button>
          <Button type="button" variant="secondary" onClick={() => void save({ archived: true })}>
            Archive project
          </Button>
        </div>
      ) : (
        <p className="text-sm text-ink-soft">Only the team&apos;s lead can change these settings.</p>
      )}
    </form>
  );
}
