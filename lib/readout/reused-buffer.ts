/**
 * One Float32Array per slot, handed again to the next caller asking for the same slot and length:
 * a fresh 64 MiB array for a 4096² frame costs about 45 ms of page faults on first touch, every
 * readout. Held through a WeakRef, so it never keeps memory alive that the collector wants back.
 * Only for arrays that do not outlive the synchronous call that asked for them (the caller
 * overwrites every value before reading one).
 */
const slots = new Map<string, WeakRef<Float32Array>>();

export function reusedFloat32(slot: string, length: number): Float32Array {
  const kept = slots.get(slot)?.deref();
  if (kept && kept.length === length) return kept;
  // In shared memory: a worker thread (lib/parallel/spectrum-threads.ts) reads it without a copy.
  const fresh = new Float32Array(new SharedArrayBuffer(4 * length));
  slots.set(slot, new WeakRef(fresh));
  return fresh;
}
