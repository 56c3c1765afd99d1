/**
 * The bridge between the kinetics core and the API: its error classes become AppErrors with the
 * field in `details`, and compiled lab kinetics are cached per version (versions never change,
 * and compiling — parsing plus symbolic Jacobians — costs more than most analyses).
 */
import {
  compileKinetics,
  KineticsAnalysisError,
  KineticsInputError,
  KineticsLimitError,
  type CompiledKinetics,
  type KineticsDefinition,
} from "@/lib/kinetics";
import { AppError } from "../errors";

/** Maps a kinetics-core error to the API's error (400 bad input, 413 too large, 422 cannot analyse); other errors pass through. */
export function toAppError(err: unknown): unknown {
  if (err instanceof KineticsLimitError) return new AppError("too_large", err.message, { field: err.field });
  if (err instanceof KineticsInputError)
    return new AppError(err.code === "too_large" ? "too_large" : "bad_input", err.message, { field: err.field });
  if (err instanceof KineticsAnalysisError) return new AppError("unprocessable", err.message, { field: err.field });
  return err;
}

/** Runs `fn`, rethrowing kinetics-core errors as AppErrors. */
export function withKineticsErrors<T>(fn: () => T): T {
  try {
    return fn();
  } catch (err) {
    throw toAppError(err);
  }
}

const CACHE_SIZE = 64;
const g = globalThis as unknown as { __morphokinKineticsCache?: Map<string, CompiledKinetics> };

/** Compiles a stored definition once per version id (least recently used dropped first). */
export function compileStoredKinetics(versionId: string, definition: KineticsDefinition): CompiledKinetics {
  const cache = (g.__morphokinKineticsCache ??= new Map());
  const hit = cache.get(versionId);
  if (hit) {
    cache.delete(versionId);
    cache.set(versionId, hit);
    return hit;
  }
  const compiled = compileDefinition(definition);
  cache.set(versionId, compiled);
  if (cache.size > CACHE_SIZE) cache.delete(cache.keys().next().value as string);
  return compiled;
}

/** Compiles a definition; errors name the field under `definition.` (as the request body has it). */
export function compileDefinition(definition: KineticsDefinition): CompiledKinetics {
  try {
    return compileKinetics(definition);
  } catch (err) {
    if (err instanceof KineticsInputError && !err.field.startsWith("definition")) {
      const field = `definition.${err.field}`;
      const message = err.message.startsWith(err.field) ? `definition.${err.message}` : `${field}: ${err.message}`;
      throw new AppError("bad_input", message, { field });
    }
    throw toAppError(err);
  }
}
