// The admin tables' rows as JSON carries them (dates as ISO strings).
import type { EnrolmentAdminRow, MembershipAdminRow } from "@/db/queries/admin-members";
import type { PaymentRow } from "@/db/queries/admin-payments";

type Jsonish<T> = { [K in keyof T]: T[K] extends Date ? string : T[K] extends Date | null ? string | null : T[K] };

export type PaymentJson = Jsonish<PaymentRow>;
export type MembershipJson = Jsonish<MembershipAdminRow>;
export type EnrolmentJson = Jsonish<EnrolmentAdminRow>;
export type Choice = { id: string; name: string };
