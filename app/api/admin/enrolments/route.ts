import { listEnrolments } from "@/db/queries/admin-members";
import { enrolmentsQuery } from "@/lib/billing/admin/params";
import { pageRoute } from "@/lib/billing/admin/table-routes";

/** One page of the admin's enrolments table, sorted and filtered on the server (its total: ./count). */
export const GET = pageRoute(enrolmentsQuery, listEnrolments);
