import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { uploadIdInput } from "@/lib/storage/inputs";
import { completeUpload } from "@/lib/storage/recordings";
import { NO_STORE, signedIn, withStorage } from "@/lib/storage/respond";

export const dynamic = "force-dynamic";

/** After the upload: kept when its bytes are audio within 25 MB, otherwise deleted and refused (422). */
export const POST = guardRoute({ action: "recording:upload", input: uploadIdInput }, async (ctx, input) => {
  const me = signedIn(ctx.user);
  const stored = await withStorage(() => completeUpload(db(), me, input.uploadId));
  return Response.json(stored, { headers: NO_STORE });
});
