"use client";

import { useActionState } from "react";
import { Field } from "@/components/ui/field";
import { Textarea } from "@/components/ui/input";
import { INITIAL_STATE } from "@/lib/auth/action-state";
import { FormMessage, SubmitButton } from "@/app/(auth)/_components/form-bits";
import { inviteStudents } from "./actions";

export function InviteStudentsForm({ max }: { max: number }) {
  const [state, action] = useActionState(inviteStudents, INITIAL_STATE);
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <FormMessage state={state} />
      <Field
        id="addresses"
        label="Students' e-mail addresses"
        hint={`One or many (up to ${max}), separated by commas, spaces or new lines.`}
        error={state.fieldErrors?.addresses}
        required
      >
        {(control) => (
          // A successful send clears the box; a failed one keeps what was typed.
          <Textarea
            name="addresses"
            rows={6}
            defaultValue={state.status === 200 ? "" : state.values?.addresses}
            {...control}
          />
        )}
      </Field>
      <div>
        <SubmitButton>Send invitations</SubmitButton>
      </div>
    </form>
  );
}
