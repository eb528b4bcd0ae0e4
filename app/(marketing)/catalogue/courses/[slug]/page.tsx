import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/db/client";
import { CourseOffer } from "@/components/catalogue/course-offer";
import { CourseRungs } from "@/components/catalogue/course-rungs";
import { PageContainer } from "@/components/layout/page-container";
import { getCurrentUser } from "@/lib/auth/current-user";
import { coursePage } from "@/lib/catalogue/course-page";
import { PACE_NAME, paceWords } from "@/lib/teaching/climb-words";
import { StartForm } from "./start-form";

export const dynamic = "force-dynamic"; // who is looking decides the offer

type Params = Promise<{ slug: string }>;

export async function generateMetadata({ params }: { params: Params }): Promise<Metadata> {
  const page = await coursePage(db(), await getCurrentUser(), (await params).slug);
  return { title: page ? page.title : "Course not found", description: page?.summary };
}

export default async function CoursePageRoute({ params }: { params: Params }) {
  const [{ slug }, user] = await Promise.all([params, getCurrentUser()]);
  const page = await coursePage(db(), user, slug);
  if (!page) notFound();
  const rungs = page.grades.reduce((n, g) => n + g.rungs.length, 0);
  return (
    <PageContainer className="flex flex-col gap-8">
      <header className="flex flex-col gap-3">
        <p className="text-small font-semibold tracking-widest text-cedar uppercase">
          <Link href="/catalogue">Catalogue</Link> · course
        </p>
        <h1 className="text-h2 font-semibold break-words">{page.title}</h1>
        <p className="text-bark">{`Led by ${page.teacherName} · ${page.grades.length} grades · ${rungs} tunes`}</p>
        <p className="max-w-prose text-lead text-bark">{page.summary}</p>
      </header>
      <CourseOffer page={page} start={page.offer.kind === "start" ? <StartForm courseId={page.id} /> : null} />
      <section aria-labelledby="member-gets" className="flex max-w-prose flex-col gap-2">
        <h2 id="member-gets" className="font-serif text-h3 font-semibold">
          What a member gets
        </h2>
        <ul className="list-disc pl-5 text-bark">
          <li>{`Every rung of this ladder, ${rungs} tunes over ${page.grades.length} grades, each learned stage by stage from its core melody to the full setting.`}</li>
          <li>{`${page.teacherName} follows you on this course. ${PACE_NAME[page.pace]}: ${paceWords(page.pace, page.teacherName)}`}</li>
          <li>Slowed-down playback, a loop of one phrase, memory mode, your own margin notes and a practice log.</li>
          <li>Every other course in the catalogue too, for as long as your membership runs.</li>
        </ul>
      </section>
      <CourseRungs page={page} />
    </PageContainer>
  );
}
