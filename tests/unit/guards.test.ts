import { beforeEach, describe, expect, it, vi } from "vitest";

// The guards read the cookie through next/headers, validate it through Lucia and load memberships: fake all three.
const state = vi.hoisted(() => ({
  cookie: null as string | null,
  session: null as null | { id: string; userId: string; fresh: boolean; teamId: string | null },
  memberships: [] as { teamId: string; teamName: string; role: "lead" | "builder" | "technician" }[],
}));

vi.mock("next/headers", () => ({
  cookies: async () => ({
    get: (name: string) =>
      name === "loomwright_session" && state.cookie ? { value: state.cookie } : undefined,
    set: () => undefined,
  }),
}));
vi.mock("next/navigation", () => ({
  redirect: (to: string) => {
    throw Object.assign(new Error("NEXT_REDIRECT"), { to });
  },
}));
vi.mock("@/lib/auth/lucia", () => ({
  lucia: () => ({
    sessionCookieName: "loomwright_session",
    validateSession: async (id: string) =>
      state.session && state.session.id === id
        ? { session: state.session, user: { id: state.session.userId, email: "a@example.test", name: "A" } }
        : { session: null, user: null },
    createSessionCookie: () => ({ name: "loomwright_session", value: "x", attributes: {} }),
    createBlankSessionCookie: () => ({ name: "loomwright_session", value: "", attributes: {} }),
  }),
}));
vi.mock("@/lib/db/users", () => ({ listMemberships: async () => state.memberships }));

// React's cache() would memoise across tests; make it a pass-through.
vi.mock("react", async (orig) => ({ ...(await orig<typeof import("react")>()), cache: <T>(f: T) => f }));

const { requireUser, requireRole, requireAccess, requirePageRole } = await import("@/lib/auth/guards");

beforeEach(() => {
  state.cookie = "s1";
  state.session = { id: "s1", userId: "u1", fresh: false, teamId: "t2" };
  state.memberships = [
    { teamId: "t1", teamName: "One", role: "lead" },
    { teamId: "t2", teamName: "Two", role: "builder" },
  ];
});

describe("guards", () => {
  it("requireUser rejects a request without a session cookie with 401", async () => {
    state.cookie = null;
    await expect(requireUser()).rejects.toMatchObject({ status: 401, code: "unauthorized" });
  });

  it("requireUser rejects an unknown or expired session with 401", async () => {
    state.cookie = "other";
    await expect(requireUser()).rejects.toMatchObject({ status: 401 });
  });

  it("uses the team recorded on the session and its role", async () => {
    const me = await requireUser();
    expect(me.teamId).toBe("t2");
    expect(me.role).toBe("builder");
  });

  it("falls back to the first membership when the session names no team", async () => {
    state.session!.teamId = null;
    expect((await requireUser()).role).toBe("lead");
  });

  it("requireRole allows listed roles and refuses others with 403", async () => {
    await expect(requireRole(["builder", "lead"])).resolves.toMatchObject({ role: "builder" });
    await expect(requireRole(["lead"])).rejects.toMatchObject({ status: 403, code: "forbidden" });
  });

  it("requireRole refuses a user who is in no team", async () => {
    state.memberships = [];
    await expect(requireRole(["lead", "builder", "technician"])).rejects.toMatchObject({ status: 403 });
  });

  it("requireAccess follows the access table", async () => {
    await expect(requireAccess("POST /api/projects")).rejects.toMatchObject({ status: 403 });
    await expect(requireAccess("GET /api/projects")).resolves.toMatchObject({ role: "builder" });
    state.cookie = null;
    await expect(requireAccess("GET /api/health")).resolves.toBeNull();
    await expect(requireAccess("GET /api/me")).rejects.toMatchObject({ status: 401 });
  });

  it("page guards redirect instead of throwing", async () => {
    state.cookie = null;
    await expect(requirePageRole(["lead"], "/projects/x")).rejects.toMatchObject({
      to: "/sign-in?next=%2Fprojects%2Fx",
    });
    state.cookie = "s1";
    await expect(requirePageRole(["lead"])).rejects.toMatchObject({ to: "/projects?denied=1" });
  });
});
