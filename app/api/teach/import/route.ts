import { z } from "zod";
import { db } from "@/db/client";
import { unprocessable } from "@/lib/auth/errors";
import { guardRoute } from "@/lib/auth/guard";
import { editorOf } from "@/lib/tunes/access";
import { importTunes, ndjson } from "@/lib/tunes/import";
import { IMPORT_FILE_NAME, readUpload, tunesOfFile } from "@/lib/tunes/import-file";

export const dynamic = "force-dynamic";

/**
 * The file is the request body (its name in ?name=), so the guard reads only the query and the
 * body is read here against the size limit. Limits are answered before any tune is stored; after
 * that the answer is 200 and streams one NDJSON line per tune (lib/tunes/import.ts).
 */
export const POST = guardRoute(
  {
    action: "tune:import",
    input: z.object({ name: z.string().trim().min(1, "Name the file.").max(255) }),
    from: "query",
  },
  async (ctx, input, req) => {
    const me = editorOf(ctx.user);
    if (!IMPORT_FILE_NAME.test(input.name))
      throw unprocessable(`“${input.name}” is not an ABC file: choose a file whose name ends in .abc.`);
    const tunes = tunesOfFile(await readUpload(req));
    return new Response(ndjson(importTunes(db(), me.id, tunes)), {
      headers: {
        "content-type": "application/x-ndjson; charset=utf-8",
        "cache-control": "no-store",
        "x-content-type-options": "nosniff",
      },
    });
  },
);
