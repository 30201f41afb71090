import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { optionalUser } from "@/lib/auth/guards";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string }> }) {
  const me = await optionalUser();
  if (me) redirect("/projects");
  const { next } = await searchParams;
  return <SignInForm next={next ?? "/projects"} />;
}
