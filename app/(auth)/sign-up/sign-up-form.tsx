"use client";

import { useActionState } from "react";
import { Alert } from "@/components/ui/alert";
import { TextField } from "@/components/ui/field";
import { INITIAL_STATE } from "@/lib/auth/action-state";
import { signUp } from "../actions";
import { FormMessage, SubmitButton } from "../_components/form-bits";

export function SignUpForm({ minLength }: { minLength: number }) {
  const [state, action] = useActionState(signUp, INITIAL_STATE);
  if (state.status === 200) {
    return (
      <Alert tone="success" title="Check your e-mail" live>
        {state.message}
      </Alert>
    );
  }
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <FormMessage state={state} />
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
