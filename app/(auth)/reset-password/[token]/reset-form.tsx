"use client";

import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { resetPasswordAction, type ResetState } from "./actions";

const INITIAL: ResetState = { errors: {}, error: null };

export function ResetForm({ token, email }: { token: string; email: string }) {
  const [state, action, pending] = useActionState(resetPasswordAction, INITIAL);
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <h1 className="text-xl font-bold">Set a new password</h1>
      <p className="text-sm text-ink-soft">
        For {email}. Setting it signs you out everywhere else and signs you in here.
      </p>
      {state.error ? <Notice tone="error">{state.error}</Notice> : null}
      <input type="hidden" name="token" value={token} />
      <Field
        id="password"
        name="password"
        type="password"
        label="New password"
        autoComplete="new-password"
        hint="At least 10 characters."
        error={state.errors.password}
      />
      <Field
        id="confirm"
        name="confirm"
        type="password"
        label="The same again"
        autoComplete="new-password"
        error={state.errors.confirm}
      />
      <Button type="submit" size="lg" disabled={pending}>
        {pending ? "Saving…" : "Set the password"}
      </Button>
    </form>
  );
}
