/**
 * The in-process link between the queue and a worker running in the same process, so the queue
 * never imports the worker (or any handler): the queue announces, the worker listens. Kept on
 * globalThis because Next may load this module more than once in one process.
 *
 * In one of several web processes of a server (lib/cli/web-processes.ts sets MORPHOKIN_WEB_PROCESS
 * and gives it a channel to the cluster's primary), each announcement also goes to the sibling
 * processes, whose local workers hear it as their own: a job queued where no worker runs starts at
 * once in the process that runs jobs.
 */
import "server-only";
import { isSiblingMessage, type SiblingMessage } from "./sibling-messages";

interface LocalBus {
  onQueued: Set<() => void>;
  onCancel: Set<(jobId: string) => boolean>;
  siblingsHeard?: boolean;
}

const g = globalThis as unknown as { __morphokinJobBus?: LocalBus };
const bus: LocalBus = (g.__morphokinJobBus ??= { onQueued: new Set(), onCancel: new Set() });

/** True in a web process started by lib/cli/web-processes.ts (never in tests, workers or the CLI). */
const hasSiblings = () => process.env.MORPHOKIN_WEB_PROCESS !== undefined && typeof process.send === "function";

function tellSiblings(message: SiblingMessage): void {
  if (hasSiblings()) process.send!(message);
}

function queuedHere(): void {
  for (const listener of bus.onQueued) listener();
}

function cancelHere(jobId: string): boolean {
  let taken = false;
  for (const listener of bus.onCancel) taken = listener(jobId) || taken;
  return taken;
}

function hearSiblings(): void {
  if (bus.siblingsHeard || !hasSiblings()) return;
  bus.siblingsHeard = true;
  process.on("message", (message: unknown) => {
    if (!isSiblingMessage(message)) return;
    if (message.morphokin === "job-queued") queuedHere();
    else cancelHere(message.jobId);
  });
}

/** Tells local workers (and those of sibling web processes) that a job was queued. */
export function announceQueued(): void {
  queuedHere();
  tellSiblings({ morphokin: "job-queued" });
}

/**
 * Asks local workers to stop a running job; true when one of them was running it. Otherwise
 * sibling web processes are asked too (the job's row records the request either way, for workers
 * elsewhere to see on their next heartbeat).
 */
export function announceCancel(jobId: string): boolean {
  const taken = cancelHere(jobId);
  if (!taken) tellSiblings({ morphokin: "job-cancel", jobId });
  return taken;
}

export function listenForQueued(listener: () => void): void {
  hearSiblings();
  bus.onQueued.add(listener);
}

export function listenForCancel(listener: (jobId: string) => boolean): void {
  hearSiblings();
  bus.onCancel.add(listener);
}
