import { redirect } from "next/navigation";
import { optionalUser } from "@/lib/auth/guards";

export default async function Home() {
  const me = await optionalUser();
  redirect(me ? "/projects" : "/sign-in");
}
