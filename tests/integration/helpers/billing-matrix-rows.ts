// Issue 7's rows of the authorization matrix (plans, checkout, billing, webhook, admin tables, refunds);
// spread into ROWS in tests/integration/authorization-matrix.test.ts.
export function billingRows() {
  return [];
}
