/** What the discussion API tests share: the thread routes, calling them as anyone, and an inbox. */
import type { Method } from "./api";
import type { Caller, LabApi } from "./lab-api";

export const T = "/api/v1/labs/[labId]/threads";
export const ONE = `${T}/[threadId]`;
export const COMMENTS = `${ONE}/comments`;
export const COMMENT = `${COMMENTS}/[commentId]`;

/** Calls on the discussion routes; `uploadId()` is the discussed file of the test lab. */
export function discussionCalls(lab: LabApi, uploadId: () => string) {
  async function api(
    method: Method,
    path: string,
    who: Caller,
    o: { params?: Record<string, string>; json?: unknown; query?: string; labId?: string } = {},
  ) {
    const res = await lab.raw(method, path, {
      who,
      params: { labId: o.labId ?? lab.w.labId, ...o.params },
      json: o.json,
      query: o.query,
    });
    return { status: res.status, body: res.status === 204 ? null : await res.json() };
  }
  const start = (who: Caller, body: string, target: { targetType?: string; targetId?: string } = {}) =>
    api("POST", T, who, { json: { targetType: "upload", targetId: uploadId(), body, ...target } });
  const reply = (who: Caller, threadId: string, body: string, parentId?: string) =>
    api("POST", COMMENTS, who, { params: { threadId }, json: { body, parentId } });
  const getThread = (who: Caller, threadId: string) => api("GET", ONE, who, { params: { threadId } });
  async function inbox(email: string): Promise<{ subject: string; text: string }[]> {
    const res = await fetch(`${lab.stack.mailboxUrl}/messages?to=${encodeURIComponent(email)}`);
    return ((await res.json()) as { messages: { subject: string; text: string }[] }).messages;
  }
  return { api, start, reply, getThread, inbox };
}
