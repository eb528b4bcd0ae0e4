import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { catalogueCourses } from "@/lib/catalogue/catalogue";
import { json } from "@/lib/catalogue/respond";

export const dynamic = "force-dynamic";

/** The public catalogue: published courses with their grades and tune titles. */
export const GET = guardRoute({ action: "catalogue:view", input: z.object({}) }, async () =>
  json({ courses: await catalogueCourses(db()) }),
);
