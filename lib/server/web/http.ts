/** Route-handler glue: JSON bodies validated by a schema, errors mapped to status codes. */
import "server-only";
import { z, ZodError, type ZodType } from "zod";
import { readConfig } from "../config";
import { toAppError } from "../core-errors";
import { AppError } from "../errors";
import { prefixField, startsWithField } from "@/lib/errors/field-message";
import type { FieldLabelContext } from "@/lib/contracts/field-labels";
import {
  describeFieldMessage,
  fieldLabelContextOf,
  formatFieldPath,
  renameFieldInMessage,
} from "@/lib/contracts/field-words";
import { crossSiteRefusal } from "./same-origin";

/**
 * The JSON error answer for anything a handler threw: AppErrors and core errors by the one mapper,
 * zod issues as 400, the rest 500. Like every JSON answer (json() below), never stored.
 */
export function errorResponse(err: unknown): Response {
  const app = err instanceof ZodError ? zodAppError(err) : toAppError(err);
  if (app) {
    // A rate-limited answer says when to come back (RFC 9110 §10.2.3 Retry-After, in seconds).
    const retry = (app as { retryAfterS?: number }).retryAfterS;
    const headers: Record<string, string> = retry ? { "retry-after": String(retry) } : {};
    // The message names its field in the form's words; `details.field` keeps the JSON name for the forms.
    const field = (app.details as { field?: unknown } | undefined)?.field;
    const message = typeof field === "string" ? renameFieldInMessage(field, app.message) : app.message;
    return json(
      { error: { code: app.code, message, ...(app.details ? { details: app.details } : {}) } },
      app.status,
      headers,
    );
  }
  console.error(err);
  return json(
    { error: { code: "internal", message: "something went wrong on the server; the error was logged" } },
    500,
  );
}

/**
 * A 400 for a body the schema refused: every issue in the form's words, the first issue's field
 * (`models[1].lengthScaleUm`) and zod's per-field lists in `details`. `body` lends the labels the
 * names a kinetics definition gives its species ("Equation for dv/dt").
 */
export function zodAppError(err: ZodError, body?: unknown): AppError {
  const first = err.issues.find((i) => i.path.length > 0);
  return new AppError("bad_input", describeZodError(err, fieldLabelContextOf(body)), {
    ...(first ? { field: formatFieldPath(first.path) } : {}),
    ...z.flattenError(err),
  });
}

/**
 * "Name: Required; Tissue: Too long" — the field's label first, so the message says what is
 * wrong where. A message that already begins with its field's JSON name ("endTimeS must be …")
 * has that name replaced by the label, so no message repeats its field.
 */
export function describeZodError(err: ZodError, context: FieldLabelContext = {}): string {
  return err.issues.map((i) => describeIssue(i, context)).join("; ");
}

export function describeIssue(
  i: { path: readonly PropertyKey[]; message: string },
  context: FieldLabelContext = {},
): string {
  if (!i.path.length) return i.message;
  const worded = describeFieldMessage(i.path, i.message, context);
  if (worded !== i.message) return worded;
  // A path the forms do not label (query strings, account forms): its JSON name, as before.
  const field = i.path.map(String).join(".");
  if (startsWithField(i.message, field)) return i.message;
  // A nested field whose message names only its own key: "models.0.kinetics" + "kinetics: at most 64 …".
  const last = i.path[i.path.length - 1];
  if (i.path.length > 1 && typeof last === "string" && i.message.startsWith(`${last}:`)) {
    return `${i.path.slice(0, -1).map(String).join(".")}.${i.message}`;
  }
  return prefixField(field, i.message);
}

type Handler<P> = (request: Request, ctx: { params: Promise<P> }) => Promise<Response>;

/**
 * Wraps a handler so every thrown error becomes the JSON error shape, and refuses a
 * state-changing request that a browser sent from another site with this app's cookie (CSRF).
 */
export function route<P = Record<string, string>>(handler: Handler<P>): Handler<P> {
  return async (request, ctx) => {
    try {
      const refusal = crossSiteRefusal(request, readConfig().appUrl);
      if (refusal) throw new AppError("forbidden", refusal);
      return await handler(request, ctx);
    } catch (err) {
      return errorResponse(err);
    }
  };
}

/** Default largest JSON body, bytes: every form of the app fits in a small fraction of it. */
export const DEFAULT_JSON_LIMIT_BYTES = 1024 * 1024;

