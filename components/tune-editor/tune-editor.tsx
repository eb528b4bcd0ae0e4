"use client";
// The tune editor (issue 5 item 2): ABC with live notation and problems, what the ABC says about
// the tune, the stage plan with the stages side by side, the phrase map and the twin swaps.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useMemo, useState, type ReactNode } from "react";
import { Notation } from "@/components/notation";
import { DEFAULT_PLAN } from "@/lib/abc/stages";
import type { Voice } from "@/lib/abc/double-stops";
import type { StagePlan } from "@/lib/abc/types";
import type { SavedBody, TuneView } from "@/lib/tunes/api-types";
import { teachFetch } from "@/lib/tunes/client-fetch";
import { learningLoadWith } from "@/lib/tunes/learning-load";
import { AbcSource } from "./abc-source";
import { PhrasePanel } from "./phrase-panel";
import { PlanEditor } from "./plan-editor";
import { PlanFit } from "./plan-fit";
import { SaveBar } from "./save-bar";
import { StagePreviews } from "./stage-previews";
import { SwapPanel } from "./swap-panel";
import { TuneFacts } from "./tune-facts";
import { useLiveCheck } from "./use-live-check";

export const NEW_TUNE_TEMPLATE = "X:1\nT:\nR:reel\nM:4/4\nL:1/8\nK:D\n";

const samePlan = (a: StagePlan, b: StagePlan): boolean => JSON.stringify(a) === JSON.stringify(b);
const sameTurns = (a: Readonly<Record<string, Voice>>, b: Readonly<Record<string, Voice>>): boolean => {
  const keys = Object.keys(a);
  return keys.length === Object.keys(b).length && keys.every((k) => a[k] === b[k]);
};

function Section({ id, title, hint, children }: { id: string; title: string; hint?: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="flex flex-col gap-3 border-t border-line pt-6">
      <div>
        <h2 id={id} className="font-serif text-h4 font-semibold">
          {title}
        </h2>
        {hint ? <p className="text-small text-bark">{hint}</p> : null}
      </div>
      {children}
    </section>
  );
}

