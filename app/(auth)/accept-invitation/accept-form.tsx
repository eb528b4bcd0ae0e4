"use client";

import { useActionState } from "react";
import { TextField } from "@/components/ui/field";
import { INITIAL_STATE } from "@/lib/auth/action-state";
import { acceptInvitation } from "../actions";
import { FormMessage, SubmitButton } from "../_components/form-bits";

/** With `newAccount`, the invited person also chooses a name and password; otherwise one button links the signed-in account. */
export function AcceptForm({
  token,
  newAccount,
  minLength,
}: {
  token: string;
  newAccount: boolean;
  minLength: number;
}) {
  const [state, action] = useActionState(acceptInvitation, INITIAL_STATE);
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <FormMessage state={state} />
      <input type="hidden" name="token" value={token} />
      {newAccount ? (
        <>
          <TextField
            name="name"
            label="Your name"
            autoComplete="name"
            required
            defaultValue={state.values?.name}
            error={state.fieldErrors?.name}
          />
          <TextField
            name="password"
            type="password"
            label="Choose a password"
            autoComplete="new-password"
            hint={`At least ${minLength} characters.`}
            required
            error={state.fieldErrors?.password}
          />
        </>
      ) : null}
      <SubmitButton>{newAccount ? "Create my account and accept" : "Accept the invitation"}</SubmitButton>
    </form>
  );
}
