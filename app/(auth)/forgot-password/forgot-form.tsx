"use client";

import { useActionState } from "react";
import { Alert } from "@/components/ui/alert";
import { TextField } from "@/components/ui/field";
import { INITIAL_STATE } from "@/lib/auth/action-state";
import { requestReset } from "../actions";
import { FormMessage, SubmitButton } from "../_components/form-bits";

export function ForgotForm() {
  const [state, action] = useActionState(requestReset, INITIAL_STATE);
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
        name="email"
        type="email"
        label="E-mail address"
        autoComplete="email"
        required
        defaultValue={state.values?.email}
        error={state.fieldErrors?.email}
      />
      <SubmitButton>Send me a reset link</SubmitButton>
    </form>
  );
}
