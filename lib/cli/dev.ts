/** `npm run dev`: fakes, migrations and demo data, then `next dev` with hot reload. */
import { spawn } from "node:child_process";
import { appEnv, nextBin, startFakes, ROOT } from "./local-stack";
import { seedDemo } from "./seed-demo";

async function main() {
  const env = appEnv();
  Object.assign(process.env, { NEXTAUTH_URL: env.NEXTAUTH_URL, DEV_MAILBOX_URL: env.DEV_MAILBOX_URL });
  const fakes = await startFakes(env);
  await seedDemo();
  const app = spawn(process.execPath, [nextBin(), "dev", "-H", "127.0.0.1", "-p", env.PORT!], { cwd: ROOT, env, stdio: "inherit" });
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
  process.stderr.write(`npm run dev failed: ${err instanceof Error ? err.message : err}\n`);
  process.exit(1);
});
