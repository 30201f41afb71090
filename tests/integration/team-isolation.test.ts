import { describe, expect, inject, it } from "vitest";
import { Client, signedIn } from "../helpers/http";

const baseUrl = inject("baseUrl");

type ProjectList = { items: { id: string; name: string }[] };

describe("team isolation", () => {
  it("a user of one team never reads another team's project or runs", async () => {
    const lead = await signedIn(baseUrl, "lead@example.test");
    const harrow = (await lead.get<ProjectList>("/api/projects")).body.items.find(
      (p) => p.name === "Harrow-3",
    );
    expect(harrow).toBeDefined();

    const outsider = new Client(baseUrl);
    const signUp = await outsider.post("/api/auth/sign-up", {
      email: `outsider-${Date.now()}@example.test`,
      password: "another-long-pw",
      name: "Rook Vale",
      teamName: "Other Workshop",
    });
    expect(signUp.status).toBe(201);

    const list = await outsider.get<ProjectList>("/api/projects");
    expect(list.status).toBe(200);
    expect(list.body.items).toEqual([]);

    for (const path of [`/api/projects/${harrow!.id}`, `/api/projects/${harrow!.id}/runs`]) {
      const r = await outsider.get<{ error: { code: string } }>(path);
      expect([403, 404]).toContain(r.status);
      expect(JSON.stringify(r.body)).not.toMatch(/HR3-|Harrow/);
    }
  });

  it("anonymous API calls get 401 JSON", async () => {
    const c = new Client(baseUrl);
    for (const path of [
      "/api/me",
      "/api/projects",
      "/api/projects/00000000-0000-0000-0000-000000000000/runs",
    ]) {
      const r = await c.get<{ error: { code: string; message: string } }>(path);
      expect(r.status).toBe(401);
      expect(r.headers.get("content-type")).toMatch(/application\/json/);
      expect(r.body.error.code).toBe("unauthorized");
    }
  });

  it("lists runs with paging limits and field names of the API", async () => {
    const c = await signedIn(baseUrl, "builder@example.test");
    // By name: other test files add projects that may sort before it.
    const harrow = (await c.get<ProjectList>("/api/projects")).body.items.find((p) => p.name === "Harrow-3")!;
    const page = await c.get<{ items: Record<string, unknown>[]; total: number; limit: number }>(
      `/api/projects/${harrow.id}/runs?limit=10&offset=5&sort=routedLengthMm&dir=desc`,
    );
    expect(page.status).toBe(200);
    expect(page.body.items).toHaveLength(10);
    expect(page.body.total).toBeGreaterThan(50);
    const lengths = page.body.items.map((r) => r.routedLengthMm as number);
    expect([...lengths].sort((a, b) => b - a)).toEqual(lengths);
    for (const k of [
      "wireId",
      "endA",
      "endB",
      "circuit",
      "gauge",
      "colour",
      "routedLengthMm",
      "currentA",
      "state",
    ]) {
      expect(page.body.items[0]).toHaveProperty(k);
    }
    expect((await c.get(`/api/projects/${harrow.id}/runs?limit=1001`)).status).toBe(422);
    expect((await c.get(`/api/projects/not-a-uuid/runs`)).status).toBe(404);
  });

  it("health reports the database", async () => {
    const r = await new Client(baseUrl).get("/api/health");
    expect(r.status).toBe(200);
    expect(r.body).toEqual({ ok: true, db: "up" });
  });
});
