// Password reset by mailed link, against the built app, the real PostgreSQL and the real fake mail server.
import { afterAll, describe, expect, inject, it } from "vitest";
import { db } from "@/lib/db/knex";
import { Client, signedIn } from "../helpers/http";
import { lastMailId, linkIn, waitForMail } from "../helpers/mail";

const baseUrl = inject("baseUrl");
const stamp = Date.now().toString(36);

afterAll(async () => {
  await db().destroy();
});

async function newAccount(name: string, password: string): Promise<{ email: string; client: Client }> {
  const email = `${name}-${stamp}@example.test`;
  const client = new Client(baseUrl);
  const r = await client.post("/api/auth/sign-up", { email, password, name, teamName: `${name} workshop` });
  expect(r.status).toBe(201);
  return { email, client };
}

describe("password reset", () => {
  it("answers the same whether or not the address has an account, and mails only a real one", async () => {
    const { email } = await newAccount("juno", "juno-original-pw");
    const nobody = `nobody-${stamp}@example.test`;
    const a = await new Client(baseUrl).post("/api/auth/password-reset", { email });
    const b = await new Client(baseUrl).post("/api/auth/password-reset", { email: nobody });
    expect(a.status).toBe(202);
    expect(b.status).toBe(a.status);
    expect(b.body).toEqual(a.body);
    expect(b.headers.get("content-length")).toBe(a.headers.get("content-length"));
    const mail = await waitForMail(baseUrl, email);
    expect(mail.subject).toBe("Set a new Loomwright password");
    expect(mail.text).toMatch(/expires in one hour/);
    // Give the unknown address the same time to (not) arrive.
    await new Promise((r) => setTimeout(r, 800));
    expect(await lastMailId(baseUrl, nobody)).toBe(0);
    expect(
      (await new Client(baseUrl).post("/api/auth/password-reset", { email: "not-an-address" })).status,
    ).toBe(422);
  });

  it("the link sets a new password once, ends every other session and signs in", async () => {
    const { email, client: oldSession } = await newAccount("pell", "pell-original-pw");
    const second = await signedIn(baseUrl, email, "pell-original-pw");
    const before = await lastMailId(baseUrl, email);
    await new Client(baseUrl).post("/api/auth/password-reset", { email: email.toUpperCase() });
    const mail = await waitForMail(baseUrl, email, { afterId: before });
    const link = linkIn(mail, "/reset-password/");
    const row = (await db()("passwordReset").orderBy("createdAt", "desc").first()) as { tokenHash: string };
    expect(row.tokenHash).toMatch(/^[0-9a-f]{64}$/);

    const page = await new Client(baseUrl).get<string>(link.path);
    expect(page.status).toBe(200);
    expect(page.body).toContain("Set a new password");

    const resetter = new Client(baseUrl);
    expect(
      (await resetter.post("/api/auth/password-reset/confirm", { token: link.token, password: "short" }))
        .status,
    ).toBe(422);
    const ok = await resetter.post("/api/auth/password-reset/confirm", {
      token: link.token,
      password: "pell-new-password",
    });
    expect(ok.status).toBe(200);
    expect(resetter.hasSession).toBe(true);
    expect((await resetter.get("/api/me")).status).toBe(200);
    expect((await oldSession.get("/api/me")).status).toBe(401);
    expect((await second.get("/api/me")).status).toBe(401);

    const oldPw = await new Client(baseUrl).post("/api/auth/sign-in", {
      email,
      password: "pell-original-pw",
    });
    expect(oldPw.status).toBe(401);
    expect((await signedIn(baseUrl, email, "pell-new-password").then((c) => c.get("/api/me"))).status).toBe(
      200,
    );

    const reuse = await new Client(baseUrl).post<{ error: { message: string } }>(
      "/api/auth/password-reset/confirm",
      {
        token: link.token,
        password: "pell-third-password",
      },
    );
    expect(reuse.status).toBe(409);
    expect(reuse.body.error.message).toMatch(/already been used/);
    expect((await new Client(baseUrl).get<string>(link.path)).body).toContain("Link already used");
  });

  it("an expired or unknown link gets a clear page and a clear JSON error", async () => {
    const { email } = await newAccount("quade", "quade-original-pw");
    await new Client(baseUrl).post("/api/auth/password-reset", { email });
    const link = linkIn(await waitForMail(baseUrl, email), "/reset-password/");
    await db()("passwordReset")
      .update({ expiresAt: new Date(Date.now() - 1000) })
      .whereNull("usedAt");
    expect((await new Client(baseUrl).get<string>(link.path)).body).toContain("Link expired");
    const expired = await new Client(baseUrl).post<{ error: { message: string } }>(
      "/api/auth/password-reset/confirm",
      {
        token: link.token,
        password: "quade-new-password",
      },
    );
    expect(expired.status).toBe(409);
    expect(expired.body.error.message).toMatch(/expired/);
    expect((await new Client(baseUrl).get<string>("/reset-password/nonsense")).body).toContain(
      "This link does not work",
    );
    expect(
      (
        await new Client(baseUrl).post("/api/auth/password-reset/confirm", {
          token: "nonsense",
          password: "whatever-long",
        })
      ).status,
    ).toBe(404);
    // The original password still works.
    expect(
      (await new Client(baseUrl).post("/api/auth/sign-in", { email, password: "quade-original-pw" })).status,
    ).toBe(200);
  });

  it("the sign-in page links to it", async () => {
    const page = await new Client(baseUrl).get<string>("/sign-in");
    expect(page.body).toContain('href="/forgot-password"');
    expect(page.body).toContain("Forgot your password?");
    expect((await new Client(baseUrl).get<string>("/forgot-password")).status).toBe(200);
  });
});
