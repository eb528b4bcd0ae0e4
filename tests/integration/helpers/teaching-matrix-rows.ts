// Issue 6's rows of the authorization matrix (assignments, check-ins, review, practice log,
// recordings, calendar feed); spread into ROWS in tests/integration/authorization-matrix.test.ts.
export function teachingRows() {
  return [];
}
