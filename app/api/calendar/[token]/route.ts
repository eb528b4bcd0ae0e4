import { db } from "@/db/client";
import { UNEXPECTED_FAILURE } from "@/lib/auth/errors";
import { calendarFeed } from "@/lib/calendar/feed";

export const dynamic = "force-dynamic";

// A calendar program fetches this, not a signed-in person: it sends no cookie, so the unguessable
// token in the address is the whole authorisation (like the Stripe webhook's signature). That is why
// this is outside guardRoute; the matrix rows show everyone gets the feed with a live token and 404
// without one. An unknown token and a revoked one answer alike, so neither is distinguishable.
export async function GET(_req: Request, args: { params: Promise<{ token: string }> }): Promise<Response> {
  const { token } = await args.params;
  try {
    const body = await calendarFeed(db(), token);
    if (body === null)
      return Response.json(
        { error: "There is no calendar at this address." },
        { status: 404, headers: { "cache-control": "no-store" } },
      );
    return new Response(body, {
      headers: {
        // RFC 5545 §8.1: the text/calendar media type.
        "content-type": "text/calendar; charset=utf-8",
        "content-disposition": 'inline; filename="rosinwood-due-dates.ics"',
        // Private to its owner: no shared cache keeps it (RFC 9111 §5.2.2.7), and no search engine indexes it.
        "cache-control": "private, no-store",
        "x-robots-tag": "noindex",
        "referrer-policy": "no-referrer",
      },
    });
  } catch (error) {
    console.error(error);
    return Response.json({ error: UNEXPECTED_FAILURE }, { status: 500, headers: { "cache-control": "no-store" } });
  }
}
