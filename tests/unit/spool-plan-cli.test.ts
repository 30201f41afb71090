import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";

const root = process.cwd();
const tsx = join(root, "node_modules", ".bin", "tsx");
const dir = mkdtempSync(join(tmpdir(), "loomwright-plan-"));

function runPlan(file: string, input?: string) {
  const r = spawnSync(tsx, ["scripts/plan.ts", file], {
    cwd: root,
    input,
    encoding: "utf8",
    timeout: 30_000,
  });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

// Harrow-3 demo wires (our own example data); 25 ft = 7620 mm.
const input = {
  cuts: [
    { id: "HR3-001", wireType: "18 AWG RD TXL", lengthMm: 2450 },
    { id: "HR3-002", wireType: "18 AWG RD TXL", lengthMm: 1830 },
    { id: "HR3-003", wireType: "18 AWG RD TXL", lengthMm: 610 },
    { id: "HR3-004", wireType: "18 AWG BK TXL", lengthMm: 9000 },
  ],
  stock: [
    { id: "RD remnant A", wireType: "18 AWG RD TXL", lengthMm: 3100, costCents: 0, available: 1 },
    { id: "RD 25 ft", wireType: "18 AWG RD TXL", lengthMm: 7620, costCents: 457, available: null },
    { id: "BK 25 ft", wireType: "18 AWG BK TXL", lengthMm: 7620, costCents: 457, available: null },
  ],
  options: { timeLimitMs: 1000 },
};

describe("scripts/plan.ts", () => {
  it("prints a plan as JSON", () => {
    const file = join(dir, "plan.json");
    writeFileSync(file, JSON.stringify(input));
    const r = runPlan(file);
    expect(r.stderr).toBe("");
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as {
      spools: { stockId: string; cutIds: string[]; leftoverMm: number }[];
      costCents: number;
      lowerBoundCents: number;
      gapPct: number | null;
      unplaced: { id: string; reason: string }[];
    };
    expect(Object.keys(out)).toEqual(
      expect.arrayContaining(["spools", "costCents", "lowerBoundCents", "gapPct", "unplaced"]),
    );
    // The 9000 mm cut fits no 7520 mm usable put-up (7620 − 100 mm end discard), so it is reported.
    expect(out.unplaced).toEqual([expect.objectContaining({ id: "HR3-004" })]);
    const placed = out.spools.flatMap((s) => s.cutIds).sort();
    expect(placed).toEqual(["HR3-001", "HR3-002", "HR3-003"]);
    for (const s of out.spools) {
      expect(typeof s.stockId).toBe("string");
      expect(Number.isInteger(s.leftoverMm)).toBe(true);
    }
    expect(out.costCents).toBeGreaterThanOrEqual(out.lowerBoundCents);
  }, 30_000);

  // The two failure cases read stdin ("-").
  it("exits 2 with a message on bad JSON", () => {
    const r = runPlan("-", "{ cuts: [");
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/not valid JSON/);
    expect(r.stdout).toBe("");
  }, 30_000);

  it("exits 2 naming the path of an invalid field", () => {
    const bad = { ...input, cuts: [{ id: "HR3-001", wireType: "18 AWG RD TXL", lengthMm: -5 }] };
    const r = runPlan("-", JSON.stringify(bad));
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/cuts\[0\]\.lengthMm/);
  }, 30_000);
});
