import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { withdrawCheckIn } from "@/lib/teaching/check-in";
import { personOf, privateJson } from "@/lib/teaching/learn-respond";

export const dynamic = "force-dynamic";

/** Withdraws one's own check-in before review; the stage opens again. Reviewed already: 409; someone else's: 404. */
export const DELETE = guardRoute(
  { action: "checkin:create", input: z.object({ checkInId: z.string().min(1).max(100) }) },
  async (ctx, input) => privateJson({ checkIn: await withdrawCheckIn(db(), personOf(ctx), input.checkInId) }),
);
