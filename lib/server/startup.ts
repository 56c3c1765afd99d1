/**
 * What the server does once when its process starts, before it answers requests (called from
 * instrumentation.ts, Next's start-up hook, in the Node.js runtime only). Each task logs its own
 * failure and never stops the others or the server from starting.
 */
import "server-only";
import { startTokenExpirySweep } from "./accounts/tokens";
import { recoverJobsAtStart } from "./jobs/wiring";
import { removeStaleJobFolders } from "./jobs/temp-folders";
import { recoverUploadsAtStart } from "./uploads/recovery";

export interface StartupTask {
  name: string;
  run(): Promise<unknown>;
}

export const STARTUP_TASKS: StartupTask[] = [
  // Uploads a killed process left half-written: rows still "receiving" after the grace period with
  // their objects, objects without a row, temporary upload folders of dead processes; then hourly.
  // Before job recovery, so re-queued readouts never see a half-stored upload.
  { name: "sweep half-written uploads", run: recoverUploadsAtStart },
  // Jobs left "running" by a dead process are re-queued once (failed the second time), then queued jobs start.
  { name: "recover interrupted jobs", run: recoverJobsAtStart },
  // Temporary folders of readout, fit and run child processes killed with an earlier server process.
  { name: "remove stale job folders", run: () => removeStaleJobFolders() },
  // API tokens that expired while the server was down get their audit entry; then hourly.
  { name: "record expired API tokens", run: startTokenExpirySweep },
];

/** Runs every start-up task in order; resolves when all have ended (succeeded or logged). */
export async function runStartupTasks(tasks: StartupTask[] = STARTUP_TASKS): Promise<void> {
  for (const task of tasks) {
    try {
      await task.run();
    } catch (err) {
      console.error(`start-up task "${task.name}" failed:`, err);
    }
  }
}