export function TuneEditor({ saved }: { saved: TuneView | null }) {
  const router = useRouter();
  const client = useQueryClient();
  const [abc, setAbc] = useState(saved?.abc ?? NEW_TUNE_TEMPLATE);
  const [plan, setPlan] = useState<StagePlan>(saved?.stagePlan ?? DEFAULT_PLAN);
  const [accepted, setAccepted] = useState<string[]>(saved?.acceptedSwaps ?? []);
  const [turned, setTurned] = useState<Record<string, Voice>>(saved?.turnedBars ?? {});
  const [savedNote, setSavedNote] = useState<string | null>(null);
  const planOrNull = useMemo(() => (samePlan(plan, DEFAULT_PLAN) ? null : plan), [plan]);
  const live = useLiveCheck(abc, planOrNull, accepted, turned);

  const tune = live.check?.ok ? live.check.value : live.fallback?.ok ? live.fallback.value : null;
  const problems =
    live.check && !live.check.ok
      ? live.check.planReasons.length && live.fallback && !live.fallback.ok
        ? live.fallback.problems
        : live.check.problems
      : [];
  const notes =
    live.check?.ok || !live.check?.planReasons.length ? (live.check?.notes ?? []) : (live.fallback?.notes ?? []);
  const planReasons = live.check && !live.check.ok ? live.check.planReasons : [];
  const sourceDirty = saved ? abc !== saved.abc : true;
  const dirty =
    sourceDirty ||
    !saved ||
    !samePlan(plan, saved.stagePlan ?? DEFAULT_PLAN) ||
    accepted.join() !== saved.acceptedSwaps.join() ||
    !sameTurns(turned, saved.turnedBars);

  const save = useMutation({
    mutationFn: () =>
      teachFetch<SavedBody>(saved ? `/api/teach/tunes/${saved.id}` : "/api/teach/tunes", {
        method: saved ? "PUT" : "POST",
        body: { abc, stagePlan: planOrNull, acceptedSwaps: accepted, turnedBars: turned },
      }),
    onSuccess: async (body) => {
      const notes = [`“${body.title}” is saved.`];
      if (body.droppedSwaps.length)
        notes.push(`Swaps no longer offered by the phrase map were let go: ${body.droppedSwaps.join(", ")}.`);
      if (body.flaggedStages.length)
        notes.push(
          `Hand-written stage${body.flaggedStages.length === 1 ? "" : "s"} ${body.flaggedStages.join(", ")} now carry a flag: check them.`,
        );
      setSavedNote(notes.join(" "));
      setAccepted((a) => a.filter((id) => !body.droppedSwaps.includes(id)));
      if (!saved) router.replace(`/teach/tunes/${body.tuneId}`);
      await client.invalidateQueries({ queryKey: ["teach-tune", body.tuneId] });
      await client.invalidateQueries({ queryKey: ["teach-tunes"] });
    },
    onMutate: () => setSavedNote(null),
  });

  return (
    <div className="flex flex-col gap-6">
      <header className="flex flex-col gap-4">
        <div className="flex flex-wrap items-end justify-between gap-4">
          <div>
            <p className="text-small font-semibold tracking-widest text-cedar uppercase">
              {saved ? "Tune editor" : "New tune"}
            </p>
            <h1 className="text-h2 font-semibold">{tune?.title || saved?.title || "Untitled tune"}</h1>
          </div>
          <SaveBar
            onSave={() => save.mutate()}
            saving={save.isPending}
            dirty={dirty}
            isNew={!saved}
            error={save.error}
            savedNote={savedNote}
          />
        </div>
        <TuneFacts
          title={tune?.title ?? ""}
          tuneType={tune?.tuneType ?? "other"}
          keyName={tune?.key ?? ""}
          meter={tune?.meter ?? ""}
        />
        {saved?.courses.length ? (
          <p className="text-small text-bark">On the ladder of: {saved.courses.map((c) => c.title).join(", ")}.</p>
        ) : null}
      </header>
      <div className="grid gap-6 lg:grid-cols-2">
        <AbcSource value={abc} onChange={setAbc} problems={problems} notes={notes} checking={live.checking} />
        <div className="flex flex-col gap-2">
          <p className="font-semibold">Full setting, as written</p>
          <Notation abc={abc} phraseMap={tune?.analysis.phraseMap ?? null} label="The tune as written" />
        </div>
      </div>
      <Section
        id="plan-heading"
        title="Stage plan"
        hint="Tick the stage at which each kind of embellishment comes back. Stage 1 is the skeleton."
      >
        <PlanEditor
          plan={plan}
          onChange={setPlan}
          onReset={() => setPlan(DEFAULT_PLAN)}
          reasons={planReasons}
          isDefault={planOrNull === null}
        />
        {tune ? <PlanFit stages={tune.stages} isDefault={planOrNull === null} /> : null}
      </Section>
      {tune ? (
        <>
          <Section
            id="stages-heading"
            title="Stages side by side"
            hint="From the skeleton to the full setting. A stage written by hand is kept as written."
          >
            <StagePreviews
              stages={tune.stages}
              doubleStops={tune.analysis.doubleStops}
              turned={turned}
              onTurn={(bar, voice) =>
                setTurned((t) => {
                  const next = { ...t };
                  if (voice) next[String(bar)] = voice;
                  else delete next[String(bar)];
                  return next;
                })
              }
              saved={saved?.stages ?? []}
              tuneId={saved?.id ?? null}
              dirty={dirty}
              sourceDirty={sourceDirty && Boolean(saved)}
            />
          </Section>
          <Section
            id="phrases-heading"
            title="Phrase map"
            hint="Compared on the skeleton: which phrases repeat exactly, which nearly, and what is shared across parts."
          >
            <PhrasePanel
              map={tune.analysis.phraseMap}
              acceptedLoad={learningLoadWith(tune.analysis.phraseMap, accepted)}
              acceptedCount={accepted.length}
            />
          </Section>
          <Section
            id="swaps-heading"
            title="Twin swaps for the learning version"
            hint="While learning, a near twin can be played exactly like its twin. Accepted swaps are saved with the tune."
          >
            <SwapPanel abc={abc} map={tune.analysis.phraseMap} accepted={accepted} onChange={setAccepted} />
          </Section>
        </>
      ) : null}
    </div>
  );
}
