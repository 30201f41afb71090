// Sign-in limits kept in PostgreSQL: per address (10) and per client (30) within 15 minutes, 429 with Retry-After.
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { db } from "@/lib/db/knex";
import { testDatabaseUrl } from "../helpers/db";
import { Client } from "../helpers/http";
import { freePort } from "../helpers/mail";
import { startServer, type RunningServer } from "../helpers/server";

const baseUrl = inject("baseUrl");
const smtpUrl = inject("smtpUrl");
const stamp = Date.now().toString(36);
let other: RunningServer;

beforeAll(async () => {
  // A second app process on the same database: the limits must hold there too.
  other = await startServer({
    port: await freePort(),
    databaseUrl: testDatabaseUrl(),
    env: { SMTP_URL: smtpUrl, DEV_MAILBOX: "1" },
  });
});
afterAll(async () => {
  await other?.stop();
  await db().destroy();
});

async function account(name: string): Promise<string> {
  const email = `${name}-${stamp}@example.test`;
  const r = await new Client(baseUrl).post("/api/auth/sign-up", {
    email,
    password: "the-right-password",
    name,
    teamName: `${name} bench`,
  });
  expect(r.status).toBe(201);
  return email;
}

const attempt = (base: string, email: string, password: string, ip: string) =>
  new Client(base).post<{ error: { code: string } }>(
    "/api/auth/sign-in",
    { email, password },
    { "x-forwarded-for": `${ip}, 10.0.0.1` },
  );

describe("sign-in limits", () => {
  it("after 10 failures for one address, 429 with Retry-After, even with the right password and in another process", async () => {
    const email = await account("lock");
    for (let i = 0; i < 10; i++)
      expect((await attempt(baseUrl, email, `wrong-${i}`, `198.51.100.${i + 1}`)).status).toBe(401);
    const locked = await attempt(baseUrl, email, "the-right-password", "198.51.100.200");
    expect(locked.status).toBe(429);
    expect(locked.body.error.code).toBe("too_many_requests");
    const retry = Number(locked.headers.get("retry-after"));
    expect(retry).toBeGreaterThan(14 * 60);
    expect(retry).toBeLessThanOrEqual(15 * 60);
    // Another app process reads the same count from PostgreSQL.
    expect((await attempt(other.baseUrl, email, "the-right-password", "198.51.100.201")).status).toBe(429);
    // Other addresses from the same clients are unaffected.
    expect((await attempt(baseUrl, "lead@example.test", "harrow-bench-24", "198.51.100.1")).status).toBe(200);

    // Once the oldest failures leave the 15-minute window, the address may try again.
    await db()("signInFailure")
      .where({ email })
      .update({ createdAt: new Date(Date.now() - 16 * 60 * 1000) });
    expect((await attempt(baseUrl, email, "the-right-password", "198.51.100.202")).status).toBe(200);
  });

  it("a success resets the address's count", async () => {
    const email = await account("reset");
    for (let i = 0; i < 9; i++) await attempt(baseUrl, email, "wrong", "192.0.2.10");
    expect((await attempt(baseUrl, email, "the-right-password", "192.0.2.10")).status).toBe(200);
    for (let i = 0; i < 9; i++)
      expect((await attempt(baseUrl, email, "wrong", "192.0.2.11")).status).toBe(401);
    // Ten failures since the success would lock; nine do not.
    expect((await attempt(baseUrl, email, "wrong", "192.0.2.11")).status).toBe(401);
    expect((await attempt(baseUrl, email, "wrong", "192.0.2.11")).status).toBe(429);
  });

  it("after 30 failures from one client address, that client gets 429 for any address", async () => {
    const ip = "203.0.113.30";
    for (let i = 0; i < 30; i++)
      expect(
        (await attempt(i % 2 ? other.baseUrl : baseUrl, `spray-${i}-${stamp}@example.test`, "guess", ip))
          .status,
      ).toBe(401);
    const blocked = await attempt(baseUrl, "lead@example.test", "harrow-bench-24", ip);
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers.get("retry-after"))).toBeGreaterThan(0);
    expect((await attempt(baseUrl, "lead@example.test", "harrow-bench-24", "203.0.113.31")).status).toBe(200);
    const rows = (await db()("signInFailure").where({ clientIp: ip }).count({ n: "*" })) as [{ n: number }];
    expect(Number(rows[0].n)).toBe(30);
  });

  it("malformed bodies are 422 and are not counted", async () => {
    const email = `malformed-${stamp}@example.test`;
    for (let i = 0; i < 12; i++)
      expect(
        (await new Client(baseUrl).post("/api/auth/sign-in", { email }, { "x-forwarded-for": "192.0.2.99" }))
          .status,
      ).toBe(422);
    expect(await db()("signInFailure").where({ email })).toHaveLength(0);
  });
});
