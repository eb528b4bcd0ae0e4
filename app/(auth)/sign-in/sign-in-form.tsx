"use client";

import { useActionState } from "react";
import { TextField } from "@/components/ui/field";
import { INITIAL_STATE } from "@/lib/auth/action-state";
import { signIn } from "../actions";
import { FormMessage, SubmitButton } from "../_components/form-bits";

export function SignInForm({ next }: { next?: string }) {
  const [state, action] = useActionState(signIn, INITIAL_STATE);
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <FormMessage state={state} />
      {next ? <input type="hidden" name="next" value={next} /> : null}
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
        autoComplete="current-password"
        required
        error={state.fieldErrors?.password}
      />
      <SubmitButton>Sign in</SubmitButton>
    </form>
  );
}
