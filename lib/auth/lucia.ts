// Lucia v3 sessions stored in PostgreSQL (user_session), with the team being worked in as a session attribute.
import { Lucia, TimeSpan } from "lucia";
import { NodePostgresAdapter } from "@lucia-auth/adapter-postgresql";
import { authPool } from "@/lib/db/auth-pool";
import { cookieSecure } from "@/lib/env";

const g = globalThis as unknown as { loomwrightLucia?: ReturnType<typeof makeLucia> };

function makeLucia() {
  return new Lucia(new NodePostgresAdapter(authPool(), { user: "app_user", session: "user_session" }), {
    sessionExpiresIn: new TimeSpan(30, "d"),
    sessionCookie: {
      name: "loomwright_session",
      expires: false,
      attributes: { secure: cookieSecure(), sameSite: "lax" },
    },
    getUserAttributes: (a) => ({ email: a.email, name: a.name }),
    getSessionAttributes: (a) => ({ teamId: a.team_id }),
  });
}

export function lucia() {
  g.loomwrightLucia ??= makeLucia();
  return g.loomwrightLucia;
}

declare module "lucia" {
  interface Register {
    Lucia: ReturnType<typeof makeLucia>;
    DatabaseUserAttributes: { email: string; name: string };
    DatabaseSessionAttributes: { team_id: string | null };
  }
}
