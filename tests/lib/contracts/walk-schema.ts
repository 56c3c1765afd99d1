/**
 * Every field path a zod schema can report an issue at: objects by key, lists and tuples by
 * position (0 stands for any), records by a sample name. Used to check that each path of the
 * forms' schemas has words in `lib/contracts/field-labels.ts`.
 */
import type { ZodType } from "zod";

type Def = { type: string; [k: string]: unknown };
const defOf = (s: unknown): Def => (s as { _zod: { def: Def } })._zod.def;

export function walkSchemaPaths(schema: ZodType): (string | number)[][] {
  const out: (string | number)[][] = [];
  const seen = new Set<string>();
  const visit = (s: unknown, path: (string | number)[]) => {
    const def = defOf(s);
    const key = path.join(".");
    if (path.length > 0 && !seen.has(`${key}|${def.type}`)) {
      seen.add(`${key}|${def.type}`);
      if (!out.some((p) => p.join(".") === key)) out.push(path);
    }
    switch (def.type) {
      case "object":
        for (const [k, v] of Object.entries(def.shape as Record<string, unknown>)) visit(v, [...path, k]);
        return;
      case "array":
        return visit(def.element, [...path, 0]);
      case "tuple":
        return (def.items as unknown[]).forEach((item, i) => visit(item, [...path, i]));
      case "record":
        return visit(def.valueType, [...path, "name"]);
      case "union":
        return (def.options as unknown[]).forEach((o) => visit(o, path));
      case "intersection":
        visit(def.left, path);
        return visit(def.right, path);
      case "pipe":
        visit(def.in, path);
        return visit(def.out, path);
      case "optional":
      case "nullable":
      case "default":
      case "prefault":
      case "readonly":
      case "catch":
      case "nonoptional":
        return visit(def.innerType, path);
      case "lazy":
        return visit((def.getter as () => unknown)(), path);
      default:
        return;
    }
  };
  visit(schema, []);
  return out;
}
