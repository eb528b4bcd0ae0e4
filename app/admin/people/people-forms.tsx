"use client";

import { useActionState } from "react";
import { TextField } from "@/components/ui/field";
import { Select } from "@/components/ui/input";
import { INITIAL_STATE } from "@/lib/auth/action-state";
import { FormMessage, SubmitButton } from "@/app/(auth)/_components/form-bits";
import { changeRole, inviteTeacher } from "./actions";

export function InviteTeacherForm() {
  const [state, action] = useActionState(inviteTeacher, INITIAL_STATE);
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <FormMessage state={state} />
      <div className="flex flex-wrap items-end gap-3">
        <div className="min-w-64 flex-1">
          <TextField
            name="email"
            id="teacher-email"
            type="email"
            label="Teacher's e-mail address"
            required
            defaultValue={state.status === 200 ? "" : state.values?.email}
            error={state.fieldErrors?.email}
          />
        </div>
        <SubmitButton>Invite to teach</SubmitButton>
      </div>
    </form>
  );
}

const ROLES = ["student", "teacher", "admin"] as const;

export function RoleForm({
  userId,
  name,
  role,
  self,
}: {
  userId: string;
  name: string;
  role: (typeof ROLES)[number];
  self: boolean;
}) {
  const [state, action] = useActionState(changeRole, INITIAL_STATE);
  if (self) return <span className="capitalize">{role} (you)</span>;
  return (
    <form action={action} className="flex flex-col gap-1">
      <input type="hidden" name="userId" value={userId} />
      <div className="flex items-center gap-2">
        <label htmlFor={`role-${userId}`} className="sr-only">
          Role of {name}
        </label>
        <Select id={`role-${userId}`} name="role" defaultValue={role} className="w-auto min-w-32">
          {ROLES.map((r) => (
            <option key={r} value={r}>
              {r[0].toUpperCase() + r.slice(1)}
            </option>
          ))}
        </Select>
        <SubmitButton variant="secondary">Save</SubmitButton>
      </div>
      {state.status && state.status !== 200 ? (
        <p role="alert" className="text-small font-semibold text-berry">
          {state.message}
        </p>
      ) : state.status === 200 ? (
        <p role="status" className="text-small text-spruce">
          {state.message}
        </p>
      ) : null}
    </form>
  );
}
