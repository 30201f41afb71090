import { afterAll, describe, expect, inject, it } from "vitest";
import { lucia } from "@/lib/auth/lucia";
import { db } from "@/lib/db/knex";
import { authPool } from "@/lib/db/auth-pool";
import { Client, signedIn } from "../helpers/http";

const baseUrl = inject("baseUrl");

afterAll(async () => {
  await db().destroy();
  await authPool().end();
});

describe("session lifecycle", () => {
  it("creates, validates, expires and signs out of all sessions", async () => {
    const userId = "demo-builder-01";
    const a = await lucia().createSession(userId, { team_id: null });
    const b = await lucia().createSession(userId, { team_id: null });
    expect((await lucia().validateSession(a.id)).user?.id).toBe(userId);

    // An expired session no longer validates.
    await db()("userSession")
      .where({ id: a.id })
      .update({ expiresAt: new Date(Date.now() - 1000) });
    expect((await lucia().validateSession(a.id)).session).toBeNull();

    // Signing out everywhere ends the other session too.
    expect((await lucia().validateSession(b.id)).session).not.toBeNull();
    await lucia().invalidateUserSessions(userId);
    expect((await lucia().validateSession(b.id)).session).toBeNull();
  });

  it("signs in over HTTP with an HttpOnly, SameSite=Lax cookie, and signs out", async () => {
    const res = await fetch(`${baseUrl}/api/auth/sign-in`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ email: "lead@example.test", password: "harrow-bench-24" }),
    });
    expect(res.status).toBe(200);
    const cookie = res.headers.getSetCookie().join("; ");
    expect(cookie).toMatch(/loomwright_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    // Loopback HTTP development: not Secure (see lib/env.ts cookieSecure).
    expect(cookie).not.toMatch(/Secure/);

    const me = await signedIn(baseUrl, "technician@example.test");
    const r = await me.get<{ role: string; user: { email: string } }>("/api/me");
    expect(r.status).toBe(200);
    expect(r.body.role).toBe("technician");
    expect((await me.post("/api/auth/sign-out")).status).toBe(200);
    expect((await me.get("/api/me")).status).toBe(401);
  });

  it("answers wrong credentials with one generic 401", async () => {
    const c = new Client(baseUrl);
    const wrongPw = await c.post<{ error: { message: string } }>("/api/auth/sign-in", {
      email: "lead@example.test",
      password: "not-the-password",
    });
    const noUser = await c.post<{ error: { message: string } }>("/api/auth/sign-in", {
      email: "nobody@example.test",
      password: "not-the-password",
    });
    expect(wrongPw.status).toBe(401);
    expect(noUser.status).toBe(401);
    expect(wrongPw.body.error.message).toBe(noUser.body.error.message);
  });

  it("rejects malformed bodies with 422 and cross-site writes with 403", async () => {
    const c = new Client(baseUrl);
    expect((await c.post("/api/auth/sign-in", "{not json")).status).toBe(422);
    const bad = await c.post<{ error: { code: string; details: unknown[] } }>("/api/auth/sign-up", {
      email: "x",
      password: "y",
    });
    expect(bad.status).toBe(422);
    expect(bad.body.error.code).toBe("invalid");
    const cross = await c.post(
      "/api/auth/sign-in",
      { email: "lead@example.test", password: "harrow-bench-24" },
      { origin: "http://evil.example.test" },
    );
    expect(cross.status).toBe(403);
  });
});
