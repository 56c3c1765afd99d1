/**
 * Object key naming: everything of a lab sits under `labs/<labId>/`, so a lab can be exported or
 * removed by prefix. Originals keep no user-supplied name in the key (names can hold anything).
 */
export function uploadOriginalKey(labId: string, uploadId: string): string {
  return `labs/${labId}/uploads/${uploadId}/original`;
}

export function uploadDerivedKey(labId: string, uploadId: string, name: string): string {
  if (!/^[a-z0-9][a-z0-9._-]*$/.test(name))
    throw new Error(`derived object name "${name}" is not a plain lowercase name`);
  return `labs/${labId}/uploads/${uploadId}/${name}`;
}

/** A derived product of one readout (spectrum JSON, preview or FFT PNG), next to the upload's original. */
export function readoutDerivedKey(labId: string, uploadId: string, readoutId: string, product: string): string {
  return uploadDerivedKey(labId, uploadId, `readout-${readoutId.toLowerCase()}-${product}`);
}

/** A stored output of one simulation run (final fields, snapshot images, readout products). */
export function simulationRunKey(labId: string, runId: string, name: string): string {
  if (!/^[a-z0-9][a-z0-9._-]*$/.test(name)) throw new Error(`run output name "${name}" is not a plain lowercase name`);
  return `labs/${labId}/runs/${runId.toLowerCase()}/${name}`;
}

/** The upload a key under `labs/<labId>/uploads/<uploadId>/` belongs to, or null for any other key. */
export function uploadIdOfKey(key: string): { labId: string; uploadId: string } | null {
  const m = /^labs\/([^/]+)\/uploads\/([^/]+)\//.exec(key);
  return m ? { labId: m[1], uploadId: m[2] } : null;
}
