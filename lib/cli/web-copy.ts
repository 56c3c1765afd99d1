/**
 * One copy of the production web server (web-processes.ts starts WEB_PROCESSES of them): Next's
 * own server through its custom-server API (`next({ dev: false })` and its request handler, Next
 * docs "Custom Server"; the same request handling `next start` sets up), with the front door
 * (front-door.ts) before it. Arguments as for `next start`: -H host -p port.
 *
 * Runs under tsx without the react-server condition (Next's server must load React's ordinary
 * builds), and imports nothing of lib/server: the routes run inside Next's bundle.
 */
import http from "node:http";
import path from "node:path";
import { giveKeptAnswer } from "./front-door";

const ROOT = path.resolve(import.meta.dirname, "../..");

/** `-H host -p port`, as `next start` takes them (defaults 0.0.0.0 and 3000, as Next's). */
export function hostAndPort(args: readonly string[]): { hostname: string; port: number } {
  const value = (short: string, long: string) => {
    const i = args.findIndex((a) => a === short || a === long);
    return i >= 0 ? args[i + 1] : undefined;
  };
  return { hostname: value("-H", "--hostname") ?? "0.0.0.0", port: Number(value("-p", "--port") ?? 3000) };
}

async function main() {
  const { hostname, port } = hostAndPort(process.argv.slice(2));
  // As `next start`: production unless told otherwise, and before Next loads.
  Object.assign(process.env, { NODE_ENV: process.env.NODE_ENV ?? "production" });
  const { default: next } = await import("next");
  const app = next({ dev: false, dir: ROOT, hostname, port });
  await app.prepare();
  const handle = app.getRequestHandler();
  const server = http.createServer((req, res) => {
    giveKeptAnswer(req, res)
      .catch(() => false) // the lookup failed (the database closing): Next answers, as without the door
      .then((given) => (given ? undefined : handle(req, res)))
      .catch((err: unknown) => {
        // As `next start` does with an error its handler throws.
        console.error(`failed to handle request for ${req.url}`, err);
        if (!res.headersSent) res.statusCode = 500;
        res.end("Internal Server Error");
      });
  });
  server.listen(port, hostname);
  // As `next start`: Ctrl+C or SIGTERM ends the copy with 128 + the signal's number (Node then
  // writes what it writes at exit, e.g. a --cpu-prof profile).
  process.on("SIGINT", () => process.exit(130));
  process.on("SIGTERM", () => process.exit(143));
}

if (process.argv[1] && path.resolve(process.argv[1]) === import.meta.filename) void main();
