"use client";
// The designed error page for anything a layout or page could not load (for example while the database restarts):
// no internals shown; it retries by itself every few seconds and on request.
import { startTransition, useEffect } from "react";
import { useRouter } from "next/navigation";
import { Wordmark } from "@/components/brand/wordmark";
import { Button } from "@/components/ui/button";

const RETRY_MS = 3000;

export default function RootError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  const router = useRouter();
  const retry = () =>
    startTransition(() => {
      router.refresh();
      reset();
    });
  useEffect(() => {
    const t = window.setInterval(() => {
      if (document.visibilityState === "visible") retry();
    }, RETRY_MS);
    return () => window.clearInterval(t);
    // retry is rebuilt each render; the interval only needs the latest router and reset.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);
  return (
    <main className="flex min-h-screen flex-col items-center justify-center gap-5 px-4 text-center">
      <Wordmark size={32} />
      <div
        role="alert"
        className="flex max-w-md flex-col items-center gap-3 rounded-lg border border-fail bg-white p-8"
      >
        <h1 className="text-lg font-bold text-fail">Loomwright is not answering right now</h1>
        <p className="text-sm text-ink-soft">
          Nothing you saved is lost. The server or its database may be restarting; this page tries again by
          itself every few seconds.
        </p>
        <Button onClick={retry}>Try again now</Button>
      </div>
    </main>
  );
}
