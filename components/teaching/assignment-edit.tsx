"use client";
// Editing an assignment: due date (in the zone it was set in), stage plan, unlock rule and note.
// The plan is sent only when touched: the API refuses a new plan once anyone has checked in.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState, type FormEvent } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Input, Textarea } from "@/components/ui/input";
import { ApiError, errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import type { AssignmentView } from "@/lib/teaching/teach-api-types";
import { DEFAULT_PLAN } from "@/lib/abc/stages";
import type { StagePlan } from "@/lib/abc/types";
import { storedPlan } from "@/lib/tunes/schemas";
import { PlanChoice, planReasons } from "./plan-choice";
import { ASSIGNMENTS_KEY } from "./query-keys";
import { UnlockRuleFields, type UnlockRule } from "./unlock-rule-fields";

export function AssignmentEdit({ a, onDone }: { a: AssignmentView; onDone: () => void }) {
  const qc = useQueryClient();
  const [due, setDue] = useState(a.dueLocal);
  const [rule, setRule] = useState<UnlockRule>(a.unlockRule);
  const [minutes, setMinutes] = useState(String(a.unlockMinutes ?? 60));
  const [note, setNote] = useState(a.note);
  const tunePlan = storedPlan(a.tunePlan) ?? DEFAULT_PLAN;
  const [changed, setChanged] = useState(a.stagePlan !== null);
  const [plan, setPlan] = useState<StagePlan>(storedPlan(a.stagePlan) ?? tunePlan);
  const [planTouched, setPlanTouched] = useState(false);
  const save = useMutation({
    mutationFn: () =>
      fetchJson<AssignmentView>(`/api/teach/assignments/${a.id}`, {
        method: "PATCH",
        body: {
          dueLocal: due,
          unlockRule: rule,
          unlockMinutes: rule === "self_check_in" ? minutes : null,
          note,
          ...(planTouched
            ? { stagePlan: changed && JSON.stringify(plan) !== JSON.stringify(tunePlan) ? plan : null }
            : {}),
        },
      }),
    onSuccess: async () => {
      await qc.invalidateQueries({ queryKey: ASSIGNMENTS_KEY });
      onDone();
    },
  });
  const errors = save.error instanceof ApiError ? save.error.fieldErrors : {};
  const submit = (e: FormEvent): void => {
    e.preventDefault();
    save.mutate();
  };
  const id = `edit-${a.id}`;
  return (
    <form
      onSubmit={submit}
      className="mt-4 flex flex-col gap-4 border-t border-line pt-4"
      noValidate
      aria-label={`Edit ${a.tune.title}`}
    >
      {save.isError ? (
        <Alert tone="error" live>
          {errorWords(save.error)}
        </Alert>
      ) : null}
      <Field id={`${id}-due`} label="Due" hint={`Date and time in ${a.dueZone}.`} error={errors.dueLocal}>
        {(c) => <Input {...c} type="datetime-local" value={due} onChange={(e) => setDue(e.target.value)} />}
      </Field>
      <PlanChoice
        tunePlan={tunePlan}
        changed={changed}
        plan={plan}
        onChanged={(on) => {
          setChanged(on);
          setPlan(tunePlan);
          setPlanTouched(true);
        }}
        onPlan={(p) => {
          setPlan(p);
          setPlanTouched(true);
        }}
        error={errors.stagePlan}
      />
      <UnlockRuleFields
        idPrefix={id}
        rule={rule}
        minutes={minutes}
        onRule={setRule}
        onMinutes={setMinutes}
        errors={errors}
      />
      <Field id={`${id}-note`} label="Note to the students" error={errors.note}>
        {(c) => <Textarea {...c} rows={3} value={note} onChange={(e) => setNote(e.target.value)} maxLength={2000} />}
      </Field>
      <div className="flex gap-2">
        <Button type="submit" needsScript disabled={save.isPending || planReasons(changed, plan).length > 0}>
          {save.isPending ? "Saving…" : "Save changes"}
        </Button>
        <Button variant="quiet" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
