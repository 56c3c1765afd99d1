/**
 * Browser tests: Debian's Chromium against a fresh, isolated stack on 127.0.0.1:3100 (moved by E2E_PORT_OFFSET)
 * (tests/e2e/serve.ts). Needs a production build (`npx next build`) first.
 */
import { defineConfig } from "@playwright/test";
import { E2E_BASE_URL } from "./tests/e2e/support/ports";

export default defineConfig({
  testDir: "tests/e2e",
  testMatch: "*.spec.ts",
  outputDir: "test-results",
  workers: 1,
  fullyParallel: false,
  retries: 0,
  timeout: 45_000,
  expect: { timeout: 10_000 },
  reporter: "list",
  use: {
    baseURL: E2E_BASE_URL,
    screenshot: "only-on-failure",
    trace: "off",
    video: "off",
  },
  projects: [
    {
      name: "chromium",
      use: {
        browserName: "chromium",
        launchOptions: {
          executablePath: "/usr/bin/chromium",
          args: [
            "--no-sandbox",
            "--disable-gpu",
            "--disable-quic",
            "--no-first-run",
            "--disable-background-networking",
            "--disable-component-update",
            "--disable-sync",
          ],
        },
      },
    },
  ],
  webServer: {
    command: "npx tsx --conditions=react-server tests/e2e/serve.ts",
    url: `${E2E_BASE_URL}/api/health`,
    reuseExistingServer: false,
    // Seeding the demo (readouts, a fit and a verification run) takes ~30 s on a quiet 2-core machine, far more under load.
    timeout: 300_000,
    stdout: "ignore",
    stderr: "pipe",
  },
});
