import { AppHeader } from "@/components/layout/app-header";
import { requirePageUser } from "@/lib/auth/guards";
import { mailboxEnabled } from "@/lib/env";

export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const me = await requirePageUser();
  return (
    <div className="flex min-h-screen flex-col">
      <AppHeader name={me.user.name} teamName={me.teamName} role={me.role} mailbox={mailboxEnabled()} />
      <main className="mx-auto w-full max-w-screen-2xl flex-1 px-4 py-6">{children}</main>
    </div>
  );
}
