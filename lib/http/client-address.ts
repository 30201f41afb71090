// The client address used by the sign-in limits. Route handlers and actions get no socket, only headers.

/** x-forwarded-for's first entry when present (set by the proxy in front of the app), else "local". */
export function clientAddress(headers: Headers): string {
  const first = headers.get("x-forwarded-for")?.split(",")[0]?.trim();
  return first ? first.slice(0, 100) : "local";
}
