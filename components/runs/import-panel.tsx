"use client";
// Import a run list: drop a CSV or XLSX file, check the column mapping and every row, then commit all or nothing.
import { useState } from "react";
import { useDropzone } from "react-dropzone";
import { ApiError, fetcher, sendJson } from "@/lib/client/fetcher";
import { RUN_FIELDS } from "@/lib/domain/run-fields";
import type { ImportPreview } from "@/lib/import/types";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";

interface ImportView {
  id: string;
  filename: string;
  status: string;
  preview: ImportPreview;
}

export function ImportPanel({
  projectId,
  onCommitted,
  onClose,
}: {
  projectId: string;
  onCommitted: (message: string) => void;
  onClose: () => void;
}) {
  const [imp, setImp] = useState<ImportView | null>(null);
  const [busy, setBusy] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);

  async function upload(file: File) {
    setBusy(`Reading ${file.name}…`);
    setError(null);
    const body = new FormData();
    body.append("file", file);
    try {
      setImp(await fetcher<ImportView>(`/api/projects/${projectId}/imports`, { method: "POST", body }));
    } catch (e) {
      setError(e instanceof Error ? e.message : "The file could not be read.");
    } finally {
      setBusy(null);
    }
  }

  const { getRootProps, getInputProps, isDragActive } = useDropzone({
    multiple: false,
    maxSize: 10 * 1024 * 1024,
    onDrop: (accepted, rejected) => {
      if (rejected[0]) {
        const tooBig = rejected[0].errors.some((e) => e.code === "file-too-large");
        setError(
          tooBig ? "The file is larger than 10 MB." : (rejected[0].errors[0]?.message ?? "File refused."),
        );
        return;
      }
      if (accepted[0]) void upload(accepted[0]);
    },
  });

  async function remap(index: number, field: string) {
    if (!imp) return;
    setBusy("Checking the rows again…");
    try {
      const next = await sendJson<ImportView>(`/api/projects/${projectId}/imports/${imp.id}`, "PATCH", {
        columns: [{ index, field: field === "" ? null : field }],
      });
      setImp(next);
    } catch (e) {
      setError(e instanceof Error ? e.message : "The mapping was not saved.");
    } finally {
      setBusy(null);
    }
  }

  async function commit() {
    if (!imp) return;
    setBusy("Writing the runs…");
    try {
      const r = await sendJson<{ added: number; changed: number; unchanged: number; missing: string[] }>(
        `/api/projects/${projectId}/imports/${imp.id}/commit`,
        "POST",
      );
      onCommitted(
        `Imported ${imp.filename}: ${r.added} added, ${r.changed} changed, ${r.unchanged} unchanged` +
          (r.missing.length
            ? `; ${r.missing.length} runs of the project are not in the file and were kept.`
            : "."),
      );
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "The import was not committed.");
    } finally {
      setBusy(null);
    }
  }

  const p = imp?.preview;
  const rowErrors = p ? p.rows.flatMap((r) => r.errors) : [];
  return (
    <section
      aria-label="Import runs"
      className="flex flex-col gap-4 rounded-lg border border-line bg-white p-5 shadow-sm"
    >
      <div className="flex items-start justify-between gap-3">
        <div>
          <h2 className="text-lg font-semibold">Import a run list</h2>
          <p className="text-sm text-ink-soft">
            CSV (UTF-8) or XLSX, up to 10 MB and 20,000 rows, header in the first row. Lengths may be written
            as 1250, 1.25 m, 49.2 in or 4&apos; 1&quot;; gauges as 18 AWG or 0.75 mm²; colours as IEC 60757
            codes or names.
          </p>
        </div>
        <Button variant="quiet" size="sm" onClick={onClose}>
          Close
        </Button>
      </div>

      {!imp ? (
        <div
          {...getRootProps()}
          className={`flex min-h-36 cursor-pointer flex-col items-center justify-center gap-2 rounded-lg border-2 border-dashed p-6 text-center ${isDragActive ? "border-copper bg-copper-light/40" : "border-line-strong bg-paper"}`}
        >
          <input {...getInputProps()} aria-label="Run list file" />
          <p className="font-semibold">
            {isDragActive ? "Drop the file here" : "Drop a file here, or click to choose one"}
          </p>
          <p className="text-xs text-ink-faint">Nothing is written until you commit the checked preview.</p>
        </div>
      ) : null}

      {busy ? (
        <p role="status" className="text-sm text-ink-soft">
          {busy}
        </p>
      ) : null}
      {error ? <Notice tone="error">{error}</Notice> : null}

      {imp && p ? (
        <>
          <div className="flex flex-wrap gap-4 text-sm" aria-label="Import summary">
            <Stat label="rows" value={p.summary.rows} />
            <Stat label="to add" value={p.summary.added} />
            <Stat label="to change" value={p.summary.changed} />
            <Stat label="unchanged" value={p.summary.unchanged} />
            <Stat label="not in file (kept)" value={p.summary.missing} />
            <Stat label="errors" value={p.summary.errors} tone={p.summary.errors ? "fail" : undefined} />
            <Stat label="warnings" value={p.summary.warnings} />
          </div>

          <details open className="rounded border border-line">
            <summary className="cursor-pointer px-3 py-2 text-sm font-semibold">
              Columns found in {imp.filename}
            </summary>
            <table className="w-full text-sm" aria-label="Column mapping">
              <thead className="bg-paper-deep text-left">
                <tr>
                  <th className="px-3 py-1.5">Header in the file</th>
                  <th className="px-3 py-1.5">Run field</th>
                  <th className="px-3 py-1.5">Matched</th>
                </tr>
              </thead>
              <tbody>
                {p.columns.map((c) => (
                  <tr key={c.index} className="border-t border-line/70">
                    <td className="px-3 py-1.5 font-mono">{c.header}</td>
                    <td className="px-3 py-1.5">
                      {c.ignored ? (
                        <span className="text-ink-faint">computed column, not imported</span>
                      ) : (
                        <select
                          aria-label={`Field for column ${c.header}`}
                          value={c.field ?? ""}
                          onChange={(e) => void remap(c.index, e.target.value)}
                          className="h-8 rounded border border-line-strong px-2"
                        >
                          <option value="">(do not import)</option>
                          {RUN_FIELDS.map((f) => (
                            <option key={f.key} value={f.key}>
                              {f.key}
                            </option>
                          ))}
                        </select>
                      )}
                    </td>
                    <td className="px-3 py-1.5 text-xs text-ink-faint">{c.matchedBy ?? "—"}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </details>

          {p.fileErrors.length || rowErrors.length ? (
            <div className="flex flex-col gap-2">
              <h3 className="font-semibold text-fail">
                Fix these before committing ({p.fileErrors.length + rowErrors.length})
              </h3>
              <ul
                className="max-h-64 overflow-auto rounded border border-fail/40 bg-fail-light/40 text-sm"
                aria-label="Import errors"
              >
                {[...p.fileErrors, ...rowErrors].slice(0, 300).map((e, i) => (
                  <li key={i} className="border-b border-fail/20 px-3 py-1.5 last:border-0">
                    {e.row ? <span className="font-semibold">Row {e.row}: </span> : null}
                    {e.message}
                  </li>
                ))}
              </ul>
            </div>
          ) : null}

          {p.diff.changed.length ? (
            <details className="rounded border border-line">
              <summary className="cursor-pointer px-3 py-2 text-sm font-semibold">
                Changes to existing runs ({p.diff.changed.length})
              </summary>
              <ul className="max-h-64 overflow-auto text-sm">
                {p.diff.changed.map((c) => (
                  <li key={c.wireId} className="border-t border-line/70 px-3 py-1.5">
                    <span className="font-mono font-semibold">{c.wireId}</span>{" "}
                    {c.changes
                      .map((ch) => `${ch.field}: ${String(ch.old ?? "—")} → ${String(ch.new ?? "—")}`)
                      .join("; ")}
                  </li>
                ))}
              </ul>
            </details>
          ) : null}

          <div className="flex flex-wrap gap-2">
            <Button onClick={() => void commit()} disabled={!p.canCommit || Boolean(busy)}>
              Commit {p.summary.added + p.summary.changed} runs
            </Button>
            <Button
              variant="secondary"
              onClick={() => {
                setImp(null);
                setError(null);
              }}
            >
              Choose another file
            </Button>
          </div>
        </>
      ) : null}
    </section>
  );
}

function Stat({ label, value, tone }: { label: string; value: number; tone?: "fail" }) {
  return (
    <span className={`rounded border px-3 py-1 ${tone === "fail" ? "border-fail text-fail" : "border-line"}`}>
      <span className="font-bold tabular-nums">{value}</span> {label}
    </span>
  );
}
