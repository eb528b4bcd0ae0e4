import { listPayments } from "@/db/queries/admin-payments";
import { paymentsQuery } from "@/lib/billing/admin/params";
import { pageRoute } from "@/lib/billing/admin/table-routes";

/** One page of the admin's payments table, sorted and filtered on the server (its total: ./count). */
export const GET = pageRoute(paymentsQuery, listPayments);
