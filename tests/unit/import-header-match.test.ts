import { describe, expect, it } from "vitest";
import { RUN_FIELDS, type RunFieldKey, type UnitHint } from "@/lib/domain/run-fields";
import { columnLetter, matchHeaders, normaliseHeader, resolveHeader, unitHintFromText } from "@/lib/import";

// The canonical names are PRODUCT.md §6 ("Canonical field names … the first choice of the import's header
// matching"); the synonyms are the spellings the issue lists plus common spreadsheet ones. Unit symbols follow the
// SI Brochure (9th ed.) and the 1959 yard-and-pound agreement's in/ft.

const CANONICAL: RunFieldKey[] = [
  "wireId",
  "endA",
  "endB",
  "endATermination",
  "endBTermination",
  "endAStripMm",
  "endBStripMm",
  "circuit",
  "gauge",
  "colour",
  "insulation",
  "insulationTempC",
  "bundleSize",
  "hotSpace",
  "routedLengthMm",
  "currentA",
  "peakCurrentA",
  "supplyV",
  "dropClass",
  "dropLimitPct",
  "fuseA",
  "returnKind",
  "returnRunWireId",
  "returnResistanceOhm",
  "ledForwardV",
  "ledCurrentA",
  "notes",
];

describe("matchHeaders: canonical names (PRODUCT.md §6)", () => {
  it("the catalogue holds exactly the §6 run fields, in §6 order", () => {
    expect(RUN_FIELDS.map((f) => f.key)).toEqual(CANONICAL);
  });

  it.each(CANONICAL)("%s maps to itself, by canonical name", (key) => {
    const m = matchHeaders([key]);
    expect(m.columns[0]).toMatchObject({ field: key, matchedBy: "canonical", ignored: false });
  });

  it.each([
    ["wire_id", "wireId"],
    ["WIRE ID", "wireId"],
    ["Wire-Id", "wireId"],
    ["routed_length_mm", "routedLengthMm"],
    ["End A Strip mm", "endAStripMm"],
    ["  colour  ", "colour"],
  ] as const)("%j matches %s ignoring case, spaces and punctuation", (header, key) => {
    expect(matchHeaders([header]).columns[0]!.field).toBe(key);
  });

  it("canonical names carry their own unit (routedLengthMm in mm, currentA in A, …)", () => {
    const m = matchHeaders([
      "routedLengthMm",
      "currentA",
      "supplyV",
      "returnResistanceOhm",
      "insulationTempC",
    ]);
    expect(m.columns.map((c) => c.unit)).toEqual(["mm", "A", "V", "ohm", "C"]);
  });
});

