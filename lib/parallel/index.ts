/** Worker-thread parallelism for the core (Node only): Turing-map rows and the solver's spectral stage. */
export { computeTuringMapParallel, type ParallelMapOptions } from "./turing-map-parallel";
export { createWorkerExecutor, awaitWord, type WorkerExecutorOptions } from "./worker-executor";
export { createMapWorkerPool, defaultWorkerCount, WORKER_START_TIMEOUT_MS, type MapWorkerPool } from "./worker-pool";
