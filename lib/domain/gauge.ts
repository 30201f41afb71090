// Conductor size notation: AWG (incl. m/0 sizes) and metric mm², parsed from what people type and formatted one way.

export type Gauge = { system: "awg"; awg: number } | { system: "metric"; mm2: number };

/** AWG sizes the product supports, from 4/0 (stored as n = -3) to 30. ASTM B258 numbering: m/0 → n = 1 − m. */
export const AWG_MIN = -3;
export const AWG_MAX = 30;

/** IEC 60228 nominal cross-sections in mm² that the product supports (0.5 … 120). */
export const METRIC_SIZES_MM2 = [0.5, 0.75, 1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120] as const;

/** Extra metric sizes accepted although they are outside IEC 60228 (road-vehicle and DIN flexible sizes). */
export const EXTRA_METRIC_SIZES_MM2 = [0.13, 0.22, 0.34, 0.35] as const;

export function awgLabel(awg: number): string {
  return awg <= 0 ? `${1 - awg}/0` : String(awg);
}

export function formatGauge(g: Gauge): string {
  if (g.system === "awg") return `${awgLabel(g.awg)} AWG`;
  return `${formatMm2(g.mm2)} mm²`;
}

function formatMm2(mm2: number): string {
  return String(Number(mm2.toFixed(3)));
}

export type GaugeParse = { ok: true; gauge: Gauge } | { ok: false; message: string };

const EXPECTED =
  'a wire size such as "18", "18 AWG", "1/0", "0000" or "0.75 mm²" (AWG 4/0 to 30, or an IEC 60228 metric size)';

/**
 * Parses a gauge as people write it: `18`, `18 AWG`, `18awg`, `#18`, `1/0`, `2/0 AWG`, `0000`, `00`,
 * `0.75 mm²`, `0.75mm2`, `0,75 mm2`, `1.5 sq mm`. A bare number is AWG when it is a whole number, metric otherwise.
 */
export function parseGauge(input: string): GaugeParse {
  const raw = input.trim().toLowerCase().replace(/\s+/g, " ");
  if (raw === "") return { ok: false, message: `empty; expected ${EXPECTED}` };

  const metric = /^(\d+(?:[.,]\d+)?) ?(?:mm²|mm2|mm\^2|sq ?mm|sqmm|qmm)$/.exec(raw);
  if (metric) return metricGauge(Number(metric[1]!.replace(",", ".")), input);

  const body = raw
    .replace(/^#/, "")
    .replace(/ ?(?:awg|ga|gauge)$/, "")
    .trim();
  const slash = /^(\d)\/0$/.exec(body);
  if (slash) return awgGauge(1 - Number(slash[1]), input);
  if (/^0{2,4}$/.test(body)) return awgGauge(1 - body.length, input);
  if (/^\d{1,2}$/.test(body)) return awgGauge(Number(body), input);
  if (/^\d+[.,]\d+$/.test(body) && body === raw) return metricGauge(Number(body.replace(",", ".")), input);
  return { ok: false, message: `"${input.trim()}" is not ${EXPECTED}` };
}

function awgGauge(awg: number, input: string): GaugeParse {
  if (awg < AWG_MIN || awg > AWG_MAX) {
    return { ok: false, message: `"${input.trim()}" is outside the supported AWG range 4/0 to 30` };
  }
  return { ok: true, gauge: { system: "awg", awg } };
}

function metricGauge(mm2: number, input: string): GaugeParse {
  const known = [...METRIC_SIZES_MM2, ...EXTRA_METRIC_SIZES_MM2] as readonly number[];
  if (!known.some((s) => Math.abs(s - mm2) < 1e-9)) {
    return {
      ok: false,
      message: `"${input.trim()}" is not a standard metric size (IEC 60228: ${METRIC_SIZES_MM2.join(", ")} mm²)`,
    };
  }
  return { ok: true, gauge: { system: "metric", mm2 } };
}

/** Parses and returns the canonical label (`"18 AWG"`, `"1/0 AWG"`, `"0.75 mm²"`), or null. */
export function normaliseGauge(input: string): string | null {
  const p = parseGauge(input);
  return p.ok ? formatGauge(p.gauge) : null;
}

/** Orders gauges from the thinnest conductor to the thickest (for sorting and for suggesting a size). */
export function gaugeSortKey(g: Gauge): number {
  // Compare by nominal area: AWG area grows as n falls. mm² compare directly.
  if (g.system === "metric") return g.mm2;
  const dMm = 0.127 * Math.pow(92, (36 - g.awg) / 39);
  return (Math.PI / 4) * dMm * dMm;
}
