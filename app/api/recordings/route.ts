import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { uploadRequest } from "@/lib/storage/inputs";
import { startUpload } from "@/lib/storage/recordings";
import { NO_STORE, signedIn, withStorage } from "@/lib/storage/respond";

export const dynamic = "force-dynamic";

/** A presigned PUT for a check-in recording of one's own assignment; the bytes go straight to storage. */
export const POST = guardRoute({ action: "recording:upload", input: uploadRequest }, async (ctx, input) => {
  const me = signedIn(ctx.user);
  const ticket = await withStorage(() => startUpload(db(), me, input));
  return Response.json(ticket, { status: 201, headers: NO_STORE });
});