describe("matchHeaders: synonyms and units written in headers", () => {
  const cases: [string, RunFieldKey, UnitHint | null][] = [
    ["Wire ID", "wireId", null],
    ["wire no", "wireId", null],
    ["Wire #", "wireId", null],
    ["From", "endA", null],
    ["From (device:pin)", "endA", null],
    ["To", "endB", null],
    ["Length (mm)", "routedLengthMm", "mm"],
    ["Length [m]", "routedLengthMm", "m"],
    ["Length (in)", "routedLengthMm", "in"],
    ['Length (")', "routedLengthMm", "in"],
    ["Length (ft)", "routedLengthMm", "ft"],
    ["Length mm", "routedLengthMm", "mm"],
    ["length_m", "routedLengthMm", "m"],
    ["Length in cm", "routedLengthMm", "cm"],
    ["Length in", "routedLengthMm", "in"],
    ["Routed length (m)", "routedLengthMm", "m"],
    ["Color", "colour", null],
    ["AWG", "gauge", "awg"],
    ["Gauge (AWG)", "gauge", "awg"],
    ["Size", "gauge", null],
    ["Size (mm²)", "gauge", "mm2"],
    ["CSA mm2", "gauge", "mm2"],
    ["Amps", "currentA", "A"],
    ["Current (mA)", "currentA", "mA"],
    ["Current in mA", "currentA", "mA"],
    ["Fuse (A)", "fuseA", "A"],
    ["Peak (A)", "peakCurrentA", "A"],
    ["Supply (V)", "supplyV", "V"],
    ["Temp (°C)", "insulationTempC", "C"],
    ["Temp (°F)", "insulationTempC", "F"],
    ["Temperature rating (℃)", "insulationTempC", "C"],
    ["Return resistance (mΩ)", "returnResistanceOhm", "mohm"],
    ["Return resistance (ohm)", "returnResistanceOhm", "ohm"],
    ["Drop limit (%)", "dropLimitPct", "pct"],
    ["Strip A (mm)", "endAStripMm", "mm"],
    ["End B strip (in)", "endBStripMm", "in"],
    ["Term A", "endATermination", null],
    ["LED current (mA)", "ledCurrentA", "mA"],
    ["LED Vf", "ledForwardV", null],
    ["Comments", "notes", null],
    ["Hot space", "hotSpace", null],
  ];
  it.each(cases)("%j → %s (unit %s)", (header, field, unit) => {
    const c = matchHeaders([header]).columns[0]!;
    expect({ field: c.field, unit: c.unit }).toEqual({ field, unit });
  });

  it("a unit that does not fit the field is ignored with a warning", () => {
    const m = matchHeaders(["Length (A)"]);
    expect(m.columns[0]).toMatchObject({ field: "routedLengthMm", unit: null });
    expect(m.warnings).toEqual([expect.stringContaining('the unit "A" does not fit routed length')]);
  });

  it.each([
    ["mm", "mm"],
    ["m", "m"],
    ["metres", "m"],
    ["in.", "in"],
    ["″", "in"],
    ["mΩ", "mohm"],
    ["°C", "C"],
    ["mm²", "mm2"],
    ["%", "pct"],
  ] as const)("unit text %j → %s", (text, unit) => {
    expect(unitHintFromText(text)).toBe(unit);
  });

  it("MΩ is mega, which no run field uses", () => {
    expect(unitHintFromText("MΩ")).toBeNull();
  });
});

describe("matchHeaders: unmatched, ignored and duplicated columns", () => {
  it("reports unmatched headers, ignores computed columns, names blank headers by letter", () => {
    const m = matchHeaders([
      "Wire ID",
      "Supplier part",
      "cutLengthMm",
      "Cut length (mm)",
      "state",
      "",
      "traceCode",
    ]);
    expect(m.unmatched).toEqual(["Supplier part", "Column F"]);
    expect(m.ignored).toEqual(["cutLengthMm", "Cut length (mm)", "state", "traceCode"]);
    expect(m.columns.filter((c) => c.ignored).map((c) => c.index)).toEqual([2, 3, 4, 6]);
  });

  it("lists a field that two columns map to, keeping both in the mapping", () => {
    const m = matchHeaders(["Colour", "Gauge", "Color", "colour"]);
    expect(m.duplicates).toEqual([
      { field: "colour", headers: ["Colour", "Color", "colour"], indexes: [0, 2, 3] },
    ]);
    expect(m.columns.map((c) => c.field)).toEqual(["colour", "gauge", "colour", "colour"]);
  });

  it("every header spelling in the catalogue resolves to exactly its own field", () => {
    for (const f of RUN_FIELDS) {
      for (const s of f.synonyms) {
        const r = resolveHeader(s);
        expect(r && "field" in r.target ? r.target.field : null, `${s} → ${f.key}`).toBe(f.key);
      }
    }
  });

  it("normalises headers and letters columns like a spreadsheet", () => {
    expect(normaliseHeader("Size (mm²)")).toBe("sizemm2");
    expect(normaliseHeader("R (Ω)")).toBe("rohm");
    expect([0, 25, 26, 27, 701, 702].map(columnLetter)).toEqual(["A", "Z", "AA", "AB", "ZZ", "AAA"]);
  });
});
