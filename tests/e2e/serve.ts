/**
 * The browser tests' own stack: a fresh data folder, the fakes on their own ports, the demo data,
 * then `next start` on 127.0.0.1:3100. Playwright starts this file as its web server and stops
 * it (with its whole process group) when the run ends. It never builds: `npm run test:e2e`
 * expects `next build` to have run.
 */
import { existsSync, rmSync } from "node:fs";
import net from "node:net";
import path from "node:path";
import { E2E_BASE_URL, E2E_MAILBOX_URL, E2E_PORTS } from "./support/ports";

const ROOT = path.resolve(import.meta.dirname, "../..");

export const E2E_ENV = {
  MORPHOKIN_DATA_DIR: path.join(ROOT, "storage/data-e2e"),
  PORT: String(E2E_PORTS.app),
  NEXTAUTH_URL: E2E_BASE_URL,
  S3_ENDPOINT: `http://127.0.0.1:${E2E_PORTS.s3}`,
  SMTP_URL: `smtp://127.0.0.1:${E2E_PORTS.smtp}`,
  DEV_MAILBOX_URL: E2E_MAILBOX_URL,
  // Every browser test signs in from 127.0.0.1, and most as one of a few demo accounts: limits
  // sized for one person would trip (the failed-password lockout is a separate counter and stays).
  RATE_LIMIT_SIGNIN_PER_ADDRESS: "10000",
  RATE_LIMIT_SIGNIN_PER_ACCOUNT: "10000",
  RATE_LIMIT_SIGNIN_LINK_PER_ADDRESS: "10000",
  RATE_LIMIT_SIGNUP_PER_ADDRESS: "10000",
  RATE_LIMIT_INVITATION_PER_ADDRESS: "10000",
};

function fail(message: string): never {
  process.stderr.write(`e2e server: ${message}\n`);
  process.exit(1);
}

function portInUse(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const s = net.connect({ port, host: "127.0.0.1" });
    s.once("connect", () => {
      s.destroy();
      resolve(true);
    });
    s.once("error", () => resolve(false));
  });
}

async function main() {
  if (!existsSync(path.join(ROOT, ".next/BUILD_ID"))) {
    fail("no production build (.next/BUILD_ID is missing); run `npx next build` first, then the tests again");
  }
  // Reusing a leftover stack would mix its data into this run; refuse instead.
  for (const port of Object.values(E2E_PORTS)) {
    if (await portInUse(port))
      fail(`port ${port} on 127.0.0.1 is already in use (a leftover test stack?); stop it and run again`);
  }
  rmSync(E2E_ENV.MORPHOKIN_DATA_DIR, { recursive: true, force: true });
  // readConfig() reads the environment when called, so set it before anything asks.
  Object.assign(process.env, E2E_ENV);

  const { appEnv, serveNext, startFakes } = await import("@/lib/cli/local-stack");
  const { seedDemo } = await import("@/lib/cli/seed-demo");
  const { services } = await import("@/lib/server/services");

  const env = appEnv();
  const fakes = await startFakes(env);
  if (!(await seedDemo())) fail("the fresh e2e database already had users; the data folder was not cleared");
  await services().db.sequelize.close();
  process.stdout.write(`e2e server: demo data seeded, starting next on ${E2E_BASE_URL}\n`);

  serveNext("start", env, fakes);
}

main().catch((err) => fail(err instanceof Error ? (err.stack ?? err.message) : String(err)));
