// Short codes printed on markers: 8 Crockford base-32 characters (no I, L, O, U), easy to read and type.

const ALPHABET = "0123456789ABCDEFGHJKMNPQRSTVWXYZ";
export const TRACE_CODE_LENGTH = 8;

/** Makes a trace code from at least 5 random bytes (40 bits → 8 characters). */
export function traceCodeFromBytes(bytes: Uint8Array): string {
  if (bytes.length < 5) throw new Error("traceCodeFromBytes needs at least 5 bytes");
  let bits = 0n;
  for (let i = 0; i < 5; i++) bits = (bits << 8n) | BigInt(bytes[i]!);
  let out = "";
  for (let i = 0; i < TRACE_CODE_LENGTH; i++) {
    out = ALPHABET[Number(bits & 31n)] + out;
    bits >>= 5n;
  }
  return out;
}

/** Normalises what a person typed or a scanner read: case, the look-alikes I/L → 1 and O → 0, dashes. */
export function normaliseTraceCode(input: string): string | null {
  let s = input.trim();
  const slash = s.lastIndexOf("/r/");
  // A trace URL: the code is the path segment after /r/ (a query, fragment or trailing slash is dropped).
  if (slash >= 0)
    s = s
      .slice(slash + 3)
      .replace(/[?#][\s\S]*$/, "")
      .replace(/\/+$/, "");
  s = s.toUpperCase().replace(/[-\s]/g, "").replace(/[IL]/g, "1").replace(/O/g, "0");
  if (s.length !== TRACE_CODE_LENGTH) return null;
  for (const c of s) if (!ALPHABET.includes(c)) return null;
  return s;
}
