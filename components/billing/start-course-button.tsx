"use client";
import { useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { fetchJson, errorWords } from "@/lib/catalogue/fetch-json";

export function StartCourseButton({ courseId, title }: { courseId: string; title: string }) {
  const client = useQueryClient();
  const [state, setState] = useState<"idle" | "busy" | "done">("idle");
  const [error, setError] = useState<string | null>(null);
  if (state === "done") return null;
  async function start() {
    setState("busy");
    setError(null);
    try {
      await fetchJson("/api/learn/enrolments", { method: "POST", body: { courseId } });
      setState("done");
      // The ladder is fetched by the client (components/ladder/ladder-view.tsx): ask it again.
      await client.invalidateQueries({ queryKey: ["ladder"] });
    } catch (e) {
      setError(errorWords(e));
      setState("idle");
    }
  }
  return (
    <div className="mb-4 flex flex-col gap-2">
      <p className="text-bark">Your membership opens every course. Start “{title}” to walk its ladder.</p>
      <div>
        <Button onClick={start} disabled={state === "busy"}>
          {state === "busy" ? "Starting…" : "Start this course"}
        </Button>
      </div>
      {error ? (
        <Alert tone="error" live>
          {error}
        </Alert>
      ) : null}
    </div>
  );
}
