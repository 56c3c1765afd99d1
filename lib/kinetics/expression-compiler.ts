/**
 * Turns a mathjs expression string into a fast JS closure without `eval`/`new Function`:
 * the string is parsed by mathjs, every node is checked against a small whitelist (numbers,
 * symbols, + − × ÷ ^, a few elementary functions, parentheses) and the tree is compiled to
 * nested closures over (c, p) typed arrays. The grammar has no loops, assignments or calls
 * of user functions, so one evaluation costs at most a fixed number of operations
 * (bounded by {@link MAX_EXPRESSION_NODES}); that is the guard against runaway evaluation.
 */
import { parse, type MathNode } from "mathjs";
import { KineticsInputError } from "./errors";

/** Longest accepted expression string, characters. */
export const MAX_EXPRESSION_LENGTH = 2000;
/** Largest accepted expression tree, nodes (operators, symbols, numbers). */
export const MAX_EXPRESSION_NODES = 500;
/**
 * Deepest accepted nesting of brackets. The parser recurses through about twenty functions per
 * bracket level, and 995 levels overflowed the call stack; a reaction term a person writes stays
 * far below 50 levels (common practice, no source). Other chains (signs, powers, sums) are bounded
 * by the length and term limits, and parse within the stack.
 */
export const MAX_EXPRESSION_DEPTH = 50;

/** A compiled expression: c = species values, p = parameter values. */
export type CompiledExpression = (c: ArrayLike<number>, p: ArrayLike<number>) => number;

/** Where each symbol of an expression lives. */
export interface SymbolTable {
  species: ReadonlyMap<string, number>;
  parameters: ReadonlyMap<string, number>;
}

// Maps, not object literals: a name such as "constructor" or "toString" must not be found
// through Object.prototype.
const FUNCTIONS: ReadonlyMap<string, (...x: number[]) => number> = new Map(
  Object.entries({
    exp: Math.exp,
    log: Math.log,
    log10: Math.log10,
    sqrt: Math.sqrt,
    cbrt: Math.cbrt,
    abs: Math.abs,
    sin: Math.sin,
    cos: Math.cos,
    tan: Math.tan,
    sinh: Math.sinh,
    cosh: Math.cosh,
    tanh: Math.tanh,
    asin: Math.asin,
    acos: Math.acos,
    atan: Math.atan,
    min: Math.min,
    max: Math.max,
    pow: Math.pow,
  }),
);
const CONSTANTS: ReadonlyMap<string, number> = new Map([
  ["pi", Math.PI],
  ["e", Math.E],
]);

/** Names nobody may use for a species or parameter (functions, constants, mathjs literals). */
export const RESERVED_NAMES: ReadonlySet<string> = new Set([
  ...FUNCTIONS.keys(),
  ...CONSTANTS.keys(),
  "PI",
  "E",
  "i",
  "Infinity",
  "NaN",
  "true",
  "false",
  "null",
  "undefined",
  "end",
  "to",
  "in",
  "mod",
  "not",
  "and",
  "or",
  "xor",
  "constructor",
  "prototype",
  "__proto__",
]);

/** Names of the functions expressions may call. */
export const ALLOWED_FUNCTIONS: readonly string[] = [...FUNCTIONS.keys()];

/** Parses `text` with mathjs and checks length and grammar; `field` names the input in errors. */
export function parseExpression(text: unknown, field: string): MathNode {
  if (typeof text !== "string" && typeof text !== "number") {
    throw new KineticsInputError(field, `${field} must be an expression string or a number.`);
  }
  const s = String(text);
  if (s.trim() === "") throw new KineticsInputError(field, `${field} is empty.`);
  if (s.length > MAX_EXPRESSION_LENGTH) {
    throw new KineticsInputError(
      field,
      `${field} is ${s.length} characters long; the limit is ${MAX_EXPRESSION_LENGTH}.`,
    );
  }
  const brackets = bracketDepth(s);
  if (brackets > MAX_EXPRESSION_DEPTH) throw tooDeep(field, `${brackets} levels`);
  let node: MathNode;
  try {
    node = parse(s);
  } catch (err) {
    if (err instanceof RangeError) throw tooDeep(field, "too many levels"); // the call stack ran out all the same
    throw new KineticsInputError(field, `${field} does not parse: ${(err as Error).message}.`);
  }
  const count = countNodes(node);
  if (count > MAX_EXPRESSION_NODES) {
    throw new KineticsInputError(field, `${field} has ${count} terms; the limit is ${MAX_EXPRESSION_NODES}.`);
  }
  return node;
}

const tooDeep = (field: string, what: string) =>
  new KineticsInputError(field, `${field} nests brackets ${what} deep; the limit is ${MAX_EXPRESSION_DEPTH} levels.`);

/** Deepest nesting of (), [] and {} in the text, counted without recursion. */
function bracketDepth(s: string): number {
  let depth = 0;
  let most = 0;
  for (const ch of s) {
    if (ch === "(" || ch === "[" || ch === "{") most = Math.max(most, ++depth);
    else if (ch === ")" || ch === "]" || ch === "}") depth = Math.max(0, depth - 1);
  }
  return most;
}

