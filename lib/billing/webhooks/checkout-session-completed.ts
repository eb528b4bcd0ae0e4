import { customerOf, setCustomer, userByCustomer } from "@/db/queries/billing";
import { eq } from "drizzle-orm";
import { insertEnrolment } from "@/db/queries/enrolments";
import { courses } from "@/db/schema";
import { checkoutSessionObject } from "../objects";
import { ensureSubscription } from "../sync";
import type { Handler } from "./types";

// A paid checkout: the subscription row (when its own events are still on the way) and the
// enrolment in the course the member chose on the way in. Setup sessions (a new card) need nothing
// here: the open invoice they pay arrives as invoice.paid.
export const checkoutSessionCompleted: Handler = async (db, event, stripe) => {
  const s = checkoutSessionObject.parse(event.data.object);
  if (s.mode !== "subscription" || !s.customer) return;
  const meta = s.metadata ?? {};
  const userId = (await userByCustomer(db, s.customer))?.id ?? meta.userId;
  if (!userId) return;
  if (!(await customerOf(db, userId))) await setCustomer(db, userId, s.customer);
  if (s.subscription) await ensureSubscription(db, stripe, s.subscription, event.created);
  if (meta.courseId && /^[0-9a-f-]{36}$/i.test(meta.courseId)) {
    const [course] = await db.select({ id: courses.id }).from(courses).where(eq(courses.id, meta.courseId)).limit(1);
    if (course) await db.transaction((tx) => insertEnrolment(tx, { userId, courseId: course.id }));
  }
};
