import { CATALOGUE } from "../../kinetics";
import { CliError, parseOptions, type CliCommand } from "../command";

const command: CliCommand = {
  name: "kinetics",
  summary: "List the catalogue of reaction kinetics (ids, parameters, defaults, sources)",
  help: `Usage: cli kinetics list [--json]

Lists every catalogue kinetics: its stable id, species, form, published source and each
parameter with its meaning, default and allowed range. Use the ids with \`dispersion
--kinetics <id>\` and \`turing-map --kinetics <id>\`.

Options:
  --json    print one JSON object { kinetics: [...] }`,
  async run(args) {
    const { positional } = parseOptions(args);
    if (positional[0] !== "list") throw new CliError('kinetics: unknown action; use "kinetics list".');
    const kinetics = CATALOGUE.map((k) => ({
      id: k.id,
      name: k.name,
      species: k.species,
      form: k.form,
      source: k.source,
      units: k.units,
      reactions: k.reactionExpressions,
      diffusion: k.diffusionExpressions.map((r, i) => r[i]),
      steadyStateForm: k.steadyStateForm ?? null,
      parameters: k.parameters.map((p) => ({
        name: p.name,
        meaning: p.meaning,
        default: p.default,
        min: p.min,
        max: p.max,
      })),
    }));
    const text = kinetics
      .map(
        (k) =>
          `${k.id.padEnd(30)} ${k.name}\n  ${k.form}\n  ${k.parameters.map((p) => `${p.name}=${p.default}`).join(", ")}\n  ${k.source}`,
      )
      .join("\n\n");
    return { json: { kinetics }, text };
  },
};
export default command;
