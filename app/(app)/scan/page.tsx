import type { Metadata } from "next";
import { requirePageRole } from "@/lib/auth/guards";
import { ALL_ROLES } from "@/lib/auth/roles";
import { ScanScreen } from "@/components/scan/scan-screen";

export const metadata: Metadata = { title: "Scan" };

export default async function ScanPage() {
  await requirePageRole(ALL_ROLES, "/scan");
  return <ScanScreen />;
}
