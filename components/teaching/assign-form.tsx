"use client";
// The assign form (issue 6 item 1): a tune of the teacher's, students of the roster, a due date on
// the student's own clock (the teacher's when several), the stage plan, the unlock rule and a note.
// The server checks everything again and names the field it refuses.
import Link from "next/link";
import { useState, type FormEvent } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Input, Select, Textarea } from "@/components/ui/input";
import { DEFAULT_PLAN } from "@/lib/abc/stages";
import type { StagePlan } from "@/lib/abc/types";
import { ApiError, fetchJson } from "@/lib/catalogue/fetch-json";
import { PlanChoice, planReasons } from "./plan-choice";
import { UnlockRuleFields } from "./unlock-rule-fields";

export type AssignTune = {
  id: string;
  title: string;
  stagePlan: StagePlan | null;
};
export type AssignStudent = { id: string; name: string; timeZone: string };
export type AssignFormProps = {
  tunes: AssignTune[];
  students: AssignStudent[];
  teacherZone: string;
  defaultDue: string;
  tuneId?: string;
  studentId?: string;
};

type Done = { count: number; title: string };

export function AssignForm({
  tunes,
  students,
  teacherZone,
  defaultDue,
  tuneId: initialTune,
  studentId,
}: AssignFormProps) {
  const [tuneId, setTuneId] = useState(
    initialTune && tunes.some((t) => t.id === initialTune) ? initialTune : (tunes[0]?.id ?? ""),
  );
  const [chosen, setChosen] = useState<string[]>(
    studentId && students.some((s) => s.id === studentId) ? [studentId] : [],
  );
  const [due, setDue] = useState(defaultDue);
  const [changePlan, setChangePlan] = useState(false);
  const tune = tunes.find((t) => t.id === tuneId);
  const tunePlan = tune?.stagePlan ?? DEFAULT_PLAN;
  const [plan, setPlan] = useState<StagePlan>(tunePlan);
  const [rule, setRule] = useState<"teacher_sign_off" | "self_check_in">("teacher_sign_off");
  const [minutes, setMinutes] = useState("60");
  const [note, setNote] = useState("");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [done, setDone] = useState<Done | null>(null);
  const [busy, setBusy] = useState(false);

  const picked = students.filter((s) => chosen.includes(s.id));
  const zone = picked.length === 1 ? picked[0].timeZone : teacherZone;
  const reasons = planReasons(changePlan, plan);

  const pickTune = (id: string): void => {
    setTuneId(id);
    setPlan(tunes.find((t) => t.id === id)?.stagePlan ?? DEFAULT_PLAN);
  };
  const toggle = (id: string, on: boolean): void => setChosen((c) => (on ? [...c, id] : c.filter((x) => x !== id)));

  async function submit(e: FormEvent): Promise<void> {
    e.preventDefault();
    setBusy(true);
    setErrors({});
    setMessage(null);
    setDone(null);
    try {
      await fetchJson<{ id: string }>("/api/teach/assignments", {
        method: "POST",
        body: {
          tuneId,
          studentIds: chosen,
          dueLocal: due,
          // The tune's own plan ticked but left as it was is no change: the assignment follows the tune.
          stagePlan: changePlan && JSON.stringify(plan) !== JSON.stringify(tunePlan) ? plan : null,
          unlockRule: rule,
          unlockMinutes: rule === "self_check_in" ? minutes : null,
          note,
        },
      });
      setDone({ count: chosen.length, title: tune?.title ?? "the tune" });
      setChosen([]);
      setNote("");
    } catch (error) {
      setErrors(error instanceof ApiError ? error.fieldErrors : {});
      setMessage(error instanceof Error ? error.message : "Something went wrong.");
    } finally {
      setBusy(false);
    }
  }

  if (!tunes.length)
    return (
      <Alert tone="info" title="No tunes yet">
        Write or import a tune first; then you can assign it.
      </Alert>
    );
  if (!students.length)
    return (
      <Alert tone="info" title="No students yet">
        Invite students to your roster first; then you can assign them tunes.
      </Alert>
    );

  return (
    <form onSubmit={submit} className="flex max-w-3xl flex-col gap-6" noValidate>
      {done ? (
        <Alert tone="success" title="Assigned" live>
          Assigned “{done.title}” to {done.count} student
          {done.count === 1 ? "" : "s"}; each gets an e-mail.{" "}
          <Link href="/teach/assignments">See your assignments</Link>
        </Alert>
      ) : null}
      {message ? (
        <Alert tone="error" live>
          {message}
        </Alert>
      ) : null}
      <Field id="assign-tune" label="Tune" error={errors.tuneId} required>
        {(c) => (
          <Select {...c} value={tuneId} onChange={(e) => pickTune(e.target.value)}>
            {tunes.map((t) => (
              <option key={t.id} value={t.id}>
                {t.title}
              </option>
            ))}
          </Select>
        )}
      </Field>
      <fieldset
        className="flex min-w-0 flex-col gap-2"
        aria-describedby={errors.studentIds ? "assign-students-error" : undefined}
      >
        <legend className="font-semibold text-ink">Students</legend>
        <div className="grid gap-2 sm:grid-cols-2">
          {students.map((s) => (
            <label
              key={s.id}
              className="flex min-h-11 items-center gap-3 rounded-knot border border-line bg-paper px-3"
            >
              <input
                type="checkbox"
                className="size-5 accent-cedar"
                checked={chosen.includes(s.id)}
                onChange={(e) => toggle(s.id, e.target.checked)}
              />
              <span>{s.name}</span>
            </label>
          ))}
        </div>
        {errors.studentIds ? (
          <p id="assign-students-error" className="text-small font-semibold text-berry">
            {errors.studentIds}
          </p>
        ) : null}
      </fieldset>
      <Field
        id="assign-due"
        label="Due"
        hint={`Date and time in ${zone}${picked.length === 1 ? ` (${picked[0].name}'s time zone)` : " (your time zone); each student sees it in their own"}.`}
        error={errors.dueLocal}
        required
      >
        {(c) => <Input {...c} type="datetime-local" value={due} onChange={(e) => setDue(e.target.value)} />}
      </Field>
      <PlanChoice
        tunePlan={tunePlan}
        changed={changePlan}
        plan={plan}
        onChanged={(on) => {
          setChangePlan(on);
          setPlan(tunePlan);
        }}
        onPlan={setPlan}
        error={errors.stagePlan}
      />
      <UnlockRuleFields
        idPrefix="assign"
        rule={rule}
        minutes={minutes}
        onRule={setRule}
        onMinutes={setMinutes}
        errors={errors}
      />
      <Field id="assign-note" label="Note to the students" error={errors.note}>
        {(c) => <Textarea {...c} rows={4} value={note} onChange={(e) => setNote(e.target.value)} maxLength={2000} />}
      </Field>
      <div>
        <Button type="submit" needsScript disabled={busy || reasons.length > 0}>
          {busy ? "Assigning…" : "Assign"}
        </Button>
      </div>
    </form>
  );
}
