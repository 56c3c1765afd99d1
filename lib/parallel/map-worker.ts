/** Worker-thread entry: computes Turing-map rows for tasks posted by {@link ./worker-pool}. */
import { parentPort } from "node:worker_threads";
import { getCatalogueKinetics } from "../kinetics/catalogue";
import type { CompiledKinetics } from "../kinetics/types";
import { computeMapRows } from "../stability/map-rows";
import type { MapReply, MapTask } from "./messages";

const cache = new Map<string, CompiledKinetics>();

// mathjs (for lab kinetics) loads only when a definition arrives: worker start stays fast.
async function resolve(task: MapTask): Promise<CompiledKinetics> {
  if ("catalogue" in task.source) return getCatalogueKinetics(task.source.catalogue);
  type CompileModule = typeof import("../kinetics/compile-kinetics");
  // Under the tsx CommonJS hook (worker-bootstrap.cjs) only require() sees .ts files; a
  // compiled ESM build has no require, and import() resolves there.
  const mod: CompileModule =
    typeof require === "function"
      ? // eslint-disable-next-line @typescript-eslint/no-require-imports -- see above
        require("../kinetics/compile-kinetics")
      : await import("../kinetics/compile-kinetics");
  return mod.compileKinetics(task.source.definition);
}

parentPort?.on("message", async (task: MapTask) => {
  let reply: MapReply;
  try {
    const key = JSON.stringify(task.source);
    let kinetics = cache.get(key);
    if (!kinetics) {
      kinetics = await resolve(task);
      if (cache.size > 16) cache.clear();
      cache.set(key, kinetics);
    }
    const rows = computeMapRows(kinetics, task.plan, task.y0, task.y1, task.startedAtMs);
    reply = { id: task.id, ok: true, ...rows };
    parentPort!.postMessage(reply, [
      rows.classes.buffer as ArrayBuffer,
      rows.wavelength.buffer as ArrayBuffer,
      rows.sigmaStar.buffer as ArrayBuffer,
    ]);
  } catch (err) {
    const e = err as Error & { field?: string };
    reply = { id: task.id, ok: false, error: { name: e.name, field: e.field ?? "", message: e.message } };
    parentPort!.postMessage(reply);
  }
});
parentPort?.postMessage({ ready: true });
