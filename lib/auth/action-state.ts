// What a guarded server action answers. Plain data only: it crosses to the browser, where the
// form shows `message` and each `fieldErrors[name]` beside its field.

export type ActionState = {
  /** 0 before the first submit; otherwise an HTTP-like status (200, 400, 401, 403, 404, 409, 422, 429). */
  status: number;
  message?: string;
  fieldErrors?: Record<string, string>;
  /** What the person typed, echoed back so a failed submit keeps it (never passwords). */
  values?: Record<string, string>;
  /** Where the thin server action sends the browser on success. */
  redirectTo?: string;
};

export const INITIAL_STATE: ActionState = { status: 0 };