export interface ReadJsonOptions {
  /** Largest body accepted, bytes; @default DEFAULT_JSON_LIMIT_BYTES */
  maxBytes?: number;
}

/** "1 MiB", "64 KiB", "900 bytes": the limit as a person reads it. */
export function formatByteLimit(bytes: number): string {
  if (bytes >= 1024 * 1024 && bytes % (1024 * 1024) === 0) return `${bytes / (1024 * 1024)} MiB`;
  if (bytes >= 1024 && bytes % 1024 === 0) return `${bytes / 1024} KiB`;
  return `${bytes} bytes`;
}

export const bodyTooLarge = (maxBytes: number) =>
  new AppError(
    "too_large",
    `the request body is larger than the limit of ${formatByteLimit(maxBytes)} for this request; send less data`,
  );

/** The media type of the Content-Type header without parameters, or null when absent. */
function mediaType(request: Request): string | null {
  const raw = request.headers.get("content-type");
  return raw === null ? null : raw.split(";")[0].trim().toLowerCase();
}

const notJson = (type: string | null) =>
  new AppError(
    "unsupported_media_type",
    `the request body must be JSON sent as Content-Type: application/json (it was sent ${type === null ? "without a Content-Type" : `as ${type}`})`,
  );

/**
 * The body as text, at most `maxBytes`: a declared Content-Length above the limit is refused
 * before a byte is read, and a body without a length is cut off (and refused) at the limit, so a
 * large body never sits in memory whole.
 */
export async function readBodyText(request: Request, maxBytes: number): Promise<string> {
  const declared = request.headers.get("content-length");
  if (declared !== null && Number(declared) > maxBytes) throw bodyTooLarge(maxBytes);
  if (!request.body) return "";
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw bodyTooLarge(maxBytes);
    }
    chunks.push(value);
  }
  return new TextDecoder().decode(Buffer.concat(chunks));
}

/**
 * The JSON body, unchecked: `{}` when the body is empty. Only `application/json` is accepted
 * (415 otherwise): a form on another site can send text/plain without asking first, never JSON.
 */
export async function readJsonValue(request: Request, options: ReadJsonOptions = {}): Promise<unknown> {
  const maxBytes = options.maxBytes ?? DEFAULT_JSON_LIMIT_BYTES;
  const type = mediaType(request);
  if (type !== null && type !== "application/json") throw notJson(type);
  const text = await readBodyText(request, maxBytes);
  if (text.trim() === "") return {};
  if (type === null) throw notJson(null);
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError("bad_input", "the request body is not valid JSON");
  }
}

export async function readJson<S extends ZodType>(
  request: Request,
  schema: S,
  options: ReadJsonOptions = {},
): Promise<z.infer<S>> {
  const body = await readJsonValue(request, options);
  const parsed = schema.safeParse(body);
  if (!parsed.success) throw zodAppError(parsed.error, body);
  return parsed.data;
}

/**
 * The smallest JSON answer worth gzipping, bytes: the TCP initial window of 10 segments of 1460
 * bytes (RFC 6928 §2). A smaller answer reaches the client in the first round trip whether it is
 * gzipped or not, so gzip saves the client no time, while each gzip stream costs the server CPU.
 * Measured with 50 clients on the server-load bench's lab (2 web processes, no readout): the ten
 * lists and details, of 0.5–25 KB, cost 2.5–2.6 ms of server CPU per request all gzipped and
 * 2.25–2.35 ms with only the 25 KB one gzipped; 555–560 against 610–630 requests/s.
 */
export const GZIP_JSON_FROM_BYTES = 14_600;

/**
 * JSON answers describe live lab data: never let a browser or proxy keep a copy. An answer smaller
 * than GZIP_JSON_FROM_BYTES also says `no-transform` (RFC 9111 §5.2.2.6), which keeps Next's
 * compression from gzipping it: Next drops a route answer's Content-Length, so the compression's
 * own threshold (1 KiB) never applies and every answer, even one of 300 bytes, would be gzipped.
 * `headers` adds others (an error's Retry-After).
 */
export function json(data: unknown, status = 200, headers: Record<string, string> = {}): Response {
  const body = JSON.stringify(data);
  const small = Buffer.byteLength(body) < GZIP_JSON_FROM_BYTES;
  return new Response(body, {
    status,
    headers: {
      ...headers,
      "content-type": "application/json",
      "cache-control": small ? "no-store, no-transform" : "no-store",
    },
  });
}
