"use client";

import { Button } from "@/components/ui/button";

export default function AppError({ reset }: { error: Error; reset: () => void }) {
  return (
    <div
      role="alert"
      className="mx-auto mt-10 flex max-w-lg flex-col items-center gap-4 rounded-lg border border-fail bg-white p-8 text-center"
    >
      <h1 className="text-lg font-bold text-fail">This page could not be loaded</h1>
      <p className="text-sm text-ink-soft">
        Nothing you saved is lost. The server or the database may be restarting; try again in a few seconds.
      </p>
      <Button onClick={() => reset()}>Try again</Button>
    </div>
  );
}
