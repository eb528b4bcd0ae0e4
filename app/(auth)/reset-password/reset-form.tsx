"use client";

import { useActionState } from "react";
import { TextField } from "@/components/ui/field";
import { INITIAL_STATE } from "@/lib/auth/action-state";
import { resetPassword } from "../actions";
import { FormMessage, SubmitButton } from "../_components/form-bits";

export function ResetForm({ token, minLength }: { token: string; minLength: number }) {
  const [state, action] = useActionState(resetPassword, INITIAL_STATE);
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <FormMessage state={state} />
      <input type="hidden" name="token" value={token} />
      <TextField
        name="password"
        type="password"
        label="New password"
        autoComplete="new-password"
        hint={`At least ${minLength} characters. Signing in anywhere else will need it too.`}
        required
        error={state.fieldErrors?.password ?? state.fieldErrors?.token}
      />
      <SubmitButton>Save the new password</SubmitButton>
    </form>
  );
}
