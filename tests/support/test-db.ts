/** Which database this test process runs on: MORPHOKIN_TEST_DB=postgres (vitest.config.mts), else SQLite. */
export function describeTestDialect(): "sqlite" | "postgres" {
  return process.env.MORPHOKIN_TEST_DB === "postgres" ? "postgres" : "sqlite";
}
