"use server";

import { cookies } from "next/headers";
import { redirect } from "next/navigation";
import { requireUser } from "@/lib/auth/guards";
import { signOut } from "@/lib/auth/service";

export async function signOutAction(): Promise<void> {
  const me = await requireUser();
  const cookie = await signOut(me.session.id);
  (await cookies()).set(cookie.name, cookie.value, cookie.attributes);
  redirect("/sign-in");
}
