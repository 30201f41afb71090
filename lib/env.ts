// Environment variables, parsed once at boot with defaults for local development.
import { z } from "zod";

const envSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  DATABASE_URL: z.string().min(1).default("postgres://postgres@127.0.0.1:54329/loomwright"),
  PUBLIC_BASE_URL: z.string().url().default("http://127.0.0.1:3000"),
  COOKIE_SECURE: z.enum(["auto", "0", "1"]).default("auto"),
  SMTP_URL: z.string().default("smtp://127.0.0.1:2525"),
  MAIL_FROM: z.string().default("Loomwright <no-reply@example.test>"),
  // Unset: on in development and tests, off under NODE_ENV=production (see mailboxEnabled).
  DEV_MAILBOX: z.preprocess((v) => (v === "" ? undefined : v), z.enum(["0", "1"]).optional()),
});

export type Env = z.infer<typeof envSchema>;

let cached: Env | null = null;

export function env(): Env {
  if (!cached) {
    const parsed = envSchema.safeParse(process.env);
    if (!parsed.success) {
      const lines = parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
      throw new Error(`Invalid environment: ${lines.join("; ")}`);
    }
    cached = parsed.data;
  }
  return cached;
}

/** Secure cookies everywhere except plain-HTTP loopback development (STACK.md §7). */
export function cookieSecure(): boolean {
  const e = env();
  if (e.COOKIE_SECURE === "1") return true;
  if (e.COOKIE_SECURE === "0") return false;
  const url = new URL(e.PUBLIC_BASE_URL);
  const loopback = ["127.0.0.1", "localhost", "[::1]"].includes(url.hostname);
  return !(url.protocol === "http:" && loopback);
}

/**
 * The development mailbox (the Mailbox page and GET /api/dev/mail) shows every caught mail, reset links included, to
 * anyone: on only when DEV_MAILBOX=1, or when it is unset outside production. `npm start` and the tests set it to 1.
 */
export function mailboxEnabled(): boolean {
  const e = env();
  if (e.DEV_MAILBOX !== undefined) return e.DEV_MAILBOX === "1";
  return e.NODE_ENV !== "production";
}
