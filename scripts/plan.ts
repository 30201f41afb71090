// Command-line spool planner: `npm run --silent plan -- FILE` (FILE "-" reads stdin) reads cuts, stock and
// options as JSON, validates them, and prints the plan as JSON. Exit 2 on unreadable or invalid input.

import { readFileSync } from "node:fs";
import { z } from "zod";
import { DEFAULT_PLAN_OPTIONS, planSpools, type PlanResult } from "@/lib/domain/spool-plan";

const wholeMm = (what: string) =>
  z.number({ error: `${what} must be a number` }).int(`${what} must be a whole number of mm`);

const cutSchema = z.object({
  id: z.string({ error: "id must be a string" }).min(1, "id must not be empty"),
  wireType: z.string({ error: "wireType must be a string" }).min(1, "wireType must not be empty"),
  lengthMm: wholeMm("lengthMm").positive("lengthMm must be greater than 0"),
});

const stockSchema = z.object({
  id: z.string({ error: "id must be a string" }).min(1, "id must not be empty"),
  wireType: z.string({ error: "wireType must be a string" }).min(1, "wireType must not be empty"),
  lengthMm: wholeMm("lengthMm").positive("lengthMm must be greater than 0"),
  costCents: z
    .number({ error: "costCents must be a number" })
    .int("costCents must be a whole number of cents")
    .nonnegative("costCents must not be negative"),
  available: z
    .number({ error: "available must be a whole number or null (unlimited)" })
    .int("available must be a whole number or null (unlimited)")
    .nonnegative("available must not be negative")
    .nullable(),
  kind: z.enum(["shelf", "putup"], { error: 'kind must be "shelf" or "putup"' }).optional(),
});

const optionsSchema = z
  .object({
    endDiscardMm: wholeMm("endDiscardMm").nonnegative("endDiscardMm must not be negative"),
    keepRemnantMm: wholeMm("keepRemnantMm").nonnegative("keepRemnantMm must not be negative"),
    timeLimitMs: z
      .number({ error: "timeLimitMs must be a number" })
      .positive("timeLimitMs must be greater than 0")
      .max(600_000, "timeLimitMs must be at most 600000 (10 minutes)"),
  })
  .partial()
  .strict();

function noDuplicateIds(list: { id: string }[], ctx: z.RefinementCtx, what: "cuts" | "stock"): void {
  const seen = new Set<string>();
  list.forEach((item, i) => {
    if (seen.has(item.id))
      ctx.addIssue({ code: "custom", path: [what, i, "id"], message: `duplicate id "${item.id}"` });
    seen.add(item.id);
  });
}

const inputSchema = z
  .object({
    cuts: z.array(cutSchema, { error: "cuts must be an array" }),
    stock: z.array(stockSchema, { error: "stock must be an array" }),
    options: optionsSchema.optional(),
  })
  .superRefine((v, ctx) => {
    noDuplicateIds(v.cuts, ctx, "cuts");
    noDuplicateIds(v.stock, ctx, "stock");
  });

/** cuts[3].lengthMm */
function formatPath(path: readonly PropertyKey[]): string {
  let out = "";
  for (const part of path) out += typeof part === "number" ? `[${part}]` : `${out ? "." : ""}${String(part)}`;
  return out || "(top level)";
}

function fail(message: string): never {
  process.stderr.write(`plan: ${message}\n`);
  process.exit(2);
}

function readInput(file: string): string {
  try {
    return readFileSync(file === "-" ? 0 : file, "utf8");
  } catch (e) {
    return fail(
      `cannot read ${file === "-" ? "stdin" : file}: ${e instanceof Error ? e.message : String(e)}`,
    );
  }
}

function output(plan: PlanResult): unknown {
  return {
    spools: plan.spools.map((s) => ({
      stockId: s.stockId,
      wireType: s.wireType,
      cutIds: s.cutIds,
      usedMm: s.usedMm,
      leftoverMm: s.leftoverMm,
      keep: s.keep,
      costCents: s.costCents,
    })),
    costCents: plan.costCents,
    lowerBoundCents: plan.lowerBoundCents,
    gapPct: plan.gapPct,
    unplaced: plan.unplaced.map((u) => ({
      id: u.id,
      wireType: u.wireType,
      lengthMm: u.lengthMm,
      reason: u.reason,
    })),
    purchases: plan.purchases,
    method: plan.method,
  };
}

async function main(): Promise<void> {
  const file = process.argv[2];
  if (!file || process.argv.length > 3) fail("usage: npm run --silent plan -- FILE   (FILE - reads stdin)");
  const text = readInput(file);
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    fail(`${file === "-" ? "stdin" : file} is not valid JSON: ${e instanceof Error ? e.message : String(e)}`);
  }
  const parsed = inputSchema.safeParse(json);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${formatPath(i.path)}: ${i.message}`);
    fail(`invalid input\n${lines.join("\n")}`);
  }
  const { cuts, stock, options } = parsed.data;
  const plan = await planSpools(cuts, stock, { ...DEFAULT_PLAN_OPTIONS, ...options });
  process.stdout.write(`${JSON.stringify(output(plan), null, 2)}\n`);
}

main().catch((e: unknown) => {
  process.stderr.write(`plan: ${e instanceof Error ? e.message : String(e)}\n`);
  process.exit(1);
});
