import { defineConfig } from "vitest/config";

export default defineConfig({
  resolve: { alias: { "@": import.meta.dirname } },
  test: {
    include: ["tests/**/*.test.ts"],
    setupFiles: ["tests/support/no-session.ts", "tests/support/register-matchers.ts"],
    environment: "node",
    pool: "forks",
    testTimeout: 30_000,
  },
});
