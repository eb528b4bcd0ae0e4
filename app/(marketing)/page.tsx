import Link from "next/link";
import { Card, CardTitle } from "@/components/ui/card";
import { LinkButton } from "@/components/ui/link-button";
import { TuneLayers } from "./_home/tune-layers";

const WAYS = [
  {
    title: "The melody first, then one layer at a time",
    body:
      "Every tune starts as its core melody: no slurs, no rolls, no fills, just the notes that carry it. " +
      "Once that is in your ear and under your fingers, the embellishments come back one kind at a time: " +
      "bowing, then ornaments and fills, then double stops and dynamics.",
  },
  {
    title: "See how a tune is built",
    body:
      "Each tune is split into its phrases, and Rosinwood shows which of them repeat exactly and which " +
      "repeat nearly. There is usually far less to learn than the page suggests, and while you are " +
      "learning, a near repeat can be played just like its twin.",
  },
  {
    title: "Graded tune ladders",
    body:
      "Courses are ladders of tunes, grade by grade, from a first tune to repertoire you can bring to a " +
      "session. Each rung opens when the one before it is learned, so the next step is always clear.",
  },
  {
    title: "A teacher who listens",
    body:
      "When a version feels learned, record yourself and check it in. Your teacher listens, writes back, " +
      "and opens the next version of the tune when you are ready, or suggests another week with this one.",
  },
];

export default function HomePage() {
  return (
    <>
      <section aria-labelledby="home-title" className="border-b border-line bg-sawdust">
        <div className="mx-auto grid max-w-shell items-center gap-10 px-4 py-12 sm:px-6 sm:py-16 lg:grid-cols-[1.1fr_1fr]">
          <div className="flex flex-col gap-5">
            <p className="text-small font-semibold tracking-widest text-cedar uppercase">Online fiddle school</p>
            <h1 id="home-title" className="text-h1 font-semibold">
              Learn fiddle tunes from the melody up
            </h1>
            <p className="max-w-prose text-lead text-bark">
              Rosinwood teaches reels, jigs, hornpipes, polkas and waltzes to adult beginners and improvers, step by
              step: the bare tune first, the decoration after, and a teacher listening along the way.
            </p>
            <div className="flex flex-wrap gap-3">
              <LinkButton href="/sign-up" size="lg">
                Join Rosinwood
              </LinkButton>
              <LinkButton href="/catalogue" size="lg" variant="secondary">
                Browse the catalogue
              </LinkButton>
            </div>
            <p className="text-small text-bark">A taster tune is free to try before you choose a membership.</p>
          </div>
          <TuneLayers />
        </div>
      </section>

      <section aria-labelledby="ways-title" className="mx-auto w-full max-w-shell px-4 py-14 sm:px-6">
        <h2 id="ways-title" className="text-h2 font-semibold">
          How Rosinwood teaches
        </h2>
        <ul className="mt-8 grid gap-5 md:grid-cols-2">
          {WAYS.map((way) => (
            <Card as="li" key={way.title}>
              <CardTitle>{way.title}</CardTitle>
              <p className="text-bark">{way.body}</p>
            </Card>
          ))}
        </ul>
      </section>

      <section aria-labelledby="join-title" className="border-t border-line bg-sawdust">
        <div className="mx-auto grid max-w-shell gap-8 px-4 py-14 sm:px-6 md:grid-cols-2">
          <div className="flex flex-col gap-4">
            <h2 id="join-title" className="text-h2 font-semibold">
              Membership, monthly or yearly
            </h2>
            <p className="max-w-prose text-bark">
              A membership opens every course in the catalogue, not just the taster tunes. Pay by the month or by the
              year, and manage it from your billing page.
            </p>
            <p>
              <Link href="/catalogue">See what the catalogue holds</Link>
            </p>
          </div>
          <Card tone="plain" className="flex flex-col gap-4 self-start">
            <CardTitle level={3} className="mb-0">
              Start with a free taster tune
            </CardTitle>
            <p className="text-bark">
              Open a taster tune from the catalogue, learn its core melody and see how its phrases fit together, then
              decide whether Rosinwood suits the way you like to learn.
            </p>
            <div className="flex flex-wrap gap-3">
              <LinkButton href="/sign-up">Join Rosinwood</LinkButton>
              <LinkButton href="/catalogue" variant="secondary">
                Browse the catalogue
              </LinkButton>
            </div>
          </Card>
        </div>
      </section>
    </>
  );
}
