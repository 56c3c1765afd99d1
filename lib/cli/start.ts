/**
 * `npm start`: the whole app on one machine with the embedded defaults — fake storage and mail,
 * SQLite under storage/data, migrations, demo data on first start, a production build, next start.
 */
import { appEnv, buildIsStale, nextBin, run, serveNext, startFakes } from "./local-stack";
import { seedDemo } from "./seed-demo";

async function main() {
  const env = appEnv();
  Object.assign(process.env, {
    NEXTAUTH_URL: env.NEXTAUTH_URL,
    DEV_MAILBOX_URL: env.DEV_MAILBOX_URL,
    MORPHOKIN_DEV_MAILBOX: env.MORPHOKIN_DEV_MAILBOX,
  });
  const fakes = await startFakes(env);
  const seeded = await seedDemo();
  process.stdout.write(
    seeded ? "demo data: seeded the demo lab (see README for the accounts)\n" : "demo data: already present\n",
  );
  if (buildIsStale()) {
    process.stdout.write("building the app (next build)…\n");
    await run(process.execPath, [nextBin(), "build"], env);
  }
  serveNext("start", env, fakes);
  process.stdout.write(`\nMorphokin is starting on ${env.NEXTAUTH_URL}  (stop with Ctrl+C)\n\n`);
}

main().catch((err) => {
  process.stderr.write(`npm start failed: ${err instanceof Error ? err.message : err}\n`);
  process.exit(1);
});
