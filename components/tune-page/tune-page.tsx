"use client";
// The tune page (issue 5 item 6): stage selector with locked stages visible but closed, the music
// with its phrase map, the player, memory mode, margin notes, comparison with another setting and
// a print view. Used for students (/learn/tunes) and for the public taster (/catalogue/tunes).
import Link from "next/link";
import { lazy, Suspense, useEffect, useState } from "react";
import { useQueryLinks } from "@/components/ui/query-links";
import { ApiError, errorWords } from "@/lib/catalogue/fetch-json";
import type { TuneJson } from "@/lib/catalogue/api-types";
import { useStage, useTune } from "./use-tune";

// The music, the notes and the comparison load after the page's first paint: the public taster
// page stays within its first-load budget (issue 5: 120 kB gzipped) and abcjs loads later still.
// React's own lazy(), not next/dynamic, which would add its own 2 kB to the first load.
const loadMusic = () => import("./stage-music");
const StageMusic = lazy(loadMusic);
const StageSelector = lazy(() =>
  import("@/components/notation/stage-selector").then((m) => ({ default: m.StageSelector })),
);
const MarginNotes = lazy(() => import("./margin-notes").then((m) => ({ default: m.MarginNotes })));
const CompareSettings = lazy(() => import("./compare-settings").then((m) => ({ default: m.CompareSettings })));
const ClimbPanel = lazy(() => import("./climb-panel").then((m) => ({ default: m.ClimbPanel })));
const waiting = (what: string) => <p role="status" className="text-bark">{`Getting ${what} ready…`}</p>;

export interface TunePageProps {
  tuneId: string;
  area: "learn" | "public";
  /** Margin notes need a signed-in writer. */
  notes: boolean;
}

/** The stage asked for in the address (?stage=3) if it is open, else the furthest open one, where the student is working. */
function shownStage(t: TuneJson, asked: string | null): number {
  const open = t.stages.filter((s) => s.allowed).map((s) => s.index);
  const wanted = Number(asked);
  return open.includes(wanted) ? wanted : Math.max(1, ...open);
}

export function TunePage({ tuneId, area, notes }: TunePageProps) {
  const tune = useTune(tuneId);
  // The stage shown is in the address, so a reload, a shared link and Back show the same music.
  const { params, go } = useQueryLinks();
  const stage = tune.data ? shownStage(tune.data, params.get("stage")) : null;
  const [bar, setBar] = useState<number | null>(null);
  const music = useStage(tuneId, stage);
  useEffect(() => void loadMusic(), []); // fetch the music's code while the tune's data is on its way

  if (tune.isPending)
    return (
      <p role="status" className="text-bark">
        Loading the tune…
      </p>
    );
  if (tune.isError) {
    return (
      // Plain markup rather than <Alert>: every byte counts on the public taster page's first load.
      <div role="alert" className="rounded-knot border-l-4 border-cedar bg-rosin-tint px-4 py-3">
        <p className="font-semibold text-cedar">
          {tune.error instanceof ApiError && tune.error.status === 404
            ? "We couldn't find this tune"
            : "This tune is not open to you yet"}
        </p>
        <p className="mt-1">{errorWords(tune.error)}</p>
        <p className="mt-2">
          <Link href={area === "learn" ? "/learn/courses" : "/catalogue"}>
            {area === "learn" ? "Back to my courses" : "Back to the catalogue"}
          </Link>
        </p>
      </div>
    );
  }
  const t = tune.data;
  const printBase = area === "learn" ? `/learn/tunes/${tuneId}/print` : `/catalogue/tunes/${tuneId}/print`;
  return (
    <div className="flex flex-col gap-6">
      <header className="flex flex-col gap-1">
        {t.rung ? (
          <p className="text-small text-bark">
            {area === "learn" ? (
              <Link href={`/learn/courses/${t.rung.courseId}`}>{t.rung.courseTitle}</Link>
            ) : (
              t.rung.courseTitle
            )}
            {` · ${t.rung.gradeTitle}, rung ${t.rung.position}${t.rung.isTaster ? " · free taster" : ""}`}
          </p>
        ) : null}
        <h1 className="text-h2 font-semibold">{t.tune.title}</h1>
        <p className="text-bark">{t.tune.words}</p>
      </header>
      <Suspense fallback={waiting("the stages")}>
        <StageSelector
          stages={t.stages.map((s) => ({ index: s.index, name: s.name, locked: !s.allowed, reason: s.reason }))}
          value={stage ?? 1}
          // In place: arrowing through the stages is one step, not one history entry per stage.
          onChange={(index) => go({ stage: String(index) }, { replace: true })}
        />
      </Suspense>
      {music.isPending || music.isPlaceholderData ? (
        <p role="status" className="text-bark">
          Loading the music of this stage…
        </p>
      ) : null}
      {music.isError ? (
        <p role="alert" className="font-semibold text-berry">
          {errorWords(music.error)}
        </p>
      ) : null}
      {music.data ? (
        <Suspense fallback={waiting("the music")}>
          <StageMusic
            stage={music.data}
            title={t.tune.title}
            phraseMap={t.phraseMap}
            printHref={`${printBase}?stage=${music.data.index}`}
            onBarClick={notes ? setBar : undefined}
          />
        </Suspense>
      ) : null}
      {area === "learn" ? (
        <Suspense fallback={waiting("your check-ins")}>
          <ClimbPanel tuneId={tuneId} onOpened={(index) => go({ stage: String(index) })} />
        </Suspense>
      ) : null}
      <div className="grid gap-6 lg:grid-cols-2">
        {notes ? (
          <Suspense fallback={waiting("your notes")}>
            <MarginNotes tuneId={tuneId} bar={bar} onBarChange={setBar} />
          </Suspense>
        ) : (
          <p className="self-start rounded-knot border border-line bg-paper p-4 text-bark">
            <Link href={`/sign-in?next=${encodeURIComponent(`/catalogue/tunes/${tuneId}`)}`}>Sign in</Link> to pin your
            own margin notes to bars of this tune.
          </p>
        )}
        {music.data ? (
          <Suspense fallback={null}>
            <CompareSettings abc={music.data.abc} stageName={`stage ${music.data.index}`} />
          </Suspense>
        ) : null}
      </div>
    </div>
  );
}
