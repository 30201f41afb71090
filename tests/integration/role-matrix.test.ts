// The role matrix: every route handler found under app/api (from the file tree, so none can be forgotten) is checked
// against ROUTE_ACCESS, the table the guards use: anonymous 401, a wrong role 403, a member of another team 403 or 404
// and never data, an allowed role not 401/403. No call may answer 5xx.
//
// Adding a route? Add its key to ROUTE_ACCESS (lib/auth/access.ts). Most routes need nothing here: dynamic segments
// are filled from PARAMS (an unknown name gets a non-existent uuid) and writes get `{}` (a 422 counts as allowed).
// Add a CASES entry only when the allowed call needs a body, or would destroy a fixture the other checks use.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { ROUTE_ACCESS, type Access } from "@/lib/auth/access";
import { ROLES, type Role } from "@/lib/auth/roles";
import { DEMO_PASSWORD } from "@/db/seeds/01_demo";
import { db } from "@/lib/db/knex";
import { Client, signedIn, type Reply } from "../helpers/http";
import { linkIn, waitForMail } from "../helpers/mail";

const baseUrl = inject("baseUrl");
const API_DIR = path.join(process.cwd(), "app/api");
const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE", "HEAD", "OPTIONS"] as const;
const UNKNOWN_ID = "00000000-0000-4000-8000-000000000000";
const stamp = Date.now().toString(36);

interface Handler {
  key: string;
  method: string;
  routePath: string;
  file: string;
  /** The key the handler passes to route(…), or null when it does not go through the wrapper. */
  declaredKey: string | null;
}

function routeFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    if (e.isDirectory()) return routeFiles(p);
    return /^route\.(ts|tsx|js|mjs)$/.test(e.name) ? [p] : [];
  });
}

/** Every exported HTTP method of every route file, with the URL pattern its folders spell. */
function discoverHandlers(): Handler[] {
  return routeFiles(API_DIR).flatMap((file) => {
    const segments = path
      .relative(path.join(process.cwd(), "app"), path.dirname(file))
      .split(path.sep)
      .filter((s) => !/^\(.*\)$/.test(s) && !s.startsWith("@"));
    const routePath = `/${segments.join("/")}`;
    const src = readFileSync(file, "utf8");
    const exported = new Set<string>();
    for (const m of src.matchAll(/export\s+(?:const|let|var|async\s+function|function)\s+([A-Z]+)\b/g))
      exported.add(m[1]!);
    for (const m of src.matchAll(/export\s*\{([^}]*)\}/g))
      for (const part of m[1]!.split(","))
        exported.add(
          part
            .trim()
            .split(/\s+as\s+/)
            .pop()!
            .trim(),
        );
    return METHODS.filter((method) => exported.has(method)).map((method) => {
      const declared = src.match(
        new RegExp(`export\\s+const\\s+${method}\\s*=\\s*route\\(\\s*["'\`]([^"'\`]+)["'\`]`),
      );
      return {
        key: `${method} ${routePath}`,
        method,
        routePath,
        file: path.relative(process.cwd(), file),
        declaredKey: declared?.[1] ?? null,
      };
    });
  });
}

interface Fixture {
  projectId: string;
  runId: string;
  traceCode: string;
  memberId: string;
  invitationId: string;
  spareInvitationId: string;
  spareMemberId: string;
  spareRunId: string;
}

/** How each dynamic segment is filled with a real id of the demo team. Unknown names get UNKNOWN_ID. */
const PARAMS: Record<string, (f: Fixture) => string> = {
  projectId: (f) => f.projectId,
  runId: (f) => f.runId,
  code: (f) => f.traceCode,
  userId: (f) => f.memberId,
  invitationId: (f) => f.invitationId,
};

interface Case {
  /** The body for writes (default `{}`). */
  body?: unknown;
  /** Params for the allowed call only, where the real id would be destroyed by it. */
  allowedParams?: (f: Fixture) => Record<string, string>;
  /** The call ends the caller's session: use a fresh one for it. */
  freshSession?: boolean;
}

