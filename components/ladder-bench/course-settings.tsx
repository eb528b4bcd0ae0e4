"use client";
// The course's settings: its lead teacher (who follows each new member) and its pace (how stages open).
import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Select } from "@/components/ui/input";
import type { CourseView } from "@/lib/courses/api-types";
import { PACE_NAME, paceWords } from "@/lib/teaching/climb-words";

type Settings = { leadTeacherId: string; pace: CourseView["pace"] };

export function CourseSettings({
  course,
  busy,
  onSave,
}: {
  course: CourseView;
  busy: boolean;
  onSave: (v: Settings) => void;
}) {
  const [lead, setLead] = useState(course.leadTeacherId);
  const [pace, setPace] = useState(course.pace);
  const changed = lead !== course.leadTeacherId || pace !== course.pace;
  const leadName = course.staff.find((s) => s.id === lead)?.name ?? "the lead teacher";
  const submit = (e: FormEvent): void => {
    e.preventDefault();
    onSave({ leadTeacherId: lead, pace });
  };
  return (
    <section aria-labelledby="settings-heading" className="flex flex-col gap-3">
      <h2 id="settings-heading" className="font-serif text-h3 font-semibold">
        Settings
      </h2>
      <form onSubmit={submit} className="grid gap-3 md:grid-cols-[1fr_1fr_auto] md:items-end">
        <Field id="lead-teacher" label="Lead teacher" hint="Follows every new member; the admin can reassign one.">
          {(c) => (
            <Select {...c} value={lead} onChange={(e) => setLead(e.target.value)}>
              {course.staff.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.name}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field id="course-pace" label="How stages open" hint={paceWords(pace, leadName)}>
          {(c) => (
            <Select {...c} value={pace} onChange={(e) => setPace(e.target.value as Settings["pace"])}>
              {(["self_paced", "teacher_sign_off"] as const).map((p) => (
                <option key={p} value={p}>
                  {PACE_NAME[p]}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Button type="submit" variant="secondary" disabled={!changed || busy}>
          Save the settings
        </Button>
      </form>
      <p className="text-small text-bark">Assignments keep their own unlock rule, whatever the course's pace.</p>
    </section>
  );
}
