// "billing-admin"'s rows of the authorization matrix (admin tables, refunds, revenue); spread into
// billingRows() in tests/integration/helpers/billing-matrix-rows.ts.
export function billingAdminRows() {
  return [];
}
