import { z } from "zod";
import { guardRoute } from "@/lib/auth/guard";
import { signOut } from "@/lib/auth/sign-in";

export const dynamic = "force-dynamic";

/** The header's plain sign-out form posts here; a stale or missing session still ends on the home page. */
export const POST = guardRoute({ action: "account:sign-out", input: z.object({}), from: "query" }, async (ctx) => {
  await signOut(ctx);
  return new Response(null, { status: 303, headers: { location: "/" } });
});
