import { defineConfig } from "vitest/config";

export default defineConfig({
  // server-only throws outside Next's react-server condition; the tests run lib/server in plain Node.
  resolve: {
    alias: { "@": import.meta.dirname, "server-only": `${import.meta.dirname}/node_modules/server-only/empty.js` },
  },
  test: {
    include: ["tests/**/*.test.ts"],
    setupFiles: ["tests/support/no-session.ts", "tests/support/register-matchers.ts"],
    environment: "node",
    pool: "forks",
    testTimeout: 30_000,
  },
});
