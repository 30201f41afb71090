import { AppHeader } from "@/components/layout/app-header";
import { optionalUser } from "@/lib/auth/guards";

export default async function TraceLayout({ children }: { children: React.ReactNode }) {
  // The page itself guards the run; the header only shows who is signed in.
  const me = await optionalUser();
  return (
    <div className="flex min-h-screen flex-col">
      {me ? <AppHeader name={me.user.name} teamName={me.teamName} role={me.role} /> : null}
      <main className="mx-auto w-full max-w-3xl flex-1 px-4 py-5">{children}</main>
    </div>
  );
}
