import { countEnrolments } from "@/db/queries/admin-members";
import { enrolmentsQuery } from "@/lib/billing/admin/params";
import { countRoute } from "@/lib/billing/admin/table-routes";

/** How many rows of the admin's enrolments table the filters match. */
export const GET = countRoute(enrolmentsQuery, countEnrolments);
