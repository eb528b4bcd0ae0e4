"use client";
// Memory practice: cover the phrases one at a time, in playing order, while the student plays on
// from memory; "Show all" brings the music back.
import type { PhraseMap } from "@/lib/abc/phrase-types";
import { Button } from "@/components/ui/button";
import { cx } from "@/components/ui/cx";
import { phraseList } from "./phrase-words";

export interface MemoryModeProps {
  phraseMap: PhraseMap;
  /** Ids of the phrases now hidden (pass the same list to <Notation hiddenPhrases>). */
  hidden: readonly string[];
  onChange: (hidden: string[]) => void;
  className?: string;
}

export function MemoryMode({ phraseMap, hidden, onChange, className }: MemoryModeProps) {
  const order = phraseList(phraseMap).map((p) => p.id);
  const next = order.find((id) => !hidden.includes(id));
  const count = order.filter((id) => hidden.includes(id)).length;
  return (
    <section aria-label="Play from memory" className={cx("flex flex-wrap items-center gap-3", className)}>
      <Button variant="secondary" disabled={!next} onClick={() => next && onChange([...hidden, next])}>
        {next ? `Hide next phrase (${next})` : "Every phrase is hidden"}
      </Button>
      <Button variant="quiet" disabled={count === 0} onClick={() => onChange([])}>
        Show all
      </Button>
      <p role="status" className="text-small text-bark" data-hidden-count={count}>
        {count === 0
          ? "All the music is showing."
          : `${count} of ${order.length} phrases hidden: play them from memory.`}
      </p>
    </section>
  );
}
