import { listMemberships } from "@/db/queries/admin-members";
import { membershipsQuery } from "@/lib/billing/admin/params";
import { pageRoute } from "@/lib/billing/admin/table-routes";

/** One page of the admin's memberships table, sorted and filtered on the server (its total: ./count). */
export const GET = pageRoute(membershipsQuery, listMemberships);
