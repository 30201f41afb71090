"use client";

import { useActionState } from "react";
import Link from "next/link";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { signUpAction, type SignUpState } from "./actions";

const INITIAL: SignUpState = { values: { email: "", name: "", teamName: "" }, errors: {}, error: null };

export function SignUpForm() {
  const [state, action, pending] = useActionState(signUpAction, INITIAL);
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <h1 className="text-xl font-bold">Create your team</h1>
      <p className="text-sm text-ink-soft">
        You will be the team&apos;s lead and can invite builders and technicians.
      </p>
      {state.error ? <Notice tone="error">{state.error}</Notice> : null}
      <Field
        id="name"
        name="name"
        label="Your name"
        autoComplete="name"
        defaultValue={state.values.name}
        error={state.errors.name}
      />
      <Field
        id="teamName"
        name="teamName"
        label="Team or workshop name"
        defaultValue={state.values.teamName}
        error={state.errors.teamName}
      />
      <Field
        id="email"
        name="email"
        type="email"
        label="E-mail"
        autoComplete="email"
        defaultValue={state.values.email}
        error={state.errors.email}
      />
      <Field
        id="password"
        name="password"
        type="password"
        label="Password"
        autoComplete="new-password"
        hint="At least 10 characters."
        error={state.errors.password}
      />
      <Button type="submit" size="lg" disabled={pending}>
        {pending ? "Creating…" : "Create account"}
      </Button>
      <p className="text-center text-sm text-ink-soft">
        Already have an account?{" "}
        <Link href="/sign-in" className="font-semibold text-copper-dark underline">
          Sign in
        </Link>
      </p>
    </form>
  );
}
