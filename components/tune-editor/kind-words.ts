// Plain words for the engine's embellishment kinds (PRODUCT.md §3), for the stage plan and stages.
import type { Kind } from "@/lib/abc/types";

export const KIND_WORDS: Record<Kind, string> = {
  bowing: "Bowing (slurs, bow directions)",
  ornaments: "Ornaments (rolls, trills, turns, grace notes)",
  slides: "Slides",
  fills: "Rhythmic fills (sixteenth pairs, triplets)",
  doubleStops: "Double stops",
  dynamics: "Dynamics (p, f, hairpins)",
  articulation: "Articulation (staccato, accents)",
  fingerings: "Fingerings",
  marks: "Other marks (segno, coda …)",
};

export const KIND_SHORT: Record<Kind, string> = {
  bowing: "bowing",
  ornaments: "ornaments",
  slides: "slides",
  fills: "fills",
  doubleStops: "double stops",
  dynamics: "dynamics",
  articulation: "articulation",
  fingerings: "fingerings",
  marks: "other marks",
};
