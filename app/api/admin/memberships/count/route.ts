import { countMemberships } from "@/db/queries/admin-members";
import { membershipsQuery } from "@/lib/billing/admin/params";
import { countRoute } from "@/lib/billing/admin/table-routes";

/** How many rows of the admin's memberships table the filters match. */
export const GET = countRoute(membershipsQuery, countMemberships);
