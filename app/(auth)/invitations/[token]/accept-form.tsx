"use client";

import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { acceptInvitationAction, type AcceptState } from "./actions";

const INITIAL: AcceptState = { name: "", errors: {}, error: null };

export function AcceptForm({
  token,
  email,
  hasAccount,
  signedIn,
  teamName,
}: {
  token: string;
  email: string;
  hasAccount: boolean;
  /** Signed in as the invited address already: one click joins. */
  signedIn: boolean;
  teamName: string;
}) {
  const [state, action, pending] = useActionState(acceptInvitationAction, INITIAL);
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      {state.error ? <Notice tone="error">{state.error}</Notice> : null}
      <input type="hidden" name="token" value={token} />
      <Field id="email" label="E-mail" type="email" value={email} readOnly disabled />
      {signedIn ? null : hasAccount ? (
        <Field
          id="password"
          name="password"
          type="password"
          label="Your password"
          autoComplete="current-password"
          hint="You already have a Loomwright account with this address."
          error={state.errors.password}
        />
      ) : (
        <>
          <Field
            id="name"
            name="name"
            label="Your name"
            autoComplete="name"
            defaultValue={state.name}
            error={state.errors.name}
          />
          <Field
            id="password"
            name="password"
            type="password"
            label="Choose a password"
            autoComplete="new-password"
            hint="At least 10 characters."
            error={state.errors.password}
          />
        </>
      )}
      <Button type="submit" size="lg" disabled={pending}>
        {pending ? "Joining…" : `Join ${teamName}`}
      </Button>
    </form>
  );
}
