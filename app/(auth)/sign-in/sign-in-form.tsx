"use client";

import { useActionState } from "react";
import Link from "next/link";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { signInAction, type SignInState } from "./actions";

const INITIAL: SignInState = { email: "", error: null };

export function SignInForm({ next }: { next: string }) {
  const [state, action, pending] = useActionState(signInAction, INITIAL);
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <h1 className="text-xl font-bold">Sign in</h1>
      {state.error ? <Notice tone="error">{state.error}</Notice> : null}
      <input type="hidden" name="next" value={next} />
      <Field
        id="email"
        name="email"
        type="email"
        label="E-mail"
        autoComplete="email"
        defaultValue={state.email}
        required
      />
      <Field
        id="password"
        name="password"
        type="password"
        label="Password"
        autoComplete="current-password"
        required
      />
      <Button type="submit" size="lg" disabled={pending}>
        {pending ? "Signing in…" : "Sign in"}
      </Button>
      <p className="text-center text-sm">
        <Link href="/forgot-password" className="font-semibold text-copper-dark underline">
          Forgot your password?
        </Link>
      </p>
      <p className="text-center text-sm text-ink-soft">
        New team?{" "}
        <Link href="/sign-up" className="font-semibold text-copper-dark underline">
          Create an account
        </Link>
      </p>
    </form>
  );
}
