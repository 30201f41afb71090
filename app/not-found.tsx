import Link from "next/link";
import { Wordmark } from "@/components/brand/wordmark";

export default function NotFound() {
  return (
    <main className="flex min-h-screen flex-col items-center justify-center gap-4 px-4 text-center">
      <Wordmark size={32} />
      <h1 className="text-xl font-bold">Nothing here</h1>
      <p className="max-w-sm text-sm text-ink-soft">
        The page or record does not exist, or it belongs to a team you are not signed in to.
      </p>
      <Link href="/projects" className="font-semibold text-copper-dark underline">
        Back to projects
      </Link>
    </main>
  );
}
