/**
 * The fixture most API test files share: a test stack, a lab with one member per role
 * (`makeWorld`), the route table, and one way to call a route as a member. `setupLabApi()` registers
 * the stack's `beforeAll`/`afterAll` in the calling file, so a file reads:
 *
 *   const lab = setupLabApi();
 *   it("…", async () => { const r = await lab.api("GET", "/api/v1/labs/[labId]/fits", { who: "modeller" }); … });
 */
import { afterAll, beforeAll } from "vitest";
import type { Role } from "@/lib/access/roles";
import { call, discoverRoutes, type Handler, type Method } from "./api";
import { startTestStack, type TestStack } from "./stack";
import { makeWorld, type Person, type World } from "./world";

export type Caller = Role | Person;

export interface ApiCall {
  /** Who calls: a role of the test lab or any person with a token (default: the fixture's `who`). */
  who?: Caller;
  /** Route parameters besides `labId` (which defaults to the test lab). */
  params?: Record<string, string>;
  json?: unknown;
  body?: BodyInit;
  query?: string;
}

export interface ApiAnswer {
  status: number;
  /** The parsed JSON body, or null for an empty or non-JSON answer. */
  body: any; // eslint-disable-line @typescript-eslint/no-explicit-any -- tests read any shape
  /** The raw response, for headers and non-JSON bodies. */
  res: Response;
}

export interface LabApi {
  readonly stack: TestStack;
  readonly w: World;
  /** Calls `METHOD path` as `who`; the response is read once (JSON when it says so). */
  api(method: Method, path: string, o?: ApiCall): Promise<ApiAnswer>;
  /** The handler of `"METHOD /path"` (throws when there is none). */
  route(key: string): Handler;
  /** The raw Response of a call, unread. */
  raw(method: Method, path: string, o?: ApiCall): Promise<Response>;
  /** The lab context a data-access function takes, for a role of the test lab. */
  ctx(role: Role): { actor: Person["actor"]; labId: string; labName: string; role: Role };
}

export interface LabApiOptions {
  /** The caller when a call names none (default "scientist"). */
  who?: Role;
  /** Runs before the stack starts (e.g. setting an environment variable the stack reads). */
  before?: () => void;
  /** Runs after the file's tests, before the stack closes (undoing `before`). */
  after?: () => void;
  /** Runs once the stack and the lab exist (seeding the file's shared objects). */
  setup?: (lab: LabApi) => Promise<void>;
}

/** The error object of an error answer: `{ code, message }`. */
export const errorOf = async (res: Response) =>
  ((await res.json()) as { error: { code: string; message: string } }).error;

export function setupLabApi(options: LabApiOptions = {}): LabApi {
  let stack: TestStack | undefined;
  let world: World | undefined;
  let routes: Awaited<ReturnType<typeof discoverRoutes>> | undefined;
  const ready = <T>(v: T | undefined, what: string): T => {
    if (v === undefined) throw new Error(`setupLabApi: ${what} is not ready (use it inside a test or hook)`);
    return v;
  };
  const route = (key: string): Handler => {
    const handler = ready(routes, "the route table").get(key);
    if (!handler) throw new Error(`no route ${key}`);
    return handler;
  };
  const raw = (method: Method, path: string, o: ApiCall = {}) => {
    const handler = route(`${method} ${path}`);
    const w = ready(world, "the lab");
    const who = o.who ?? options.who ?? "scientist";
    const token = typeof who === "string" ? w.people[who].token : who.token;
    return call(handler, method, path, {
      token,
      params: { labId: w.labId, ...o.params },
      json: o.json,
      body: o.body,
      query: o.query,
    });
  };
  const lab: LabApi = {
    get stack() {
      return ready(stack, "the stack");
    },
    get w() {
      return ready(world, "the lab");
    },
    route,
    raw,
    async api(method, path, o) {
      const res = await raw(method, path, o);
      const type = res.headers.get("content-type") ?? "";
      const body = type.includes("json") ? await res.clone().json() : null;
      // `res` is not enumerable, so `expect(answer).toEqual({ status, body })` compares what was answered.
      return Object.defineProperty({ status: res.status, body }, "res", { value: res, enumerable: false }) as ApiAnswer;
    },
    ctx(role) {
      const w = ready(world, "the lab");
      return { actor: w.people[role].actor, labId: w.labId, labName: "Test Lab", role };
    },
  };
  beforeAll(async () => {
    options.before?.();
    stack = await startTestStack();
    world = await makeWorld();
    routes = await discoverRoutes();
    await options.setup?.(lab);
  });
  afterAll(async () => {
    options.after?.();
    await stack?.close();
  });
  return lab;
}