const CASES: Record<string, Case> = {
  "POST /api/auth/sign-out": { freshSession: true },
  "PATCH /api/team/members/[userId]": { body: { role: "builder" } },
  "DELETE /api/team/members/[userId]": { allowedParams: (f) => ({ userId: f.spareMemberId }) },
  "DELETE /api/projects/[projectId]/runs/[runId]": { allowedParams: (f) => ({ runId: f.spareRunId }) },
  "DELETE /api/team/invitations/[invitationId]": {
    allowedParams: (f) => ({ invitationId: f.spareInvitationId }),
  },
};

// What no other team may ever see of the demo team.
const DEMO_MARKERS = [
  "Harrow-3",
  "HR3-",
  "Cedar Flats",
  "Mara Quill",
  "Tobin Ash",
  "lead@example.test",
  "builder@example.test",
];

function fill(routePath: string, f: Fixture, override: Record<string, string> = {}): string {
  return routePath.replace(/\[(?:\.\.\.)?(\w+)\]/g, (_m, name: string) =>
    encodeURIComponent(override[name] ?? PARAMS[name]?.(f) ?? UNKNOWN_ID),
  );
}

const handlers = discoverHandlers();

describe("the access table covers every route handler", () => {
  it("finds the route files", () => {
    expect(handlers.length).toBeGreaterThanOrEqual(10);
    expect(handlers.map((h) => h.key)).toContain("GET /api/health");
  });

  it.each(handlers.map((h) => [h.key, h] as const))(
    "%s has a ROUTE_ACCESS entry and goes through route() with it",
    (_k, h) => {
      expect(
        ROUTE_ACCESS,
        `${h.file} exports ${h.method} but "${h.key}" is not in ROUTE_ACCESS`,
      ).toHaveProperty([h.key]);
      expect(
        h.declaredKey,
        `${h.file}: ${h.method} must be route("${h.key}", …) so the guard reads the table`,
      ).toBe(h.key);
    },
  );
});

