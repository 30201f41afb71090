import type { Metadata } from "next";
import Link from "next/link";
import { RESET_MESSAGES, viewPasswordReset } from "@/lib/auth/password-reset";
import { Notice } from "@/components/ui/notice";
import { ResetForm } from "./reset-form";

// The token is in the path: never send it on in a Referer.
export const metadata: Metadata = { title: "Set a new password", referrer: "no-referrer" };
export const dynamic = "force-dynamic";

const TITLES = {
  invalid: "This link does not work",
  used: "Link already used",
  expired: "Link expired",
} as const;

// Public page: the single-use token is the guard.
export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const view = await viewPasswordReset(token);
  if (view.state !== "open") {
    return (
      <div className="flex flex-col gap-4">
        <h1 className="text-xl font-bold">{TITLES[view.state]}</h1>
        <Notice tone="info">{RESET_MESSAGES[view.state]}</Notice>
        <Link
          href="/forgot-password"
          className="text-center text-sm font-semibold text-copper-dark underline"
        >
          Ask for a new link
        </Link>
      </div>
    );
  }
  return <ResetForm token={token} email={view.email} />;
}
