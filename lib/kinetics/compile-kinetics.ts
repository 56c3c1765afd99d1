/**
 * Validates and compiles a lab's own kinetics (mathjs expressions, never eval) into a
 * {@link CompiledKinetics}. Jacobian entries come from mathjs symbolic `derivative`; where
 * that fails (e.g. min/max) or the derivative is too large, a central difference is used.
 */
import { derivative, type MathNode } from "mathjs";
import { KineticsInputError } from "./errors";
import { KineticsDefinitionSchema, type KineticsDefinition } from "./definition-schema";
import {
  collectSymbols,
  compileNode,
  countNodes,
  parseExpression,
  RESERVED_NAMES,
  type CompiledExpression,
  type SymbolTable,
} from "./expression-compiler";
import type { CompiledKinetics, ParameterSpec } from "./types";

/** Largest symbolic derivative kept, nodes; bigger ones are replaced by central differences. */
export const MAX_DERIVATIVE_NODES = 4000;
const NAME_PATTERN = /^[A-Za-z][A-Za-z0-9_]{0,31}$/;

/** Validates `definition` (unknown JSON) and compiles it; throws {@link KineticsInputError} naming the field. */
export function compileKinetics(definition: unknown): CompiledKinetics {
  const parsed = KineticsDefinitionSchema.safeParse(definition);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    const field = ["definition", ...issue.path.map(String)].join(".");
    throw new KineticsInputError(field, `${field}: ${issue.message}.`);
  }
  const def: KineticsDefinition = parsed.data;
  const n = def.species.length;
  checkNames(def);
  if (def.reactions.length !== n) {
    throw new KineticsInputError(
      "reactions",
      `reactions: ${def.reactions.length} given but there are ${n} species; give one reaction term per species.`,
    );
  }
  const parameters: ParameterSpec[] = def.parameters.map((p, i) => {
    const spec = {
      name: p.name,
      meaning: p.meaning ?? "",
      default: p.default,
      min: p.min ?? -Number.MAX_VALUE,
      max: p.max ?? Number.MAX_VALUE,
      unit: p.unit,
    };
    if (spec.min > spec.max)
      throw new KineticsInputError(
        `parameters[${i}].min`,
        `Parameter ${p.name}: min ${spec.min} is larger than max ${spec.max}.`,
      );
    if (spec.default < spec.min || spec.default > spec.max) {
      throw new KineticsInputError(
        `parameters[${i}].default`,
        `Parameter ${p.name}: default ${spec.default} is outside [${spec.min}, ${spec.max}].`,
      );
    }
    return spec;
  });
  const table: SymbolTable = {
    species: new Map(def.species.map((s, i) => [s, i])),
    parameters: new Map(parameters.map((s, i) => [s.name, i])),
  };
  const reactionNodes = def.reactions.map((r, i) => parseExpression(r, `reactions[${i}]`));
  const reactionFns = reactionNodes.map((node, i) => compileNode(node, table, `reactions[${i}]`));
  const { fns: jacFns, numeric } = compileJacobian(reactionNodes, def.species, table);
  const diffusionStrings = diffusionMatrix(def, n);
  const diffusionFns = diffusionStrings.map((row, i) =>
    row.map((e, j) => compileDiffusion(e, table, diffusionField(def, i, j))),
  );
  checkDiffusivities(diffusionStrings, diffusionFns, parameters, (i) => diffusionField(def, i, i));
  const diagonal = diffusionStrings.every((row, i) => row.every((e, j) => i === j || Number(e) === 0));

  const hPlus = new Float64Array(n);
  return {
    id: def.id ?? "custom",
    name: def.name,
    source: def.source ?? "",
    species: [...def.species],
    parameters,
    units: def.units ?? "non-dimensional",
    reactionExpressions: reactionNodes.map((nd) => nd.toString()),
    diffusionExpressions: diffusionStrings,
    diagonalDiffusion: diagonal,
    nonNegative: def.nonNegative ?? true,
    jacobianMethod: numeric ? "symbolic+numeric" : "symbolic",
    rates(c, p, out) {
      for (let i = 0; i < n; i++) out[i] = reactionFns[i](c, p);
    },
    jacobian(c, p, out) {
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          const f = jacFns[i * n + j];
          out[i * n + j] = f ? f(c, p) : centralDifference(reactionFns[i], c, p, j, hPlus);
        }
      }
    },
    diffusion(p, out) {
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) out[i * n + j] = diffusionFns[i][j](hPlus, p);
    },
  };
}

