/**
 * The bridge between the kinetics core and the API: compiled lab kinetics are cached per version
 * (versions never change, and compiling — parsing plus symbolic Jacobians — costs more than most
 * analyses); core errors become AppErrors through the one mapper (`../core-errors`).
 */
import "server-only";
import { compileKinetics, KineticsInputError, type CompiledKinetics, type KineticsDefinition } from "@/lib/kinetics";
import { fieldLabelContextOf, renameFieldInMessage } from "@/lib/contracts/field-words";
import { toAppError, withAppErrors } from "../core-errors";

/** Runs `fn`, rethrowing kinetics-core errors as AppErrors (400 bad input, 413 too large, 422 cannot analyse). */
export const withKineticsErrors = withAppErrors;

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

/**
 * Compiles a definition; errors keep the field under `definition.` (as the request body has it)
 * and name it in the editor's words, with the definition's own species ("Equation for dv/dt").
 */
export function compileDefinition(definition: KineticsDefinition): CompiledKinetics {
  try {
    return compileKinetics(definition);
  } catch (err) {
    if (err instanceof KineticsInputError) {
      const field = err.field.startsWith("definition") ? err.field : `definition.${err.field}`;
      const named = err.message.startsWith(err.field) ? `${field}${err.message.slice(err.field.length)}` : err.message;
      const message = renameFieldInMessage(field, named, fieldLabelContextOf(definition));
      throw toAppError(new KineticsInputError(field, message, err.code));
    }
    throw toAppError(err) ?? err;
  }
}
