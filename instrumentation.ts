/** Runs once when the Next server starts (Next's instrumentation hook). */
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { readConfig } = await import("@/lib/server/config");
  if (readConfig().trustProxyHops === 0) {
    const { dropClientForwardedFor } = await import("@/lib/server/client-address");
    dropClientForwardedFor();
  }
}