describe("role matrix", () => {
  const clients = {} as Record<Role | "outsider", Client>;
  const creds = {} as Record<Role | "outsider", { email: string; password: string }>;
  let f: Fixture;

  beforeAll(async () => {
    for (const role of ROLES) {
      creds[role] = { email: `${role}@example.test`, password: DEMO_PASSWORD };
      clients[role] = await signedIn(baseUrl, creds[role].email);
    }
    creds.outsider = { email: `matrix-outsider-${stamp}@example.test`, password: "outsider-password-1" };
    clients.outsider = new Client(baseUrl);
    const up = await clients.outsider.post("/api/auth/sign-up", {
      ...creds.outsider,
      name: "Pip Outsider",
      teamName: "Elsewhere Robotics",
    });
    expect(up.status).toBe(201);

    const lead = clients.lead;
    const project = (
      await lead.get<{ items: { id: string; name: string }[] }>("/api/projects")
    ).body.items.find((p) => p.name === "Harrow-3")!;
    const run = (
      await lead.get<{ items: { id: string; traceCode: string }[] }>(
        `/api/projects/${project.id}/runs?limit=1`,
      )
    ).body.items[0]!;
    const invite = async (name: string) => {
      const r = await lead.post<{ invitation: { id: string } }>("/api/team/invitations", {
        email: `${name}-${stamp}@example.test`,
        role: "technician",
      });
      expect(r.status).toBe(201);
      return r.body.invitation.id;
    };
    const spareRun = await lead.post<{ id: string }>(`/api/projects/${project.id}/runs`, {
      wireId: `MATRIX-${stamp}`,
      endA: "TB99:1",
      endB: "TB99:2",
      gauge: "22 AWG",
      colour: "WH",
      routedLengthMm: 100,
    });
    expect(spareRun.status).toBe(201);
    const invitationId = await invite("matrix-pending");
    const spareInvitationId = await invite("matrix-spare-invite");
    const spareEmail = `matrix-spare-member-${stamp}@example.test`;
    await lead.post("/api/team/invitations", { email: spareEmail, role: "technician" });
    const link = linkIn(await waitForMail(baseUrl, spareEmail), "/invitations/");
    const accepted = await new Client(baseUrl).post<{ user: { id: string } }>("/api/invitations/accept", {
      token: link.token,
      name: "Spare Member",
      password: "spare-member-pw",
    });
    expect(accepted.status).toBe(201);
    f = {
      projectId: project.id,
      runId: run.id,
      traceCode: run.traceCode,
      memberId: "demo-builder-01",
      invitationId,
      spareInvitationId,
      spareMemberId: accepted.body.user.id,
      spareRunId: spareRun.body.id,
    };
  });

  afterAll(async () => {
    await db().destroy();
  });

  async function call(c: Client, h: Handler, params?: Record<string, string>): Promise<Reply<unknown>> {
    const url = fill(h.routePath, f, params);
    const write = ["POST", "PUT", "PATCH"].includes(h.method);
    return c.request(h.method, url, write ? (CASES[h.key]?.body ?? {}) : undefined);
  }

  it("answers every route as its access table entry says", async () => {
    const failures: string[] = [];
    const check = (h: Handler, who: string, r: Reply<unknown>, ok: (s: number) => boolean, want: string) => {
      if (r.status >= 500 || !ok(r.status))
        failures.push(`${h.key} as ${who}: got ${r.status}, want ${want}`);
    };
    const allowedCalls: (() => Promise<void>)[] = [];

    for (const h of handlers) {
      const access = ROUTE_ACCESS[h.key as keyof typeof ROUTE_ACCESS] as Access | undefined;
      if (access === undefined) continue; // reported by the table test above
      const c = CASES[h.key] ?? {};
      const allowedRoles: readonly Role[] = access === "public" || access === "user" ? ROLES : access;
      const hasParams = h.routePath.includes("[");

      if (access !== "public")
        check(h, "anonymous", await call(new Client(baseUrl), h), (s) => s === 401, "401");
      for (const role of ROLES.filter((r) => !allowedRoles.includes(r)))
        check(h, role, await call(clients[role], h), (s) => s === 403, "403");
      if (access !== "public" && access !== "user") {
        const r = await call(clients.outsider, h);
        if (hasParams) check(h, "another team's lead", r, (s) => s === 403 || s === 404, "403 or 404");
        else check(h, "another team's lead", r, () => true, "no 5xx");
        const text = typeof r.body === "string" ? r.body : JSON.stringify(r.body);
        const leaked = DEMO_MARKERS.filter((m) => text.includes(m));
        if (leaked.length) failures.push(`${h.key} as another team's lead: body shows ${leaked.join(", ")}`);
      }

      const subjects: (Role | "anonymous" | "outsider")[] =
        access === "public" ? ["anonymous"] : access === "user" ? [...ROLES, "outsider"] : [...allowedRoles];
      for (const who of subjects)
        allowedCalls.push(async () => {
          const client =
            who === "anonymous"
              ? new Client(baseUrl)
              : c.freshSession
                ? await signedIn(baseUrl, creds[who].email, creds[who].password)
                : clients[who];
          const r = await call(client, h, c.allowedParams?.(f));
          check(h, `${who} (allowed)`, r, (s) => s !== 401 && s !== 403, "not 401/403");
        });
    }
    // The allowed calls run last: some of them change things (a real removal, a revocation).
    for (const run of allowedCalls) await run();
    expect(failures).toEqual([]);

    // Nothing the denied calls touched has changed.
    const team = await clients.lead.get<{ members: { userId: string; role: string }[] }>("/api/team");
    expect(team.body.members.find((m) => m.userId === "demo-builder-01")?.role).toBe("builder");
    expect(team.body.members.find((m) => m.userId === f.spareMemberId)).toBeUndefined();
    expect((await clients.builder.get(`/api/projects/${f.projectId}`)).status).toBe(200);
  });
});
