/**
 * Browser-side file sending with upload progress: one multipart request per file through
 * XMLHttpRequest (fetch reports no upload progress), at most `inFlight` at once, each file's
 * failure its own (the others go on).
 */
import { ApiError } from "./api";

export interface SendProgress {
  /** 0..1 of the file's bytes sent. */
  sent: number;
}

/** Sends `form` to `url`; resolves with the JSON answer, rejects with an ApiError carrying the server's message. */
export function sendFormWithProgress<T>(
  url: string,
  form: FormData,
  onProgress: (p: SendProgress) => void,
): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", url);
    xhr.responseType = "text";
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable && e.total > 0) onProgress({ sent: e.loaded / e.total });
    };
    xhr.onerror = () => reject(new ApiError(0, "network", "the connection to the server was lost while sending"));
    xhr.onload = () => {
      let body: { error?: { code?: string; message?: string; details?: unknown } } | null = null;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        body = null;
      }
      if (xhr.status >= 200 && xhr.status < 300) return resolve(body as T);
      const e = body?.error;
      reject(new ApiError(xhr.status, e?.code ?? "failed", e?.message ?? `request failed (${xhr.status})`, e?.details));
    };
    xhr.send(form);
  });
}

/** Runs `task` for every item, at most `inFlight` at once; never rejects (each task handles its own failure). */
export async function runPool<T>(items: T[], inFlight: number, task: (item: T, index: number) => Promise<void>) {
  let next = 0;
  const worker = async () => {
    while (next < items.length) {
      const i = next++;
      await task(items[i], i).catch(() => undefined);
    }
  };
  await Promise.all(Array.from({ length: Math.min(inFlight, items.length) }, worker));
}
