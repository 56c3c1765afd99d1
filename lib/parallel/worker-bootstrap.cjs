// Entry of Morphokin worker threads when the source is TypeScript (tsx), started by
// start-worker.ts: a worker does not inherit the parent's loader hooks, so it registers tsx's
// CommonJS loader itself and then requires the real entry (workerData.entryPath). The project's
// .ts files are CommonJS (package.json has no "type": "module"); an ESM bootstrap
// (`tsx/esm/api` register + import()) worked under the tsx CLI but failed under vitest with
// ERR_REQUIRE_CYCLE_MODULE, and `execArgv: ["--import", "tsx"]` did not resolve the .ts entry at all.
const { workerData } = require("node:worker_threads");
try {
  require("tsx/cjs/api").register();
  require(workerData.entryPath);
} catch (err) {
  // A parent blocked in Atomics.wait cannot see this worker's "error" event: raise the shared
  // failure word it polls (start-worker.ts), then fail as usual so the error is reported.
  if (workerData.failure) Atomics.store(workerData.failure.words, workerData.failure.index, 1);
  throw err;
}
