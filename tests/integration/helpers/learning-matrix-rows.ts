// Issue 6's learning rows of the authorization matrix; spread into ROWS in tests/integration/authorization-matrix.test.ts.
export function learningRows() {
  return [];
}
