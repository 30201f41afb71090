"use client";

import { useActionState } from "react";
import Link from "next/link";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { forgotPasswordAction, type ForgotState } from "./actions";

const INITIAL: ForgotState = { email: "", error: null, sent: null };

export function ForgotForm({ mailbox }: { mailbox: boolean }) {
  const [state, action, pending] = useActionState(forgotPasswordAction, INITIAL);
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <h1 className="text-xl font-bold">Forgot your password?</h1>
      <p className="text-sm text-ink-soft">
        Enter the e-mail address you sign in with. We will mail you a link to set a new password.
      </p>
      {state.error ? <Notice tone="error">{state.error}</Notice> : null}
      {state.sent ? (
        <Notice tone="ok" title="Check your mail">
          {state.sent}
          {mailbox ? (
            <>
              {" "}
              <Link href="/dev/mail" className="font-semibold underline">
                Open the development mailbox
              </Link>
            </>
          ) : null}
        </Notice>
      ) : null}
      <Field
        id="email"
        name="email"
        type="email"
        label="E-mail"
        autoComplete="email"
        defaultValue={state.email}
        required
      />
      <Button type="submit" size="lg" disabled={pending}>
        {pending ? "Sending…" : "Send the link"}
      </Button>
      <p className="text-center text-sm text-ink-soft">
        Remembered it?{" "}
        <Link href="/sign-in" className="font-semibold text-copper-dark underline">
          Sign in
        </Link>
      </p>
    </form>
  );
}
