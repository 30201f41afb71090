// Team, invitations and the audit trail, against the built app, the real PostgreSQL and the real fake mail server.
import { afterAll, describe, expect, inject, it } from "vitest";
import { db } from "@/lib/db/knex";
import { Client, signedIn } from "../helpers/http";
import { linkIn, waitForMail } from "../helpers/mail";

const baseUrl = inject("baseUrl");
const stamp = Date.now().toString(36);
const addr = (name: string) => `${name}-${stamp}@example.test`;

type Err = { error: { code: string; message: string; details?: { path: string }[] } };
type Outcome = {
  invitation: { id: string; email: string; role: string; status: string; sendError: string | null };
  mailSent: boolean;
};
type TeamBody = {
  team: { id: string; name: string };
  members: { userId: string; email: string; role: string; name: string }[];
  invitations: { id: string; email: string; status: string }[];
};
type AuditBody = {
  items: {
    id: number;
    action: string;
    actorUserId: string | null;
    detail: Record<string, unknown>;
    createdAt: string;
  }[];
  total: number;
  facets: { actions: string[] };
};

afterAll(async () => {
  await db().destroy();
});

async function invite(lead: Client, email: string, role = "builder") {
  const r = await lead.post<Outcome>("/api/team/invitations", { email, role });
  expect(r.status).toBe(201);
  expect(r.body.mailSent).toBe(true);
  const mail = await waitForMail(baseUrl, email);
  return { outcome: r.body, mail, link: linkIn(mail, "/invitations/") };
}

const auditCount = async (teamId: string) =>
  Number(((await db()("auditEvents").where({ teamId }).count({ n: "*" })) as [{ n: number }])[0].n);

