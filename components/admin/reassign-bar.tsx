"use client";
// Hands the chosen enrolments to another teacher in one go; the table is asked again afterwards.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Select } from "@/components/ui/input";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import type { Choice } from "./types";

export function ReassignBar({
  chosen,
  teachers,
  onDone,
}: {
  chosen: string[];
  teachers: Choice[];
  onDone: () => void;
}) {
  const qc = useQueryClient();
  const [teacherId, setTeacherId] = useState("");
  const [said, setSaid] = useState<string | null>(null);
  const go = useMutation({
    mutationFn: () =>
      fetchJson<{ changed: number; teacherName: string }>("/api/admin/enrolments/teacher", {
        method: "POST",
        body: { enrolmentIds: chosen, teacherId },
      }),
    onSuccess: async (r) => {
      setSaid(
        `${r.changed} ${r.changed === 1 ? "enrolment" : "enrolments"} handed to ${r.teacherName}${r.changed < chosen.length ? " (the others were already theirs)" : ""}.`,
      );
      onDone();
      await qc.invalidateQueries({ queryKey: ["admin-table", "/api/admin/enrolments"] });
    },
  });
  return (
    <form
      className="flex flex-wrap items-end gap-3 rounded-knot border border-line bg-sawdust p-3"
      aria-label="Hand enrolments to another teacher"
      onSubmit={(e) => {
        e.preventDefault();
        setSaid(null);
        go.mutate();
      }}
    >
      <p className="w-full text-small text-bark" data-testid="reassign-count">
        {chosen.length === 0
          ? "Tick enrolments in the table to hand them to another teacher."
          : `${chosen.length} ${chosen.length === 1 ? "enrolment" : "enrolments"} chosen.`}
      </p>
      <Field id="reassign-teacher" label="New teacher">
        {(c) => (
          <Select {...c} value={teacherId} onChange={(e) => setTeacherId(e.target.value)}>
            <option value="">Choose a teacher…</option>
            {teachers.map((t) => (
              <option key={t.id} value={t.id}>
                {t.name}
              </option>
            ))}
          </Select>
        )}
      </Field>
      <Button type="submit" variant="secondary" disabled={go.isPending || chosen.length === 0 || teacherId === ""}>
        Reassign
      </Button>
      {said ? (
        <Alert tone="success" live className="w-full">
          {said}
        </Alert>
      ) : null}
      {go.isError ? (
        <Alert tone="error" live className="w-full">
          {errorWords(go.error)}
        </Alert>
      ) : null}
    </form>
  );
}
