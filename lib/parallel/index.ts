/** Worker-thread parallelism for the kinetics core (Node only). */
export { computeTuringMapParallel, type ParallelMapOptions } from "./turing-map-parallel";
export { createMapWorkerPool, defaultWorkerCount, WORKER_START_TIMEOUT_MS, type MapWorkerPool } from "./worker-pool";
