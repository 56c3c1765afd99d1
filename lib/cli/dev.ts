/** `npm run dev`: fakes, migrations and demo data, then `next dev` with hot reload. */
import { appEnv, serveNext, startFakes } from "./local-stack";
import { seedDemo } from "./seed-demo";

async function main() {
  const env = appEnv();
  Object.assign(process.env, { NEXTAUTH_URL: env.NEXTAUTH_URL, DEV_MAILBOX_URL: env.DEV_MAILBOX_URL });
  const fakes = await startFakes(env);
  await seedDemo();
  serveNext("dev", env, fakes);
}

main().catch((err) => {
  process.stderr.write(`npm run dev failed: ${err instanceof Error ? err.message : err}\n`);
  process.exit(1);
});
