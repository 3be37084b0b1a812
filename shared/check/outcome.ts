// What every check (a study file's expectation, a baseline comparison) reports.
export interface CheckOutcome {
  /** Short, stable name: a JUnit test case name. */
  name: string;
  passed: boolean;
  /** One line when passed; the details of the failure otherwise. */
  message: string;
  expected: number | null;
  actual: number | null;
  /** |actual − expected| / |expected|; null when either is missing or expected is 0. */
  relError: number | null;
}
