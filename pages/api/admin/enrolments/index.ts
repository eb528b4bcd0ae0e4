// A Pages Router API route, not an App Router route handler, for its lower cost a request: see
// lib/http/pages-api.ts. GET is the route the authorization matrix calls.
import { listEnrolments } from "@/db/queries/admin-members";
import { enrolmentsQuery } from "@/lib/billing/admin/params";
import { pageRoute } from "@/lib/billing/admin/table-routes";
import { pagesApi } from "@/lib/http/pages-api";

/** One page of the admin's enrolments table, sorted and filtered on the server (its total: ./count). */
export const GET = pageRoute(enrolmentsQuery, listEnrolments);
export const config = { api: { bodyParser: false } };
export default pagesApi({ GET });
