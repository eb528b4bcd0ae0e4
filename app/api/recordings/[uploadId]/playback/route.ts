import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { uploadIdInput } from "@/lib/storage/inputs";
import { playbackUrl } from "@/lib/storage/recordings";
import { NO_STORE, signedIn, withStorage } from "@/lib/storage/respond";

export const dynamic = "force-dynamic";

/** A short-lived address to listen: the recording's student, the assignment's teacher or an admin; others 404. */
export const GET = guardRoute({ action: "recording:listen", input: uploadIdInput }, async (ctx, input) => {
  const me = signedIn(ctx.user);
  return Response.json(await withStorage(() => playbackUrl(db(), me, input.uploadId)), { headers: NO_STORE });
});
