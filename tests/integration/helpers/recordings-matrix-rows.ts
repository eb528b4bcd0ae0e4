// Issue 6's recordings rows of the authorization matrix; spread into ROWS in tests/integration/authorization-matrix.test.ts.
export function recordingsRows() {
  return [];
}
