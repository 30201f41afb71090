import type { Metadata } from "next";
import { mailboxEnabled } from "@/lib/env";
import { ForgotForm } from "./forgot-form";

export const metadata: Metadata = { title: "Forgot your password?" };
export const dynamic = "force-dynamic";

// Public page: anyone may ask; the answer never says whether the address has an account.
export default function ForgotPasswordPage() {
  return <ForgotForm mailbox={mailboxEnabled()} />;
}
