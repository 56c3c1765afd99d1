/**
 * Preloaded into a child process (`node --require ./tests/support/report-peak-memory.cjs …`) so a
 * test can measure a process it does not change: at exit, the process's peak resident memory is
 * written to stderr as `peak-rss BYTES`. process.resourceUsage().maxRSS is in KiB (Node.js
 * documentation, process.resourceUsage); a write to a pipe is synchronous on Linux (Node.js
 * documentation, "A note on process I/O"), so the line is not lost at exit. CommonJS and
 * `--require`, not `--import`: worker threads inherit the flag, and a second ESM preload stalled
 * the readout's FFT thread. Only the main thread reports (the figure is the whole process's).
 */
const { isMainThread } = require("node:worker_threads");

if (isMainThread)
  process.on("exit", () => {
    process.stderr.write(`peak-rss ${process.resourceUsage().maxRSS * 1024}\n`);
  });
