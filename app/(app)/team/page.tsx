import type { Metadata } from "next";
import { requirePageRole } from "@/lib/auth/guards";
import { ALL_ROLES } from "@/lib/auth/roles";
import { TeamScreen } from "@/components/team/team-screen";

export const metadata: Metadata = { title: "Team" };

export default async function TeamPage() {
  const me = await requirePageRole(ALL_ROLES, "/team");
  return <TeamScreen canManage={me.role === "lead"} />;
}
