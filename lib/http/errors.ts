// Application errors and the one mapper from any thrown value to a JSON error response (PRODUCT.md §6).
import { ZodError } from "zod";

export type ErrorBody = { error: { code: string; message: string; details?: unknown } };

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
    readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.name = "AppError";
  }
}

export const unauthorized = (message = "Sign in to continue.") => new AppError(401, "unauthorized", message);
export const forbidden = (message = "Your role in this team does not allow that.") =>
  new AppError(403, "forbidden", message);
export const notFound = (what = "That record") => new AppError(404, "not_found", `${what} was not found.`);
export const conflict = (message: string, details?: unknown) =>
  new AppError(409, "conflict", message, details);
export const tooLarge = (message: string, details?: unknown) =>
  new AppError(413, "too_large", message, details);
export const invalid = (message: string, details?: unknown) => new AppError(422, "invalid", message, details);
export const tooManyRequests = (retryAfterS: number) =>
  new AppError(429, "too_many_requests", "Too many attempts. Wait a little and try again.", undefined, {
    "Retry-After": String(retryAfterS),
  });

type PgLikeError = { code?: unknown; constraint?: unknown; errno?: unknown };

const DB_DOWN_CODES = new Set([
  "ECONNREFUSED",
  "ECONNRESET",
  "ETIMEDOUT",
  "EPIPE",
  "08003",
  "57P01",
  "57P02",
  "57P03",
  "08006",
  "08001",
]);

function isDbDown(e: unknown): boolean {
  if (!(e instanceof Error)) return false;
  const code = (e as PgLikeError).code;
  if (typeof code === "string" && DB_DOWN_CODES.has(code)) return true;
  // A session cut while the server stops: pg refuses further queries on that client ("not queryable"), also for the
  // COMMIT or ROLLBACK of a transaction it was in, whose outcome the caller then cannot know (a retry with the same
  // version tells: 409 if it was committed).
  return /Connection terminated|Connection ended unexpectedly|not queryable|Knex: Timeout acquiring a connection|connect ECONNREFUSED|timeout exceeded when trying to connect|the database system is (shutting down|starting up)/i.test(
    e.message,
  );
}

export interface MappedError {
  status: number;
  body: ErrorBody;
  headers?: Record<string, string>;
}

/** Maps anything thrown to a status and a JSON body; never leaks internals. */
export function mapError(e: unknown): MappedError {
  if (e instanceof AppError) {
    const error: ErrorBody["error"] = { code: e.code, message: e.message };
    if (e.details !== undefined) error.details = e.details;
    return { status: e.status, body: { error }, headers: e.headers };
  }
  if (e instanceof ZodError) {
    const details = e.issues.map((i) => ({ path: i.path.join("."), message: i.message }));
    const first = details[0];
    const message = first
      ? `Invalid input: ${first.path ? `${first.path}: ` : ""}${first.message}`
      : "Invalid input.";
    return { status: 422, body: { error: { code: "invalid", message, details } } };
  }
  const pg = e as PgLikeError;
  if (pg && pg.code === "23505") {
    return {
      status: 409,
      body: { error: { code: "conflict", message: "That would duplicate an existing record." } },
    };
  }
  if (pg && (pg.code === "23503" || pg.code === "23514" || pg.code === "22P02")) {
    return {
      status: 422,
      body: { error: { code: "invalid", message: "The values given do not fit the record." } },
    };
  }
  if (isDbDown(e)) {
    return {
      status: 503,
      body: {
        error: { code: "db_unavailable", message: "The database is not answering. Try again shortly." },
      },
      headers: { "Retry-After": "5" },
    };
  }
  return { status: 500, body: { error: { code: "internal", message: "Something went wrong on our side." } } };
}
