// The one place where snake_case database names and camelCase TypeScript names are converted.

export function toSnake(name: string): string {
  return name.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
}

// Column names are few and repeat on every row of every result: each is converted once (a bounded cache).
const camelNames = new Map<string, string>();

export function toCamel(name: string): string {
  let camel = camelNames.get(name);
  if (camel === undefined) {
    camel = name.replace(/_([a-z0-9])/g, (_m, c: string) => c.toUpperCase());
    if (camelNames.size < 5000) camelNames.set(name, camel);
  }
  return camel;
}

function isPlainObject(v: unknown): v is Record<string, unknown> {
  return (
    typeof v === "object" && v !== null && !Array.isArray(v) && !(v instanceof Date) && !Buffer.isBuffer(v)
  );
}

export function camelRow(row: unknown): unknown {
  if (!isPlainObject(row)) return row;
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(row)) out[toCamel(k)] = v;
  return out;
}

/** Knex postProcessResponse: rows from query builders and from raw queries both come back camelCased. */
export function camelResponse(result: unknown): unknown {
  if (Array.isArray(result)) return result.map(camelRow);
  if (isPlainObject(result) && Array.isArray(result.rows)) {
    return { ...result, rows: (result.rows as unknown[]).map(camelRow) };
  }
  return camelRow(result);
}
