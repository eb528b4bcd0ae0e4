// A Pages Router API route, not an App Router route handler, for its lower cost a request: see
// lib/http/pages-api.ts. GET is the route the authorization matrix calls.
import { countMemberships } from "@/db/queries/admin-members";
import { membershipsQuery } from "@/lib/billing/admin/params";
import { countRoute } from "@/lib/billing/admin/table-routes";
import { pagesApi } from "@/lib/http/pages-api";

/** How many rows of the admin's memberships table the filters match. */
export const GET = countRoute(membershipsQuery, countMemberships);
export const config = { api: { bodyParser: false } };
export default pagesApi({ GET });
