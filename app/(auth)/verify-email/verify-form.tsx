"use client";

import { useActionState } from "react";
import { INITIAL_STATE } from "@/lib/auth/action-state";
import { verifyEmail } from "../actions";
import { FormMessage, SubmitButton } from "../_components/form-bits";

export function VerifyForm({ token, chosen }: { token: string; chosen: { plan: string; course?: string } | null }) {
  const [state, action] = useActionState(verifyEmail, INITIAL_STATE);
  return (
    <form action={action} className="flex flex-col gap-4">
      <FormMessage state={state} />
      <input type="hidden" name="token" value={token} />
      {chosen ? <input type="hidden" name="plan" value={chosen.plan} /> : null}
      {chosen?.course ? <input type="hidden" name="course" value={chosen.course} /> : null}
      <SubmitButton>Confirm my address</SubmitButton>
    </form>
  );
}
