import { z } from "zod";
import { guardRoute } from "@/lib/auth/guard";
import { safeNext } from "@/lib/auth/links";

export const dynamic = "force-dynamic";

/**
 * Where proxy.ts sends a signed-out visitor: a redirect to sign-in with the return address.
 * It answers with a relative Location, which Next passes on untouched; a redirect made in the
 * proxy itself gets its host rewritten to "localhost" when the app runs on 127.0.0.1.
 */
export const GET = guardRoute(
  { action: "account:sign-in", input: z.object({ next: z.string().max(2000).optional() }) },
  async (_ctx, input) => {
    const next = safeNext(input.next);
    const location = next ? `/sign-in?next=${encodeURIComponent(next)}` : "/sign-in";
    return new Response(null, { status: 307, headers: { location, "cache-control": "no-store" } });
  },
);
