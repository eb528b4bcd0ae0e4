"use client";

import { useActionState } from "react";
import { useFormStatus } from "react-dom";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { INITIAL_STATE } from "@/lib/auth/action-state";
import { startCourse } from "./actions";

function StartButton() {
  const { pending } = useFormStatus();
  return (
    <Button type="submit" disabled={pending} aria-disabled={pending}>
      {pending ? "Starting…" : "Start this course"}
    </Button>
  );
}

/** A form (it works before the page's script has loaded): the enrolment, then the course's ladder. */
export function StartForm({ courseId }: { courseId: string }) {
  const [state, action] = useActionState(startCourse, INITIAL_STATE);
  return (
    <form action={action} className="flex flex-col gap-2">
      <input type="hidden" name="courseId" value={courseId} />
      <div>
        <StartButton />
      </div>
      {state.status && state.status !== 200 && state.message ? (
        <Alert tone="error" live>
          {state.message}
        </Alert>
      ) : null}
    </form>
  );
}
