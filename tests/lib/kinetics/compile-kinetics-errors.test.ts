import { describe, expect, it } from "vitest";
import { compileKinetics, KineticsInputError, type KineticsDefinition } from "@/lib/kinetics";

const base: KineticsDefinition = {
  name: "test",
  species: ["u", "v"],
  parameters: [{ name: "a", default: 1, min: 0, max: 10 }],
  reactions: ["a - u", "u - v"],
  diffusion: [1, 10],
};

function failure(patch: Record<string, unknown>): { field: string; message: string } {
  try {
    compileKinetics({ ...base, ...patch });
  } catch (err) {
    expect(err).toBeInstanceOf(KineticsInputError);
    const e = err as KineticsInputError;
    return { field: e.field, message: e.message };
  }
  throw new Error("expected compileKinetics to throw");
}

describe("compileKinetics errors", () => {
  it.each([
    [
      { reactions: ["a - q", "u - v"] },
      "reactions[0]",
      'reactions[0]: unknown symbol "q" (species: u, v; parameters: a; constants: pi, e).',
    ],
    [
      { reactions: ["a - u"] },
      "definition.reactions",
      "definition.reactions: Too small: expected array to have >=2 items.",
    ],
    [
      { reactions: ["a - u", "u - v", "v"] },
      "reactions",
      "reactions: 3 given but there are 2 species; give one reaction term per species.",
    ],
    [{ reactions: ["a +* u", "u - v"] }, "reactions[0]", "reactions[0] does not parse: Value expected (char 4)."],
    [{ reactions: ["a - u", ""] }, "reactions[1]", "reactions[1] is empty."],
    [
      { species: ["u", "exp"], reactions: ["a - u", "u"] },
      "species[1]",
      'species[1]: "exp" is a reserved name (a function or constant); choose another.',
    ],
    [
      { species: ["u", "a"] },
      "parameters[0].name",
      'parameters[0].name: "a" is used twice; species and parameter names must be distinct.',
    ],
    [
      { species: ["u", "2v"] },
      "species[1]",
      'species[1]: "2v" is not a valid name (a letter, then letters, digits or _, at most 32 characters).',
    ],
    [
      { reactions: ["a - u", "gamma(u)"] },
      "reactions[1]",
      'reactions[1]: function "gamma" is not allowed (allowed: exp, log, log10, sqrt, cbrt, abs, sin, cos, tan, sinh, cosh, tanh, asin, acos, atan, min, max, pow).',
    ],
    [{ reactions: ["a - u", "u > v"] }, "reactions[1]", 'reactions[1]: operator ">" is not allowed (use + - * / ^).'],
    [
      { reactions: ["a - u", "f(x) = x"] },
      "reactions[1]",
      'reactions[1]: "f(x) = x" (FunctionAssignmentNode) is not allowed in a reaction or diffusion expression.',
    ],
    [
      { reactions: ["a - u", "[u, v]"] },
      "reactions[1]",
      'reactions[1]: "[u, v]" (ArrayNode) is not allowed in a reaction or diffusion expression.',
    ],
    [
      { diffusion: [1, "v"] },
      "diffusion[1]",
      "diffusion[1] refers to species v; diffusivities may depend on parameters only.",
    ],
    [{ diffusion: [1, 2, 3] }, "diffusion", "diffusion: 3 diagonal entries given but there are 2 species."],
    [{ diffusion: [[1, 0], [0]] }, "diffusion", "diffusion must be a list of 2 diagonal entries or a 2×2 matrix."],
    [
      { parameters: [{ name: "a", default: 20, min: 0, max: 10 }] },
      "parameters[0].default",
      "Parameter a: default 20 is outside [0, 10].",
    ],
    [
      { species: ["u", "v", "w", "x", "y", "z", "s"] },
      "definition.species",
      "definition.species: give at most 6 species.",
    ],
  ])("%j → %s", (patch, field, message) => {
    expect(failure(patch)).toEqual({ field, message });
  });

  it("refuses expressions above the length and size limits (runaway guard)", () => {
    expect(failure({ reactions: ["a - u", "u" + " + u".repeat(600)] })).toEqual({
      field: "definition.reactions.1",
      message: "definition.reactions.1: Too big: expected string to have <=2000 characters.",
    });
    expect(failure({ reactions: ["a - u", "u" + "+u".repeat(300)] })).toEqual({
      field: "reactions[1]",
      message: "reactions[1] has 601 terms; the limit is 500.",
    });
  });
});