function checkNames(def: KineticsDefinition): void {
  const seen = new Set<string>();
  const all = [
    ...def.species.map((s, i) => [s, `species[${i}]`]),
    ...def.parameters.map((p, i) => [p.name, `parameters[${i}].name`]),
  ];
  for (const [name, field] of all) {
    if (!NAME_PATTERN.test(name)) {
      throw new KineticsInputError(
        field,
        `${field}: "${name}" is not a valid name (a letter, then letters, digits or _, at most 32 characters).`,
      );
    }
    if (RESERVED_NAMES.has(name))
      throw new KineticsInputError(
        field,
        `${field}: "${name}" is a reserved name (a function or constant); choose another.`,
      );
    if (seen.has(name))
      throw new KineticsInputError(
        field,
        `${field}: "${name}" is used twice; species and parameter names must be distinct.`,
      );
    seen.add(name);
  }
}

function compileJacobian(nodes: MathNode[], species: string[], table: SymbolTable) {
  const n = species.length;
  const fns: (CompiledExpression | null)[] = new Array(n * n).fill(null);
  let numeric = false;
  nodes.forEach((node, i) => {
    const used = collectSymbols(node);
    species.forEach((s, j) => {
      if (!used.has(s)) {
        fns[i * n + j] = () => 0;
        return;
      }
      try {
        const d = derivative(node, s);
        if (countNodes(d) > MAX_DERIVATIVE_NODES) throw new Error("derivative too large");
        fns[i * n + j] = compileNode(d, table, `reactions[${i}]`);
      } catch {
        numeric = true; // unsupported function for symbolic differentiation: central difference
      }
    });
  });
  return { fns, numeric };
}

/** ∂f/∂c_j by a central difference, step ∛ε·max(1, |c_j|) (common practice, no source). */
function centralDifference(
  f: CompiledExpression,
  c: ArrayLike<number>,
  p: ArrayLike<number>,
  j: number,
  buf: Float64Array,
): number {
  for (let i = 0; i < buf.length; i++) buf[i] = c[i];
  const h = 6.055e-6 * Math.max(1, Math.abs(c[j]));
  buf[j] = c[j] + h;
  const up = f(buf, p);
  buf[j] = c[j] - h;
  const down = f(buf, p);
  return (up - down) / (2 * h);
}

function diffusionMatrix(def: KineticsDefinition, n: number): string[][] {
  const d = def.diffusion;
  const full = d.length > 0 && Array.isArray(d[0]);
  if (!full) {
    if (d.length !== n)
      throw new KineticsInputError(
        "diffusion",
        `diffusion: ${d.length} diagonal entries given but there are ${n} species.`,
      );
    return Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? String(d[i]) : "0")));
  }
  const rows = d as (string | number)[][];
  if (rows.length !== n || rows.some((r) => !Array.isArray(r) || r.length !== n)) {
    throw new KineticsInputError(
      "diffusion",
      `diffusion must be a list of ${n} diagonal entries or a ${n}×${n} matrix.`,
    );
  }
  return rows.map((r) => r.map(String));
}

/**
 * A species' own diffusivity (a diagonal entry) cannot be negative: backward diffusion is not a
 * physical transport and makes every short wavelength grow without bound. Checked at the default
 * parameters; off-diagonal (cross-diffusion) entries may be negative.
 */
function checkDiffusivities(
  texts: string[][],
  fns: CompiledExpression[][],
  parameters: ParameterSpec[],
  field: (i: number) => string,
): void {
  const p = Float64Array.from(parameters, (s) => s.default);
  const none = new Float64Array(texts.length);
  texts.forEach((row, i) => {
    const d = fns[i][i](none, p);
    if (d >= 0) return;
    const f = field(i);
    const what = Number.isFinite(Number(row[i]))
      ? `${f} is ${d}`
      : `${f} = ${row[i]} is ${d} at the default parameters`;
    throw new KineticsInputError(
      f,
      Number.isNaN(d)
        ? `${f} = ${row[i]} is not a number at the default parameters; a diffusivity must be 0 or more.`
        : `${what}; a diffusivity must be 0 or more.`,
    );
  });
}

function diffusionField(def: KineticsDefinition, i: number, j: number): string {
  return Array.isArray(def.diffusion[0]) ? `diffusion[${i}][${j}]` : `diffusion[${i}]`;
}

function compileDiffusion(text: string, table: SymbolTable, field: string): CompiledExpression {
  const node = parseExpression(text, field);
  for (const s of collectSymbols(node)) {
    if (table.species.has(s))
      throw new KineticsInputError(
        field,
        `${field} refers to species ${s}; diffusivities may depend on parameters only.`,
      );
  }
  return compileNode(node, { species: new Map(), parameters: table.parameters }, field);
}
