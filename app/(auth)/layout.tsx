import { Wordmark } from "@/components/brand/wordmark";

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <main className="flex min-h-screen flex-col items-center justify-center gap-8 px-4 py-10">
      <Wordmark size={36} />
      <div className="w-full max-w-sm rounded-xl border border-line bg-white p-6 shadow-sm sm:p-8">
        {children}
      </div>
      <p className="max-w-sm text-center text-xs text-ink-faint">
        Cut lengths, electrical checks, spool plans and traceable markers for low-voltage DC harnesses.
      </p>
    </main>
  );
}
