// A run's newest test result as a labelled badge: pass or fail first, then the test and its value.
import type { RunTestRecord } from "@/lib/db/run-tests";
import { formatTestValue, TEST_LABELS } from "@/lib/domain/bench-state";

export function TestBadge({ test }: { test: Pick<RunTestRecord, "kind" | "passed" | "value" | "testedAt"> }) {
  const label = `${TEST_LABELS[test.kind]} ${test.passed ? "pass" : "fail"}, ${formatTestValue(test.kind, test.value)}, ${new Date(test.testedAt).toLocaleString("en-GB")}`;
  return (
    <span className="inline-flex items-center gap-1.5 whitespace-nowrap text-xs" title={label}>
      <span
        className={`rounded px-2 py-0.5 font-semibold ${test.passed ? "bg-pass-light text-pass" : "bg-fail-light text-fail"}`}
      >
        {test.passed ? "Pass" : "Fail"}
      </span>
      <span className="text-ink-soft">
        {test.kind === "continuity" ? "cont." : "ins."}
        {test.value !== null ? ` ${formatTestValue(test.kind, test.value)}` : ""}
      </span>
    </span>
  );
}
