// A mail server that is down or silent: the invitation is saved, marked unsent, the request does not hang, and
// Resend delivers it once mail works. Also: the mailbox is absent when it is switched off.
import net from "node:net";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { db } from "@/lib/db/knex";
import { testDatabaseUrl } from "../helpers/db";
import { Client, signedIn } from "../helpers/http";
import { freePort, linkIn, waitForMail } from "../helpers/mail";
import { startServer, type RunningServer } from "../helpers/server";

const baseUrl = inject("baseUrl");
const stamp = Date.now().toString(36);
let silent: net.Server;
let silentApp: RunningServer;
let deadApp: RunningServer;
const sockets = new Set<net.Socket>();

beforeAll(async () => {
  // Accepts the TCP connection and never says a word: the greeting timeout must end the wait.
  silent = net.createServer((s) => {
    sockets.add(s);
    s.on("close", () => sockets.delete(s));
  });
  await new Promise<void>((r) => silent.listen(0, "127.0.0.1", () => r()));
  const silentPort = (silent.address() as net.AddressInfo).port;
  const deadPort = await freePort();
  // Production defaults (DEV_MAILBOX unset under NODE_ENV=production): the mailbox must be off on these two.
  const env = (port: number) => ({ SMTP_URL: `smtp://127.0.0.1:${port}`, DEV_MAILBOX: "" });
  [silentApp, deadApp] = await Promise.all([
    startServer({ port: await freePort(), databaseUrl: testDatabaseUrl(), env: env(silentPort) }),
    startServer({ port: await freePort(), databaseUrl: testDatabaseUrl(), env: env(deadPort) }),
  ]);
});

afterAll(async () => {
  await Promise.all([silentApp?.stop(), deadApp?.stop()]);
  for (const s of sockets) s.destroy();
  await new Promise((r) => silent?.close(r));
  await db().destroy();
});

type Outcome = {
  invitation: { id: string; status: string; sendError: string | null };
  mailSent: boolean;
  mailError: string | null;
};

describe("when the mail server is down", () => {
  it.each([
    ["refuses connections", () => deadApp.baseUrl],
    ["accepts but never answers", () => silentApp.baseUrl],
  ])("it %s: the invitation is saved unsent, quickly, and Resend delivers it later", async (_what, app) => {
    const lead = await signedIn(app(), "lead@example.test");
    const email = `unsent-${_what.length}-${stamp}@example.test`;
    const t0 = Date.now();
    const r = await lead.post<Outcome>("/api/team/invitations", { email, role: "technician" });
    const elapsedMs = Date.now() - t0;
    expect(r.status).toBe(201);
    expect(r.body.mailSent).toBe(false);
    expect(r.body.mailError).toMatch(/mail server/);
    expect(r.body.invitation.status).toBe("unsent");
    // Short SMTP timeouts (3 s to connect, 3 s for the greeting): the request never hangs.
    expect(elapsedMs).toBeLessThan(8000);

    const team = await lead.get<{ invitations: { id: string; status: string; sendError: string | null }[] }>(
      "/api/team",
    );
    const saved = team.body.invitations.find((i) => i.id === r.body.invitation.id);
    expect(saved).toMatchObject({ status: "unsent" });
    expect(saved?.sendError).toBeTruthy();

    // Mail works again (the main app talks to the fake mail server): Resend sends it and clears the error.
    const mainLead = await signedIn(baseUrl, "lead@example.test");
    const resent = await mainLead.post<Outcome>(`/api/team/invitations/${r.body.invitation.id}/resend`);
    expect(resent.status).toBe(200);
    expect(resent.body.mailSent).toBe(true);
    expect(resent.body.invitation).toMatchObject({ status: "pending", sendError: null });
    const mail = await waitForMail(baseUrl, email);
    expect(linkIn(mail, "/invitations/").token).toHaveLength(43);
  });

  it("a password-reset request still answers at once and the same", async () => {
    const t0 = Date.now();
    const r = await new Client(deadApp.baseUrl).post("/api/auth/password-reset", {
      email: "lead@example.test",
    });
    expect(r.status).toBe(202);
    expect(Date.now() - t0).toBeLessThan(2000);
  });
});

describe("the mailbox switch", () => {
  it("is off by default under NODE_ENV=production: no API, no page, no nav link", async () => {
    expect((await new Client(deadApp.baseUrl).get("/api/dev/mail")).status).toBe(404);
    expect((await new Client(deadApp.baseUrl).get("/dev/mail")).status).toBe(404);
    const lead = await signedIn(deadApp.baseUrl, "lead@example.test");
    const projects = await lead.get<string>("/projects");
    expect(projects.body).toContain('href="/team"');
    expect(projects.body).not.toContain('href="/dev/mail"');
    // The main test app runs with DEV_MAILBOX=1.
    expect((await new Client(baseUrl).get("/api/dev/mail")).status).toBe(200);
    expect((await new Client(baseUrl).get("/dev/mail")).status).toBe(200);
  });
});
