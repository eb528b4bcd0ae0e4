import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { enrolmentsCsv } from "@/lib/billing/admin/exports";
import { enrolmentsQuery, parseQuery, rawQuery } from "@/lib/billing/admin/params";

export const dynamic = "force-dynamic";

/** Every enrolment row matching the table's filters, in its order, as streamed CSV (RFC 4180). */
export const GET = guardRoute({ action: "money:view", input: rawQuery }, async (_ctx, raw) =>
  enrolmentsCsv(db(), parseQuery(enrolmentsQuery, raw)),
);
