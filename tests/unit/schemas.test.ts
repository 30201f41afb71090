import { describe, expect, it } from "vitest";
import { signInSchema, signUpSchema } from "@/lib/validation/auth";
import { runListQuerySchema } from "@/lib/validation/runs";

describe("auth schemas", () => {
  it("normalises the e-mail address and accepts a good sign-up", () => {
    const r = signUpSchema.parse({
      email: "  Lead@Example.Test ",
      password: "long-enough-pw",
      name: "Mara",
      teamName: "Cedar Flats Robotics",
    });
    expect(r.email).toBe("lead@example.test");
  });

  it.each([
    [{ email: "not-an-address", password: "long-enough-pw", name: "A", teamName: "T" }, "email"],
    [{ email: "a@example.test", password: "short", name: "A", teamName: "T" }, "password"],
    [{ email: "a@example.test", password: "long-enough-pw", name: " ", teamName: "T" }, "name"],
    [{ email: "a@example.test", password: "long-enough-pw", name: "A", teamName: "" }, "teamName"],
  ])("rejects a bad sign-up field (%#)", (input, field) => {
    const r = signUpSchema.safeParse(input);
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.path).toEqual([field]);
  });

  it("requires a password on sign-in", () => {
    expect(signInSchema.safeParse({ email: "a@example.test", password: "" }).success).toBe(false);
  });
});

describe("run list query", () => {
  it("coerces paging from the query string with defaults", () => {
    expect(runListQuerySchema.parse({})).toMatchObject({ limit: 200, offset: 0, sort: "wireId", dir: "asc" });
    expect(runListQuerySchema.parse({ limit: "1000", offset: "40" })).toMatchObject({
      limit: 1000,
      offset: 40,
    });
  });

  it.each([{ limit: "1001" }, { limit: "0" }, { offset: "-1" }, { sort: "password" }, { state: "lost" }])(
    "rejects %j",
    (q) => {
      expect(runListQuerySchema.safeParse(q).success).toBe(false);
    },
  );
});
