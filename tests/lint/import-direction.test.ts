/**
 * The import-direction rule keeps the numerical core free of framework imports (DEVELOPERS.md).
 * Lints probe sources as if they sat in the tree, so the rule itself is shown to fire.
 */
import path from "node:path";
import { ESLint } from "eslint";
import { describe, expect, it } from "vitest";

const ROOT = path.resolve(import.meta.dirname, "../..");
const eslint = new ESLint({ cwd: ROOT });
const lint = async (file: string, code: string) => {
  const [r] = await eslint.lintText(code, { filePath: path.join(ROOT, file) });
  return r.messages.map((m) => m.ruleId);
};

describe("import direction", () => {
  it("refuses framework, server and file-system imports in lib/<science>", async () => {
    expect(await lint("lib/readout/probe.ts", 'import React from "react";\nexport const a = React;\n')).toContain(
      "no-restricted-imports",
    );
    expect(
      await lint(
        "lib/kinetics/probe.ts",
        'import { database } from "@/lib/server/services";\nexport const a = database;\n',
      ),
    ).toContain("no-restricted-imports");
    expect(
      await lint("lib/fitting/probe.ts", 'import { readFileSync } from "node:fs";\nexport const a = readFileSync;\n'),
    ).toContain("no-restricted-imports");
    expect(await lint("lib/stability/probe.ts", "export const a = process.env.X;\n")).toContain(
      "no-restricted-properties",
    );
  });

  it("allows numeric packages and other core folders there", async () => {
    expect(
      await lint(
        "lib/readout/probe.ts",
        'import { Matrix } from "ml-matrix";\nimport { fft2dInPlace } from "@/lib/fft";\nexport const a = [Matrix, fft2dInPlace];\n',
      ),
    ).toEqual([]);
  });

  it("keeps the fakes out of the app", async () => {
    expect(
      await lint(
        "lib/server/probe.ts",
        'import { startFakeS3 } from "@/fake-services/fake-s3";\nexport const a = startFakeS3;\n',
      ),
    ).toContain("no-restricted-imports");
  });
});
