import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { optionalUser } from "@/lib/auth/guards";
import { SignUpForm } from "./sign-up-form";

export const metadata: Metadata = { title: "Create an account" };

export default async function SignUpPage() {
  const me = await optionalUser();
  if (me) redirect("/projects");
  return <SignUpForm />;
}
