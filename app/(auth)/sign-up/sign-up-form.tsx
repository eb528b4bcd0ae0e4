"use client";

import Link from "next/link";
import { useActionState } from "react";
import { Alert } from "@/components/ui/alert";
import { TextField } from "@/components/ui/field";
import { INITIAL_STATE } from "@/lib/auth/action-state";
import { signUp } from "../actions";
import { FormMessage, SubmitButton } from "../_components/form-bits";

export function SignUpForm({
  minLength,
  mailbox,
  chosen,
}: {
  minLength: number;
  /** This copy sends its e-mail to the local stand-in: link its captured-mail page. */
  mailbox: boolean;
  chosen: { plan: string; course?: string } | null;
}) {
  const [state, action] = useActionState(signUp, INITIAL_STATE);
  if (state.status === 200) {
    return (
      <Alert tone="success" title="Check your e-mail" live>
        {state.message}
        {mailbox ? (
          <span className="mt-2 block">
            This copy of Rosinwood keeps its e-mail on this machine:{" "}
            <Link href="/dev/mail">open the captured e-mail</Link>.
          </span>
        ) : null}
      </Alert>
    );
  }
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <FormMessage state={state} />
      {chosen ? <input type="hidden" name="plan" value={chosen.plan} /> : null}
      {chosen?.course ? <input type="hidden" name="course" value={chosen.course} /> : null}
      <TextField
        name="name"
        label="Your name"
        autoComplete="name"
        required
        defaultValue={state.values?.name}
        error={state.fieldErrors?.name}
      />
      <TextField
        name="email"
        type="email"
        label="E-mail address"
        autoComplete="email"
        required
        defaultValue={state.values?.email}
        error={state.fieldErrors?.email}
      />
      <TextField
        name="password"
        type="password"
        label="Password"
        autoComplete="new-password"
        hint={`At least ${minLength} characters. A few unrelated words make a strong one.`}
        required
        error={state.fieldErrors?.password}
      />
      <SubmitButton>Create my account</SubmitButton>
    </form>
  );
}
