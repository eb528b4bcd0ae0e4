"use client";
// "Compare with another setting" (issue 5 item 6): paste another player's ABC of this tune and see
// which bars and notes differ from the stage on screen. The tune engine (and abcjs under it) loads
// only when the student asks for a comparison.
import { useId, useState, type FormEvent } from "react";
import type { Comparison } from "@/lib/abc/compare";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Textarea } from "@/components/ui/input";
import { COMPARE_MAX } from "@/lib/catalogue/limits";
import { barWords, differenceWords } from "./compare-words";

export function CompareSettings({ abc, stageName }: { abc: string; stageName: string }) {
  const id = useId();
  const [text, setText] = useState("");
  const [skeleton, setSkeleton] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [result, setResult] = useState<Comparison | null>(null);
  const [busy, setBusy] = useState(false);

  const submit = async (e: FormEvent<HTMLFormElement>): Promise<void> => {
    e.preventDefault();
    const { compareInput, fieldErrors } = await import("@/lib/catalogue/schemas"); // zod loads on the first send
    const parsed = compareInput.safeParse({ abc: text, on: skeleton ? "skeleton" : "source" });
    if (!parsed.success) return setError(fieldErrors(parsed.error).abc ?? "Please check the ABC.");
    setBusy(true);
    try {
      const { compareSettings } = await import("@/lib/abc/compare");
      const r = compareSettings(abc, parsed.data.abc, { on: parsed.data.on });
      setError(r.ok ? null : r.problems.map((p) => `Line ${p.line}, column ${p.column}: ${p.message}`).join(" "));
      setResult(r.ok ? r.value : null);
    } finally {
      setBusy(false);
    }
  };

  const differing = result?.bars.filter((b) => b.status !== "equal") ?? [];
  return (
    <section
      aria-labelledby={`${id}-title`}
      className="flex flex-col gap-3 rounded-knot border border-line bg-paper p-4"
    >
      <h2 id={`${id}-title`} className="font-serif text-h4 font-semibold">
        Compare with another setting
      </h2>
      <form onSubmit={(e) => void submit(e)} noValidate className="flex flex-col gap-3">
        <label htmlFor={`${id}-abc`} className="font-semibold">
          Another setting of this tune, in ABC
        </label>
        <Textarea
          id={`${id}-abc`}
          rows={6}
          maxLength={COMPARE_MAX}
          value={text}
          onChange={(e) => setText(e.target.value)}
          className="font-mono text-small"
          spellCheck={false}
          aria-invalid={error ? true : undefined}
          placeholder={"X:1\nT:…\nM:4/4\nL:1/8\nK:D\n…"}
        />
        <label className="flex min-h-11 items-center gap-2">
          <input
            type="checkbox"
            checked={skeleton}
            onChange={(e) => setSkeleton(e.target.checked)}
            className="size-5 accent-cedar"
          />
          Compare the core melodies only (leave out ornaments and other embellishments)
        </label>
        <div>
          <Button type="submit" needsScript size="sm" disabled={busy}>
            {busy ? "Comparing…" : `Compare with ${stageName}`}
          </Button>
        </div>
      </form>
      {error ? (
        <Alert tone="error" live>
          {error}
        </Alert>
      ) : null}
      {result ? (
        <div role="status" className="flex flex-col gap-2" data-compare-different={result.summary.different}>
          <p className="font-semibold">
            {`${result.summary.equal} bars the same, ${result.summary.different} different` +
              (result.summary.onlyInFirst + result.summary.onlyInSecond > 0
                ? `, ${result.summary.onlyInFirst + result.summary.onlyInSecond} in only one of them`
                : "") +
              "."}
          </p>
          {result.summary.notes.map((n) => (
            <p key={n} className="text-small text-bark">
              {n}
            </p>
          ))}
          <ul className="flex flex-col gap-2">
            {differing.map((b) => (
              <li key={`${b.part}-${b.place}-${b.firstBar}-${b.secondBar}`}>
                <p>{barWords(b)}</p>
                <ul className="ml-5 list-disc text-small text-bark">
                  {b.differences.map((d, i) => (
                    <li key={i}>{differenceWords(d)}</li>
                  ))}
                </ul>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </section>
  );
}