/** Number of nodes of a tree (function-name symbols not counted). */
export function countNodes(node: MathNode): number {
  let n = 1;
  for (const child of childrenOf(node)) n += countNodes(child);
  return n;
}

function childrenOf(node: MathNode): MathNode[] {
  const any = node as unknown as { args?: MathNode[]; content?: MathNode };
  if (node.type === "ParenthesisNode") return any.content ? [any.content] : [];
  return any.args ?? [];
}

/** Symbols a tree refers to (function names excluded), in order of first use. */
export function collectSymbols(node: MathNode, out: Set<string> = new Set()): Set<string> {
  if (node.type === "SymbolNode") out.add((node as unknown as { name: string }).name);
  for (const child of childrenOf(node)) collectSymbols(child, out);
  return out;
}

/** Compiles a checked tree to a closure; throws on any construct outside the whitelist. */
export function compileNode(node: MathNode, table: SymbolTable, field: string): CompiledExpression {
  switch (node.type) {
    case "ConstantNode": {
      const v = (node as unknown as { value: unknown }).value;
      if (typeof v !== "number" || !Number.isFinite(v)) {
        throw new KineticsInputError(
          field,
          `${field}: only finite numbers are allowed as constants (got ${String(v)}).`,
        );
      }
      return () => v;
    }
    case "SymbolNode": {
      const name = (node as unknown as { name: string }).name;
      const si = table.species.get(name);
      if (si !== undefined) return (c) => c[si];
      const pi = table.parameters.get(name);
      if (pi !== undefined) return (_c, p) => p[pi];
      const v = CONSTANTS.get(name);
      if (v !== undefined) return () => v;
      throw new KineticsInputError(field, unknownSymbolMessage(field, name, table));
    }
    case "ParenthesisNode":
      return compileNode((node as unknown as { content: MathNode }).content, table, field);
    case "OperatorNode":
      return compileOperator(node, table, field);
    case "FunctionNode":
      return compileFunction(node, table, field);
    default:
      throw new KineticsInputError(
        field,
        `${field}: "${node.toString()}" (${node.type}) is not allowed in a reaction or diffusion expression.`,
      );
  }
}

function unknownSymbolMessage(field: string, name: string, table: SymbolTable): string {
  const sp = [...table.species.keys()].join(", ") || "none";
  const pa = [...table.parameters.keys()].join(", ") || "none";
  return `${field}: unknown symbol "${name}" (species: ${sp}; parameters: ${pa}; constants: pi, e).`;
}

function compileOperator(node: MathNode, table: SymbolTable, field: string): CompiledExpression {
  const op = node as unknown as { fn: string; op: string; args: MathNode[] };
  const args = op.args.map((a) => compileNode(a, table, field));
  const [a, b] = args;
  switch (op.fn) {
    case "unaryMinus":
      return (c, p) => -a(c, p);
    case "unaryPlus":
      return a;
    case "add":
      return args.length === 2 ? (c, p) => a(c, p) + b(c, p) : (c, p) => args.reduce((s, f) => s + f(c, p), 0);
    case "subtract":
      return (c, p) => a(c, p) - b(c, p);
    case "multiply":
      return args.length === 2 ? (c, p) => a(c, p) * b(c, p) : (c, p) => args.reduce((s, f) => s * f(c, p), 1);
    case "divide":
      return (c, p) => a(c, p) / b(c, p);
    case "pow": {
      const e = op.args[1];
      const ev = e.type === "ConstantNode" ? (e as unknown as { value: number }).value : NaN;
      if (ev === 2)
        return (c, p) => {
          const x = a(c, p);
          return x * x;
        };
      if (ev === 3)
        return (c, p) => {
          const x = a(c, p);
          return x * x * x;
        };
      return (c, p) => Math.pow(a(c, p), b(c, p));
    }
    default:
      throw new KineticsInputError(field, `${field}: operator "${op.op}" is not allowed (use + - * / ^).`);
  }
}

function compileFunction(node: MathNode, table: SymbolTable, field: string): CompiledExpression {
  const fnNode = node as unknown as { fn: MathNode & { name?: string }; args: MathNode[] };
  const name = fnNode.fn.type === "SymbolNode" ? (fnNode.fn.name ?? "") : "";
  const fn = FUNCTIONS.get(name);
  if (!fn) {
    throw new KineticsInputError(
      field,
      `${field}: function "${name || fnNode.fn.toString()}" is not allowed (allowed: ${ALLOWED_FUNCTIONS.join(", ")}).`,
    );
  }
  const args = fnNode.args.map((a) => compileNode(a, table, field));
  const arity = name === "min" || name === "max" ? -1 : name === "pow" ? 2 : 1;
  if ((arity > 0 && args.length !== arity) || args.length === 0) {
    throw new KineticsInputError(
      field,
      `${field}: ${name}() takes ${arity > 0 ? arity : "one or more"} argument(s), got ${args.length}.`,
    );
  }
  if (args.length === 1) {
    const [a] = args;
    return (c, p) => fn(a(c, p));
  }
  if (args.length === 2) {
    const [a, b] = args;
    return (c, p) => fn(a(c, p), b(c, p));
  }
  return (c, p) => fn(...args.map((f) => f(c, p)));
}
