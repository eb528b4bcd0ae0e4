import { z } from "zod";
import { guardRoute } from "@/lib/auth/guard";
import { unauthorized } from "@/lib/auth/errors";
import { personProfile } from "@/lib/auth/people";

export const dynamic = "force-dynamic";

/** One person's profile: yourself, a student on your roster, or anyone for an admin; otherwise 404. */
export const GET = guardRoute(
  { action: "people:view", input: z.object({ id: z.uuid("Unknown person.") }) },
  async (ctx, input) => {
    if (!ctx.user) throw unauthorized();
    return Response.json(await personProfile(ctx.user, input.id), { headers: { "cache-control": "no-store" } });
  },
);
