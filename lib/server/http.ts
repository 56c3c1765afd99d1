/** Route-handler glue: JSON bodies validated by a schema, errors mapped to status codes. */
import { z, ZodError, type ZodType } from "zod";
import { AppError, ServerBusyError } from "./errors";

export function errorResponse(err: unknown): Response {
  if (err instanceof AppError) {
    const headers = err instanceof ServerBusyError ? { "retry-after": String(err.retryAfterS) } : undefined;
    return Response.json({ error: { code: err.code, message: err.message, ...(err.details ? { details: err.details } : {}) } }, { status: err.status, headers });
  }
  if (err instanceof ZodError) {
    return Response.json({ error: { code: "bad_input", message: describeZodError(err), details: z.flattenError(err) } }, { status: 400 });
  }
  console.error(err);
  return Response.json({ error: { code: "internal", message: "something went wrong on the server; the error was logged" } }, { status: 500 });
}

/** "name: Required; tissue: Too long" — field names first, so the message says what is wrong. */
export function describeZodError(err: ZodError): string {
  return err.issues
    .map((i) => (i.path.length ? `${i.path.join(".")}: ${i.message}` : i.message))
    .join("; ");
}

type Handler<P> = (request: Request, ctx: { params: Promise<P> }) => Promise<Response>;

/** Wraps a handler so every thrown error becomes the JSON error shape. */
export function route<P = Record<string, string>>(handler: Handler<P>): Handler<P> {
  return async (request, ctx) => {
    try {
      return await handler(request, ctx);
    } catch (err) {
      return errorResponse(err);
    }
  };
}

export async function readJson<S extends ZodType>(request: Request, schema: S): Promise<z.infer<S>> {
  let body: unknown;
  const text = await request.text();
  try {
    body = text === "" ? {} : JSON.parse(text);
  } catch {
    throw new AppError("bad_input", "the request body is not valid JSON");
  }
  const parsed = schema.safeParse(body);
  if (!parsed.success) throw parsed.error;
  return parsed.data;
}

/** JSON answers describe live lab data: never let a browser or proxy keep a copy. */
export function json(data: unknown, status = 200): Response {
  return Response.json(data, { status, headers: { "cache-control": "no-store" } });
}
