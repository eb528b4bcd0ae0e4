"use client";

import { useFormStatus } from "react-dom";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import type { ActionState } from "@/lib/auth/action-state";

/** The submit button of a form: busy while the action runs so a double click sends once. */
export function SubmitButton({
  children,
  variant,
}: {
  children: React.ReactNode;
  variant?: "primary" | "secondary" | "danger";
}) {
  const { pending } = useFormStatus();
  return (
    <Button type="submit" variant={variant} disabled={pending} aria-disabled={pending}>
      {pending ? "Working…" : children}
    </Button>
  );
}

/** The form-level message of the last submit (field messages sit beside their fields). */
export function FormMessage({ state }: { state: ActionState }) {
  if (!state.status || !state.message) return null;
  const ok = state.status === 200;
  return (
    <Alert tone={ok ? "success" : "error"} live>
      {state.message}
    </Alert>
  );
}
