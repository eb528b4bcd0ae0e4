"use client";
// The unlock rule and its practice minutes, shared by the assign form and the edit form.
import { Field } from "@/components/ui/field";
import { Input, Select } from "@/components/ui/input";

export type UnlockRule = "teacher_sign_off" | "self_check_in";

export function UnlockRuleFields(p: {
  idPrefix: string;
  rule: UnlockRule;
  minutes: string;
  onRule: (r: UnlockRule) => void;
  onMinutes: (m: string) => void;
  errors: Record<string, string>;
}) {
  return (
    <div className="grid gap-4 sm:grid-cols-2">
      <Field
        id={`${p.idPrefix}-rule`}
        label="Unlock rule"
        hint="What opens the next stage."
        error={p.errors.unlockRule}
      >
        {(c) => (
          <Select {...c} value={p.rule} onChange={(e) => p.onRule(e.target.value as UnlockRule)}>
            <option value="teacher_sign_off">I sign off each check-in</option>
            <option value="self_check_in">The student&apos;s own check-in, after enough practice</option>
          </Select>
        )}
      </Field>
      {p.rule === "self_check_in" ? (
        <Field
          id={`${p.idPrefix}-minutes`}
          label="Practice minutes"
          hint="Logged on this tune since the stage opened."
          error={p.errors.unlockMinutes}
        >
          {(c) => (
            <Input
              {...c}
              type="number"
              inputMode="numeric"
              min={1}
              max={600}
              value={p.minutes}
              onChange={(e) => p.onMinutes(e.target.value)}
            />
          )}
        </Field>
      ) : null}
    </div>
  );
}
