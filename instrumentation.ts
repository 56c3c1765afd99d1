/**
 * Next's start-up hook: `register` runs once per server process before it answers requests
 * (node_modules/next/dist/docs/01-app/03-api-reference/03-file-conventions/instrumentation.md).
 * The start-up tasks use node:fs, sqlite3 and child processes, so only the Node.js runtime runs them.
 */
export async function register() {
  // Next's per-runtime switch, inlined at build time (not configuration): the edge bundle must not
  // import the Node-only configuration and start-up modules below, so it is read here directly.
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { readConfig } = await import("@/lib/server/config");
  if (readConfig().trustProxyHops === 0) {
    // A client may not choose its own address for the rate limits (see lib/server/web/client-address.ts).
    const { dropClientForwardedFor } = await import("@/lib/server/web/client-address");
    dropClientForwardedFor();
  }
  const { runStartupTasks } = await import("./lib/server/startup");
  await runStartupTasks();
}
