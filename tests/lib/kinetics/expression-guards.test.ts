/**
 * The expression compiler never reaches Object.prototype (a name such as "constructor" is an
 * unknown symbol), refuses deep nesting before the parser recurses, and refuses a negative
 * diffusivity. Expected messages are the product's own (common practice, no source).
 */
import { describe, expect, it } from "vitest";
import { compileKinetics, KineticsInputError, type KineticsDefinition } from "@/lib/kinetics";
import { MAX_EXPRESSION_DEPTH, parseExpression } from "@/lib/kinetics/expression-compiler";

const base: KineticsDefinition = {
  name: "test",
  species: ["u", "v"],
  parameters: [{ name: "a", default: 1, min: 0, max: 10 }],
  reactions: ["a - u", "u - v"],
  diffusion: [1, 10],
};

function messageOf(f: () => unknown): string {
  try {
    f();
  } catch (err) {
    expect(err).toBeInstanceOf(KineticsInputError);
    return (err as Error).message;
  }
  throw new Error("expected a KineticsInputError");
}

describe("prototype names", () => {
  it.each(["constructor", "toString", "__proto__", "valueOf", "isPrototypeOf", "__defineGetter__"])(
    "%s is an unknown symbol and no function",
    (name) => {
      expect(messageOf(() => compileKinetics({ ...base, reactions: [`a - u + ${name}`, "u - v"] }))).toBe(
        `reactions[0]: unknown symbol "${name}" (species: u, v; parameters: a; constants: pi, e).`,
      );
      expect(messageOf(() => compileKinetics({ ...base, reactions: [`${name}(u)`, "u - v"] }))).toMatch(
        new RegExp(`^reactions\\[0\\]: function "${name}" is not allowed`),
      );
    },
  );
});

describe("nesting", () => {
  it("995 nested brackets: a message naming the limit, not a stack overflow", () => {
    expect(messageOf(() => parseExpression("(".repeat(995) + "u" + ")".repeat(995), "reactions[0]"))).toBe(
      "reactions[0] nests brackets 995 levels deep; the limit is 50 levels.",
    );
  });

  it(`${MAX_EXPRESSION_DEPTH} levels still parse; one more does not`, () => {
    expect(() =>
      parseExpression("(".repeat(MAX_EXPRESSION_DEPTH) + "u" + ")".repeat(MAX_EXPRESSION_DEPTH), "f"),
    ).not.toThrow();
    expect(
      messageOf(() =>
        parseExpression("-(".repeat(MAX_EXPRESSION_DEPTH + 1) + "u" + ")".repeat(MAX_EXPRESSION_DEPTH + 1), "f"),
      ),
    ).toBe("f nests brackets 51 levels deep; the limit is 50 levels.");
  });
});

describe("diffusivities", () => {
  it.each([
    [[-1, 10], "diffusion[0] is -1; a diffusivity must be 0 or more."],
    [[1, "a - 2"], "diffusion[1] = a - 2 is -1 at the default parameters; a diffusivity must be 0 or more."],
    [
      [
        [1, 0],
        [0, -3],
      ],
      "diffusion[1][1] is -3; a diffusivity must be 0 or more.",
    ],
  ])("%j is refused; an immobile species (0) and a negative cross-diffusion term are not", (diffusion, message) => {
    expect(messageOf(() => compileKinetics({ ...base, diffusion: diffusion as KineticsDefinition["diffusion"] }))).toBe(
      message,
    );
    expect(() => compileKinetics({ ...base, diffusion: [0, 1] })).not.toThrow();
    expect(() =>
      compileKinetics({
        ...base,
        diffusion: [
          [1, -0.5],
          [0, 2],
        ],
      }),
    ).not.toThrow();
  });
});