describe("invitations", () => {
  it("a lead invites by mail; the new person follows the link, sets name and password, and is in the team", async () => {
    const lead = await signedIn(baseUrl, "lead@example.test");
    const email = addr("Wren.Holt");
    const { outcome, mail, link } = await invite(lead, email, "technician");
    expect(outcome.invitation).toMatchObject({
      email: email.toLowerCase(),
      role: "technician",
      status: "pending",
    });

    // The mail: plain text and HTML, the product's wording, the team and role, a link on our base URL.
    expect(mail.subject).toBe("You are invited to Cedar Flats Robotics on Loomwright");
    expect(mail.text).toMatch(
      /Mara Quill has invited you to join Cedar Flats Robotics on Loomwright as a technician/,
    );
    expect(mail.html).toContain(link.url);
    expect(link.url.startsWith(baseUrl)).toBe(true);
    // Only the hash is stored.
    const row = (await db()("invitation").where({ id: outcome.invitation.id }).first()) as {
      tokenHash: string;
    };
    expect(row.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(row.tokenHash).not.toContain(link.token);

    const page = await new Client(baseUrl).get<string>(link.path);
    expect(page.status).toBe(200);
    expect(page.body).toContain("Join Cedar Flats Robotics");
    expect(page.body).toContain("Choose a password");

    const person = new Client(baseUrl);
    const short = await person.post<Err>("/api/invitations/accept", {
      token: link.token,
      name: "Wren Holt",
      password: "short",
    });
    expect(short.status).toBe(422);
    const noName = await person.post<Err>("/api/invitations/accept", {
      token: link.token,
      password: "a-long-password",
    });
    expect(noName.status).toBe(422);

    const ok = await person.post<{ newAccount: boolean }>("/api/invitations/accept", {
      token: link.token,
      name: "Wren Holt",
      password: "wren-holt-pass-1",
    });
    expect(ok.status).toBe(201);
    expect(ok.body.newAccount).toBe(true);
    const me = await person.get<{ role: string; team: { name: string } }>("/api/me");
    expect(me.body).toMatchObject({ role: "technician", team: { name: "Cedar Flats Robotics" } });
    expect(
      (await signedIn(baseUrl, email, "wren-holt-pass-1").then((c) => c.get("/api/projects"))).status,
    ).toBe(200);

    // The link is single use: the API says 409 and the page says so plainly.
    const again = await new Client(baseUrl).post<Err>("/api/invitations/accept", {
      token: link.token,
      name: "Someone Else",
      password: "another-long-one",
    });
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/already been used/);
    const used = await new Client(baseUrl).get<string>(link.path);
    expect(used.status).toBe(200);
    expect(used.body).toContain("Invitation already used");

    const team = await lead.get<TeamBody>("/api/team");
    expect(team.body.members.find((m) => m.email === email.toLowerCase())?.role).toBe("technician");
    expect(team.body.invitations.find((i) => i.id === outcome.invitation.id)).toBeUndefined();
  });

  it("an existing user joins with their own password, not with a wrong one", async () => {
    const other = new Client(baseUrl);
    const email = addr("ash.morrow");
    expect(
      (
        await other.post("/api/auth/sign-up", {
          email,
          password: "morrow-pass-123",
          name: "Ash Morrow",
          teamName: "Morrow Marine Wiring",
        })
      ).status,
    ).toBe(201);
    const lead = await signedIn(baseUrl, "lead@example.test");
    const { link } = await invite(lead, email, "builder");
    const page = await new Client(baseUrl).get<string>(link.path);
    expect(page.body).toContain("You already have a Loomwright account");

    const wrong = await new Client(baseUrl).post<Err>(
      "/api/invitations/accept",
      { token: link.token, password: "not-my-password" },
      { "x-forwarded-for": "203.0.113.77" },
    );
    expect(wrong.status).toBe(401);
    const right = await new Client(baseUrl).post<{ newAccount: boolean }>("/api/invitations/accept", {
      token: link.token,
      password: "morrow-pass-123",
    });
    expect(right.status).toBe(201);
    expect(right.body.newAccount).toBe(false);
    const me = await other.get<{ teams: { name: string; role: string }[] }>("/api/me");
    expect(me.body.teams.map((t) => `${t.name}:${t.role}`).sort()).toEqual([
      "Cedar Flats Robotics:builder",
      "Morrow Marine Wiring:lead",
    ]);
  });

  it("refuses bad input: malformed address, unknown role, a member, an address already invited", async () => {
    const lead = await signedIn(baseUrl, "lead@example.test");
    const bad = await lead.post<Err>("/api/team/invitations", { email: "not an address", role: "builder" });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details?.[0]?.path).toBe("email");
    const role = await lead.post<Err>("/api/team/invitations", { email: addr("x"), role: "owner" });
    expect(role.status).toBe(422);
    expect(role.body.error.details?.[0]?.path).toBe("role");
    const member = await lead.post<Err>("/api/team/invitations", {
      email: "Builder@Example.test",
      role: "builder",
    });
    expect(member.status).toBe(409);
    expect(member.body.error.message).toMatch(/already a member/);
    const email = addr("twice");
    await invite(lead, email);
    const dup = await lead.post<Err>("/api/team/invitations", { email: email.toUpperCase(), role: "lead" });
    expect(dup.status).toBe(409);
    expect(dup.body.error.message).toMatch(/open invitation/);
    expect((await lead.post("/api/team/invitations", "{oops")).status).toBe(422);
  });

  it("two people accepting the same link at once: exactly one wins", async () => {
    const lead = await signedIn(baseUrl, "lead@example.test");
    const email = addr("race");
    const { link } = await invite(lead, email);
    const tries = await Promise.all(
      [1, 2, 3].map((i) =>
        new Client(baseUrl).post<Err>("/api/invitations/accept", {
          token: link.token,
          name: `Racer ${i}`,
          password: `racer-password-${i}`,
        }),
      ),
    );
    expect(tries.map((t) => t.status).sort()).toEqual([201, 409, 409]);
    const users = await db()("appUser").whereRaw("lower(email) = ?", [email.toLowerCase()]);
    expect(users).toHaveLength(1);
    expect(await db()("membership").where({ userId: (users[0] as { id: string }).id })).toHaveLength(1);
  });

  it("revoked and expired links get a clear page; resend gives a new link and the old one stops working", async () => {
    const lead = await signedIn(baseUrl, "lead@example.test");
    const revokedEmail = addr("revoked");
    const r1 = await invite(lead, revokedEmail);
    expect((await lead.delete(`/api/team/invitations/${r1.outcome.invitation.id}`)).status).toBe(200);
    expect((await lead.delete(`/api/team/invitations/${r1.outcome.invitation.id}`)).status).toBe(409);
    const revokedPage = await new Client(baseUrl).get<string>(r1.link.path);
    expect(revokedPage.body).toContain("Invitation withdrawn");
    const revokedApi = await new Client(baseUrl).post<Err>("/api/invitations/accept", {
      token: r1.link.token,
      name: "Late",
      password: "late-password-1",
    });
    expect(revokedApi.status).toBe(409);

    const expiredEmail = addr("expired");
    const r2 = await invite(lead, expiredEmail);
    await db()("invitation")
      .where({ id: r2.outcome.invitation.id })
      .update({ expiresAt: new Date(Date.now() - 60_000) });
    expect((await new Client(baseUrl).get<string>(r2.link.path)).body).toContain("Invitation expired");
    const team = await lead.get<TeamBody>("/api/team");
    expect(team.body.invitations.find((i) => i.id === r2.outcome.invitation.id)?.status).toBe("expired");

    // Resend renews it for 7 days with a new link; the old link no longer opens anything.
    const resent = await lead.post<Outcome>(`/api/team/invitations/${r2.outcome.invitation.id}/resend`);
    expect(resent.status).toBe(200);
    expect(resent.body.invitation.status).toBe("pending");
    const newMail = await waitForMail(baseUrl, expiredEmail, { afterId: r2.mail.id });
    const newLink = linkIn(newMail, "/invitations/");
    expect(newLink.token).not.toBe(r2.link.token);
    expect((await new Client(baseUrl).get<string>(r2.link.path)).body).toContain("This link does not work");
    expect((await new Client(baseUrl).get<string>(newLink.path)).body).toContain("Join Cedar Flats Robotics");

    const garbage = await new Client(baseUrl).get<string>("/invitations/not-a-token");
    expect(garbage.status).toBe(200);
    expect(garbage.body).toContain("This link does not work");
    expect((await lead.post(`/api/team/invitations/not-a-uuid/resend`)).status).toBe(404);
    expect((await lead.delete(`/api/team/invitations/00000000-0000-4000-8000-000000000000`)).status).toBe(
      404,
    );
  });
});

