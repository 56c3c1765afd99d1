// Entry of Morphokin worker threads when the source is TypeScript (tsx): a worker does not
// inherit the parent's loader hooks, so it registers tsx's CommonJS loader itself and then
// requires the real entry (workerData.entryPath). The project's .ts files are CommonJS
// (package.json has no "type": "module"); an ESM bootstrap (`tsx/esm/api` register +
// import()) worked under the tsx CLI but failed under vitest with ERR_REQUIRE_CYCLE_MODULE,
// and `execArgv: ["--import", "tsx"]` did not resolve the .ts entry at all.
const { workerData } = require("node:worker_threads");
require("tsx/cjs/api").register();
require(workerData.entryPath);
