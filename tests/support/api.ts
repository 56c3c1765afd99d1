/** Calling route handlers in-process, as Next would: a Request plus `{ params: Promise<…> }`. */
import { readdirSync, statSync } from "node:fs";
import path from "node:path";

export const API_ROOT = path.resolve(import.meta.dirname, "../../app/api");
export const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
export type Method = (typeof METHODS)[number];

export type Handler = (request: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** Every route file under app/api/v1 as "METHOD /api/v1/…" with its handler. */
export async function discoverRoutes(): Promise<Map<string, Handler>> {
  const found = new Map<string, Handler>();
  const walk = async (dir: string) => {
    for (const name of readdirSync(dir)) {
      const p = path.join(dir, name);
      if (statSync(p).isDirectory()) await walk(p);
      else if (name === "route.ts") {
        const mod = (await import(p)) as Record<string, unknown>;
        const urlPath = "/api/" + path.relative(API_ROOT, path.dirname(p)).split(path.sep).join("/");
        for (const m of METHODS) if (typeof mod[m] === "function") found.set(`${m} ${urlPath}`, mod[m] as Handler);
      }
    }
  };
  await walk(path.join(API_ROOT, "v1"));
  return found;
}

export interface CallOptions {
  token?: string;
  params?: Record<string, string>;
  json?: unknown;
  body?: BodyInit;
  headers?: Record<string, string>;
  query?: string;
}

export async function call(
  handler: Handler,
  method: Method,
  routePath: string,
  o: CallOptions = {},
): Promise<Response> {
  let url =
    "http://127.0.0.1:3999" + routePath.replace(/\[(\w+)\]/g, (_, k: string) => o.params?.[k] ?? `missing-${k}`);
  if (o.query) url += `?${o.query}`;
  const headers: Record<string, string> = { ...(o.headers ?? {}) };
  if (o.token) headers.authorization = `Bearer ${o.token}`;
  let body = o.body;
  if (o.json !== undefined) {
    headers["content-type"] = "application/json";
    body = JSON.stringify(o.json);
  }
  const request = new Request(url, { method, headers, body, duplex: "half" } as RequestInit);
  return handler(request, { params: Promise.resolve(o.params ?? {}) });
}

export function multipart(
  file: { name: string; bytes: Uint8Array; type?: string },
  fields: Record<string, string> = {},
): FormData {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  form.set(
    "file",
    new Blob([file.bytes as Uint8Array<ArrayBuffer>], { type: file.type ?? "application/octet-stream" }),
    file.name,
  );
  return form;
}
