// The print view of one open stage (server side): a locked stage shows why instead of music, an
// unknown tune or stage is "not found".
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/db/client";
import { PrintStage } from "@/components/notation";
import { Alert } from "@/components/ui/alert";
import { HttpError } from "@/lib/auth/errors";
import type { Viewer } from "@/lib/catalogue/access";
import { stageJson } from "@/lib/catalogue/tune";

export async function StagePrint({
  viewer,
  tuneId,
  stage,
  backHref,
}: {
  viewer: Viewer;
  tuneId: string;
  stage: string | undefined;
  backHref: string;
}) {
  const index = Number(stage ?? "1");
  if (!Number.isInteger(index) || index < 1 || index > 99) notFound();
  try {
    const s = await stageJson(db(), viewer, tuneId, index);
    return (
      <div className="flex flex-col gap-4">
        <p data-print-hide>
          <Link href={backHref}>Back to the tune page</Link>
        </p>
        <PrintStage abc={s.abc} title={s.title} stageName={`${s.index}. ${s.name}`} />
      </div>
    );
  } catch (e) {
    if (e instanceof HttpError && e.status === 403) {
      return (
        <Alert tone="warning" title="This stage is not open to you yet">
          <p>{e.message}</p>
          <p className="mt-2">
            <Link href={backHref}>Back to the tune page</Link>
          </p>
        </Alert>
      );
    }
    if (e instanceof HttpError && e.status === 404) notFound();
    throw e;
  }
}