describe("members and roles", () => {
  it("a lead changes roles and removes members; a removed member's session ends at once", async () => {
    const lead = await signedIn(baseUrl, "lead@example.test");
    const email = addr("leaving");
    const { link } = await invite(lead, email, "builder");
    const person = new Client(baseUrl);
    expect(
      (
        await person.post("/api/invitations/accept", {
          token: link.token,
          name: "Kit Leaving",
          password: "kit-leaving-pw",
        })
      ).status,
    ).toBe(201);
    const team = await lead.get<TeamBody>("/api/team");
    const member = team.body.members.find((m) => m.email === email.toLowerCase())!;

    const patch = await lead.patch<{ member: { role: string } }>(`/api/team/members/${member.userId}`, {
      role: "lead",
    });
    expect(patch.status).toBe(200);
    expect((await person.get<{ role: string }>("/api/me")).body.role).toBe("lead");
    expect((await lead.patch(`/api/team/members/${member.userId}`, { role: "boss" })).status).toBe(422);
    expect((await lead.patch(`/api/team/members/${member.userId}`, { role: "technician" })).status).toBe(200);

    expect((await person.get("/api/projects")).status).toBe(200);
    expect((await lead.delete(`/api/team/members/${member.userId}`)).status).toBe(200);
    expect((await person.get("/api/me")).status).toBe(401);
    expect((await person.get("/api/projects")).status).toBe(401);
    expect((await lead.delete(`/api/team/members/${member.userId}`)).status).toBe(404);
  });

  it("the last lead can be neither demoted nor removed (409), and nothing is written", async () => {
    const lead = await signedIn(baseUrl, "lead@example.test");
    const team = await lead.get<TeamBody>("/api/team");
    const leads = team.body.members.filter((m) => m.role === "lead");
    expect(leads).toHaveLength(1);
    const before = await auditCount(team.body.team.id);
    const demote = await lead.patch<Err>("/api/team/members/demo-lead-0001", { role: "builder" });
    expect(demote.status).toBe(409);
    expect(demote.body.error.message).toMatch(/at least one lead/);
    expect((await lead.delete("/api/team/members/demo-lead-0001")).status).toBe(409);
    expect(await auditCount(team.body.team.id)).toBe(before);
    expect((await lead.get<{ role: string }>("/api/me")).body.role).toBe("lead");
  });

  it("everyone in the team may view it; only a lead may change it", async () => {
    const builder = await signedIn(baseUrl, "builder@example.test");
    const view = await builder.get<TeamBody>("/api/team");
    expect(view.status).toBe(200);
    expect(view.body.members.map((m) => m.email)).toContain("lead@example.test");
    expect(
      (await builder.post("/api/team/invitations", { email: addr("nope"), role: "builder" })).status,
    ).toBe(403);
    expect((await builder.patch("/api/team/members/demo-tech-00001", { role: "lead" })).status).toBe(403);
    expect((await builder.delete("/api/team/members/demo-tech-00001")).status).toBe(403);
    expect((await new Client(baseUrl).get("/api/team")).status).toBe(401);
  });
});

