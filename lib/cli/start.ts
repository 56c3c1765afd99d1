/**
 * `npm start`: the whole app on one machine with the embedded defaults — fake storage and mail,
 * SQLite under storage/data, migrations, demo data on first start, a production build, next start.
 */
import { spawn } from "node:child_process";
import { appEnv, buildIsStale, nextBin, run, startFakes, ROOT } from "./local-stack";
import { seedDemo } from "./seed-demo";

async function main() {
  const env = appEnv();
  Object.assign(process.env, { NEXTAUTH_URL: env.NEXTAUTH_URL, DEV_MAILBOX_URL: env.DEV_MAILBOX_URL });
  const fakes = await startFakes(env);
  const seeded = await seedDemo();
  process.stdout.write(seeded ? "demo data: seeded the demo lab (see README for the accounts)\n" : "demo data: already present\n");
  if (buildIsStale()) {
    process.stdout.write("building the app (next build)…\n");
    await run(process.execPath, [nextBin(), "build"], env);
  }
  const app = spawn(process.execPath, [nextBin(), "start", "-H", "127.0.0.1", "-p", env.PORT!], { cwd: ROOT, env, stdio: "inherit" });
  process.stdout.write(`\nMorphokin is starting on ${env.NEXTAUTH_URL}  (stop with Ctrl+C)\n\n`);
  const stop = () => {
    app.kill("SIGTERM");
    fakes?.kill("SIGTERM");
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
  app.once("exit", (code) => {
    fakes?.kill("SIGTERM");
    process.exit(code ?? 0);
  });
}

main().catch((err) => {
  process.stderr.write(`npm start failed: ${err instanceof Error ? err.message : err}\n`);
  process.exit(1);
});
