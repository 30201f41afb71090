import { describe, expect, it } from "vitest";
import { normaliseTraceCode, traceCodeFromBytes } from "@/lib/domain/trace-code";

describe("what a scanner reads or a person types", () => {
  const code = traceCodeFromBytes(new Uint8Array([0x3a, 0x91, 0x0c, 0xff, 0x42]));
  it.each([
    [code, code],
    [code.toLowerCase(), code],
    [`${code.slice(0, 4)}-${code.slice(4)}`, code],
    [`  ${code}\n`, code],
    [`http://127.0.0.1:3000/r/${code}`, code],
    [`https://harness.example.test/r/${code}/`, code],
    [`https://harness.example.test/r/${code}?from=marker#end-b`, code],
    ["7K3M9QZX", "7K3M9QZX"],
    // Look-alikes: I and L read as 1, O as 0 (Crockford base 32).
    ["7K3M9QIO", "7K3M9Q10"],
  ])("%s → %s", (input, expected) => {
    expect(normaliseTraceCode(input)).toBe(expected);
  });

  it.each([
    "",
    "SHORT",
    "TOOLONGCODE",
    "7K3M9QU!",
    "https://example.test/projects/abc",
    "https://example.test/r/",
  ])("refuses %j", (input) => {
    expect(normaliseTraceCode(input)).toBeNull();
  });
});