describe("audit trail", () => {
  it("records each change with its actor, and pages and filters by action, person and date", async () => {
    const lead = await signedIn(baseUrl, "lead@example.test");
    const all = await lead.get<AuditBody>("/api/audit?limit=200");
    expect(all.status).toBe(200);
    for (const a of [
      "invitation.create",
      "invitation.accept",
      "invitation.revoke",
      "invitation.resend",
      "member.role",
      "member.remove",
    ])
      expect(all.body.facets.actions).toContain(a);

    const created = await lead.get<AuditBody>("/api/audit?action=invitation.create&limit=200");
    expect(created.body.total).toBeGreaterThanOrEqual(6);
    expect(
      created.body.items.every((e) => e.action === "invitation.create" && e.actorUserId === "demo-lead-0001"),
    ).toBe(true);
    const role = await lead.get<AuditBody>("/api/audit?action=member.role");
    expect(role.body.items[0]?.detail).toMatchObject({ from: "lead", to: "technician" });

    const byLead = await lead.get<AuditBody>("/api/audit?actorUserId=demo-lead-0001&limit=200");
    expect(byLead.body.items.every((e) => e.actorUserId === "demo-lead-0001")).toBe(true);
    expect(byLead.body.items.some((e) => e.action === "invitation.accept")).toBe(false);

    const today = new Date().toISOString().slice(0, 10);
    const tomorrow = new Date(Date.now() + 86_400_000).toISOString().slice(0, 10);
    // The demo stock carries adjustments dated in the past: today's events are all but those up to yesterday.
    const yesterday = new Date(Date.now() - 86_400_000).toISOString().slice(0, 10);
    const before = (await lead.get<AuditBody>(`/api/audit?to=${yesterday}`)).body.total;
    expect((await lead.get<AuditBody>(`/api/audit?from=${today}&to=${today}`)).body.total).toBe(
      all.body.total - before,
    );
    expect((await lead.get<AuditBody>(`/api/audit?from=${tomorrow}`)).body.total).toBe(0);
    expect((await lead.get(`/api/audit?from=yesterday`)).status).toBe(422);

    const p1 = await lead.get<AuditBody>("/api/audit?limit=3&offset=0");
    const p2 = await lead.get<AuditBody>("/api/audit?limit=3&offset=3");
    expect(p1.body.items).toHaveLength(3);
    const ids = [...p1.body.items, ...p2.body.items].map((e) => e.id);
    expect(new Set(ids).size).toBe(ids.length);
    expect(ids).toEqual([...ids].sort((a, b) => b - a));

    for (const who of ["builder@example.test", "technician@example.test"])
      expect((await (await signedIn(baseUrl, who)).get("/api/audit")).status).toBe(403);
  });

  it("sign-up records the team's creation in that team's trail", async () => {
    const c = new Client(baseUrl);
    expect(
      (
        await c.post("/api/auth/sign-up", {
          email: addr("founder"),
          password: "founder-pass-1",
          name: "Ola Founder",
          teamName: "Founder Works",
        })
      ).status,
    ).toBe(201);
    const trail = await c.get<AuditBody>("/api/audit");
    expect(trail.body.items.map((e) => e.action)).toEqual(["team.create"]);
    expect(trail.body.items[0]?.detail).toMatchObject({ teamName: "Founder Works" });
  });
});
