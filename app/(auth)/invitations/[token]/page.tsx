import type { Metadata } from "next";
import Link from "next/link";
import { optionalUser } from "@/lib/auth/guards";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { INVITATION_MESSAGES, viewInvitation } from "@/lib/services/invitations";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { AcceptForm } from "./accept-form";
import { signOutForInvitationAction } from "./actions";

// The token is in the path: never send it on in a Referer.
export const metadata: Metadata = { title: "Invitation", referrer: "no-referrer" };

const TITLES = {
  invalid: "This link does not work",
  accepted: "Invitation already used",
  revoked: "Invitation withdrawn",
  expired: "Invitation expired",
} as const;

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  // Public page: the token is the guard; optionalUser only tells who, if anyone, is signed in.
  const [view, me] = await Promise.all([viewInvitation(token), optionalUser()]);
  if (view.state !== "open") {
    return (
      <div className="flex flex-col gap-4">
        <h1 className="text-xl font-bold">{TITLES[view.state]}</h1>
        <Notice tone="info" title={"teamName" in view ? view.teamName : "Invitation"}>
          {INVITATION_MESSAGES[view.state]}
        </Notice>
        <Link
          href={me ? "/projects" : "/sign-in"}
          className="text-center text-sm font-semibold text-copper-dark underline"
        >
          {me ? "Go to your projects" : "Sign in"}
        </Link>
      </div>
    );
  }
  const signedInOther = me && me.user.email.toLowerCase() !== view.email.toLowerCase();
  return (
    <div className="flex flex-col gap-4">
      <div>
        <p className="text-sm font-semibold uppercase tracking-wide text-copper-dark">Invitation</p>
        <h1 className="text-xl font-bold">Join {view.teamName}</h1>
        <p className="mt-1 text-sm text-ink-soft">
          {view.inviterName ? `${view.inviterName} invited you` : "You are invited"} as a{" "}
          <strong>{ROLE_LABELS[view.role].toLowerCase()}</strong>. The link expires on{" "}
          {new Date(view.expiresAt).toLocaleDateString("en-GB", {
            day: "numeric",
            month: "long",
            year: "numeric",
          })}
          .
        </p>
      </div>
      {signedInOther ? (
        <>
          <Notice tone="caution" title="You are signed in as someone else">
            This invitation is for {view.email}, and you are signed in as {me.user.email}. Sign out to accept
            it.
          </Notice>
          <form action={signOutForInvitationAction}>
            <input type="hidden" name="token" value={token} />
            <Button type="submit" variant="secondary" className="w-full">
              Sign out and continue
            </Button>
          </form>
        </>
      ) : (
        <AcceptForm
          token={token}
          email={view.email}
          hasAccount={view.hasAccount}
          signedIn={Boolean(me)}
          teamName={view.teamName}
        />
      )}
    </div>
  );
}
