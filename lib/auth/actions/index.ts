import { z } from "zod";
import { guardAction } from "../guard";
import { acceptInvitation } from "../accept-invitation";
import { inviteStudents, inviteTeacher } from "../invitations";
import { requestPasswordReset, resetPassword } from "../password-reset";
import { changeRole } from "../people";
import { signIn } from "../sign-in";
import { signUp } from "../sign-up";
import { verifyEmail } from "../verify-email";
import { chosenPlanFields } from "../chosen-plan";

// Every server action of the accounts area, each wrapped by the one guard. The `"use server"`
// files next to the forms only pass the real request's context to these; tests pass their own.

const email = z
  .string()
  .trim()
  .min(1, "Please enter your e-mail address.")
  .pipe(z.email("That doesn't look like an e-mail address."));
const token = z.string().min(16, "This link is incomplete: open it again from the e-mail.");
const role = z.enum(["student", "teacher", "admin"]);

export const signUpAction = guardAction(
  "account:sign-up",
  z.object({
    name: z.string().trim().min(1, "Please tell us your name.").max(120, "Please shorten your name to 120 characters."),
    email,
    password: z.string().min(1, "Please choose a password."),
    // The plan (and course) chosen before signing up: carried to its checkout, or quietly dropped when malformed.
    ...chosenPlanFields,
  }),
  signUp,
);

export const signInAction = guardAction(
  "account:sign-in",
  z.object({ email, password: z.string().min(1, "Please enter your password."), next: z.string().optional() }),
  signIn,
);

export const requestResetAction = guardAction("account:reset-password", z.object({ email }), requestPasswordReset);

export const resetPasswordAction = guardAction(
  "account:reset-password",
  z.object({ token, password: z.string().min(1, "Please choose a new password.") }),
  resetPassword,
);

export const verifyEmailAction = guardAction(
  "account:verify-email",
  z.object({ token, ...chosenPlanFields }),
  verifyEmail,
);

export const acceptInvitationAction = guardAction(
  "invitation:accept",
  z.object({ token, name: z.string().max(120).optional(), password: z.string().optional() }),
  acceptInvitation,
);

export const inviteStudentsAction = guardAction(
  "students:invite",
  z.object({ addresses: z.string().max(20_000, "That's a lot of text: up to 50 addresses at a time, please.") }),
  inviteStudents,
);

export const inviteTeacherAction = guardAction("people:invite-teacher", z.object({ email }), inviteTeacher);

export const changeRoleAction = guardAction(
  "people:change-role",
  z.object({ userId: z.uuid("Unknown person."), role }),
  changeRole,
);
