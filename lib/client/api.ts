/**
 * Browser-side JSON API calls, used the same way everywhere: `useSWR(url, fetchJson)` for reads,
 * `sendJson(method, url, body)` for writes. Errors carry the server's message.
 */
export class ApiError extends Error {
  constructor(
    public status: number,
    public code: string,
    message: string,
    public details?: unknown,
  ) {
    super(message);
  }
}

async function unwrap<T>(res: Response): Promise<T> {
  if (res.status === 204) return undefined as T;
  const body = await res.json().catch(() => null);
  if (!res.ok) {
    const e = body?.error;
    throw new ApiError(res.status, e?.code ?? "failed", e?.message ?? `request failed (${res.status})`, e?.details);
  }
  return body as T;
}

export async function fetchJson<T>(url: string): Promise<T> {
  return unwrap<T>(await fetch(url, { headers: { accept: "application/json" } }));
}

export async function sendJson<T>(method: "POST" | "PATCH" | "DELETE", url: string, body?: unknown): Promise<T> {
  return unwrap<T>(
    await fetch(url, {
      method,
      headers: body === undefined ? {} : { "content-type": "application/json" },
      body: body === undefined ? undefined : JSON.stringify(body),
    }),
  );
}

export async function sendForm<T>(url: string, form: FormData): Promise<T> {
  return unwrap<T>(await fetch(url, { method: "POST", body: form }));
}
