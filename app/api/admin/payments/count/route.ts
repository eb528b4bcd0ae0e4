import { countPayments } from "@/db/queries/admin-payments";
import { paymentsQuery } from "@/lib/billing/admin/params";
import { countRoute } from "@/lib/billing/admin/table-routes";

/** How many rows of the admin's payments table the filters match. */
export const GET = countRoute(paymentsQuery, countPayments);
