import { configDefaults, defineConfig } from "vitest/config";

export default defineConfig({
  // server-only throws outside Next's react-server condition; the tests run lib/server in plain Node.
  resolve: {
    alias: { "@": import.meta.dirname, "server-only": `${import.meta.dirname}/node_modules/server-only/empty.js` },
  },
  test: {
    setupFiles: ["tests/support/no-session.ts", "tests/support/register-matchers.ts"],
    environment: "node",
    pool: "forks",
    testTimeout: 30_000,
    // A setup hook that times out on a loaded machine goes on in the background after its stack is
    // closed; a generous limit keeps that rare (and services() then refuses instead of opening the default).
    hookTimeout: 60_000,
    // Everything on the embedded SQLite file; the API suite once more on a real PostgreSQL server
    // (tests/support/postgres.ts). One file on one: `npx vitest run --project postgres tests/api/x.test.ts`.
    projects: [
      {
        extends: true,
        test: {
          name: "sqlite",
          include: ["tests/**/*.test.ts"],
          // Files about PostgreSQL only run in the postgres project (no test skips itself in a run).
          exclude: [...configDefaults.exclude, "tests/cli/db-copy.test.ts", "tests/api/db-migrate-together.test.ts"],
          // The run fails if it leaves files in storage/data/ (the developer's own data folder).
          globalSetup: ["tests/support/no-default-data.ts"],
        },
      },
      {
        extends: true,
        test: {
          name: "postgres",
          include: ["tests/api/**/*.test.ts", "tests/cli/db-copy.test.ts"],
          // SQLite's per-table change counts: PostgreSQL has none (it keeps no answers).
          exclude: [...configDefaults.exclude, "tests/api/change-counts.test.ts"],
          env: { MORPHOKIN_TEST_DB: "postgres" },
          globalSetup: ["tests/support/no-default-data.ts", "tests/support/postgres.ts"],
        },
      },
    ],
  },
});
