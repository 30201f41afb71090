import { describe, expect, it } from "vitest";
import { z } from "zod";
import {
  AppError,
  conflict,
  forbidden,
  invalid,
  mapError,
  notFound,
  tooLarge,
  unauthorized,
} from "@/lib/http/errors";

describe("mapError", () => {
  it.each([
    [unauthorized(), 401, "unauthorized"],
    [forbidden(), 403, "forbidden"],
    [notFound("That project"), 404, "not_found"],
    [conflict("stale"), 409, "conflict"],
    [tooLarge("big"), 413, "too_large"],
    [invalid("bad"), 422, "invalid"],
  ])("maps %s to its status and code", (err, status, code) => {
    const m = mapError(err);
    expect(m.status).toBe(status);
    expect(m.body.error.code).toBe(code);
    expect(m.body.error.message).toBe((err as AppError).message);
  });

  it("turns a zod failure into 422 with the issue list", () => {
    const r = z.object({ limit: z.number().max(10) }).safeParse({ limit: 50 });
    expect(r.success).toBe(false);
    const m = mapError(r.error);
    expect(m.status).toBe(422);
    expect(m.body.error.details).toEqual([{ path: "limit", message: expect.any(String) }]);
    expect(m.body.error.message).toMatch(/^Invalid input: limit:/);
  });

  it("maps a PostgreSQL unique violation to 409", () => {
    const e = Object.assign(new Error("duplicate key value violates unique constraint"), { code: "23505" });
    expect(mapError(e).status).toBe(409);
  });

  it.each([
    "COMMIT; - Client has encountered a connection error and is not queryable",
    "ROLLBACK - Client has encountered a connection error and is not queryable",
    "Connection ended unexpectedly",
  ])("maps a session cut by a stopping database to 503: %s", (message) => {
    const m = mapError(new Error(message));
    expect(m.status).toBe(503);
    expect(m.body.error.code).toBe("db_unavailable");
  });

  it("maps an unreachable database to 503 with Retry-After", () => {
    const e = Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:54329"), { code: "ECONNREFUSED" });
    const m = mapError(e);
    expect(m.status).toBe(503);
    expect(m.body.error.code).toBe("db_unavailable");
    expect(m.headers?.["Retry-After"]).toBe("5");
  });

  it("never leaks internals of an unexpected error", () => {
    const m = mapError(new Error("SELECT secret FROM app_user; stack at /srv/app.js:1"));
    expect(m.status).toBe(500);
    expect(JSON.stringify(m.body)).not.toMatch(/secret|stack|app\.js/);
    expect(m.body.error.code).toBe("internal");
  });

  it("passes details and headers of an AppError through", () => {
    const m = mapError(
      new AppError(429, "too_many_requests", "slow down", undefined, { "Retry-After": "60" }),
    );
    expect(m.headers).toEqual({ "Retry-After": "60" });
    expect(mapError(conflict("stale", { current: { version: 3 } })).body.error.details).toEqual({
      current: { version: 3 },
    });
  });
});
