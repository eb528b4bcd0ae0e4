// What the ladder page offers a student beside the taster: start this course (a member in good
// standing without an enrolment), or the way to a membership. Server component; the button is client.
import { db } from "@/db/client";
import { LinkButton } from "@/components/ui/link-button";
import { getCurrentUser } from "@/lib/auth/current-user";
import { startCourseOffer } from "@/lib/billing/enrol";
import { StartCourseButton } from "./start-course-button";

export async function StartCourse({ courseId }: { courseId: string }) {
  const user = await getCurrentUser();
  if (!user) return null;
  const offer = await startCourseOffer(db(), user, courseId);
  if (!offer) return null;
  if (offer.kind === "join") {
    return (
      <div className="mb-4">
        <LinkButton href={offer.href} variant="secondary">
          {offer.label}
        </LinkButton>
      </div>
    );
  }
  return <StartCourseButton courseId={offer.courseId} title={offer.title} />;
}
