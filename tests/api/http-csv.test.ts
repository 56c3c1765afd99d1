/**
 * CSV formula injection: every CSV the app writes (the fit export and the study's condition
 * comparison) prefixes a cell that a spreadsheet would run as a formula with a single quote.
 * Rule: OWASP "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection): cells starting
 * with =, +, -, @, tab or carriage return; plain numbers stay numbers (the product's decision).
 */
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import type { FitDetailDto } from "@/lib/server/fits/fits";
import { comparisonToCsv } from "@/lib/server/readouts/comparison-csv";
import type { ConditionComparison } from "@/lib/server/readouts/comparison-types";
import { csvCell, csvComment } from "@/lib/server/web/csv";
import { fitToCsv } from "@/lib/server/fits/export-csv";

const EVIL = ['=HYPERLINK("http://evil.test","x")', "+SUM(1,2)", "-2+3", "@cmd", "\t=1+1", "\r=1+1"];

describe("csvCell", () => {
  it.each([
    ["=1+1", "'=1+1"],
    ["+SUM(1,2)", '"\'+SUM(1,2)"'],
    ["-2+3", "'-2+3"],
    ["@cmd", "'@cmd"],
    ["\t=1", "'\t=1"],
    ["\r=1", '"\'\r=1"'],
    ["-Infinity", "'-Infinity"],
    ["control", "control"],
    ["a=b", "a=b"],
  ])("%j → %j", (input, written) => {
    expect(csvCell(input)).toBe(written);
  });

  it.each([-1.5, "-1.5", "+2", "3e-7", "-4E+2", 0, -0.001, ".5", "-.5"])("a plain number stays a number: %j", (n) => {
    expect(csvCell(n)).toBe(String(n));
  });

  it("a comment line cannot break onto a line of its own", () => {
    expect(csvComment("study\n=1+1")).toBe("# study =1+1");
  });
});

/** Every parsed cell of a CSV text (comment lines skipped). */
const cells = (text: string) => Papa.parse<string[]>(text, { comments: "#", skipEmptyLines: true }).data.flat();
const startsFormula = (s: string) => /^[=+\-@\t\r]/.test(s) && !/^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/.test(s);

describe("the study comparison CSV", () => {
  it("writes condition, specimen and file names as text, numbers (also negative) as numbers", () => {
    const point = (i: number) => ({
      condition: EVIL[i % EVIL.length],
      specimenId: "s",
      specimenLabel: EVIL[(i + 1) % EVIL.length],
      uploadId: "u",
      filename: EVIL[(i + 2) % EVIL.length],
      readoutId: "r",
      measure: "fourier" as const,
      wavelengthUm: -1.5,
      uncertaintyUm: 0.25,
      pixelSizeUm: 0.5,
      readoutCreatedAt: "2026-01-01T00:00:00.000Z",
    });
    const c = {
      studyId: "s",
      studyName: "=evil\n=1+1",
      conditions: [],
      excluded: [],
      measures: {},
      warnings: [],
      replicate: "specimen",
      groups: [
        {
          condition: EVIL[0],
          n: 6,
          nSpecimens: 1,
          nImages: EVIL.length,
          specimens: [{ specimenId: "s", specimenLabel: EVIL[1], wavelengthUm: -1.5, images: EVIL.length }],
          meanUm: -2,
          sdUm: 1,
          semUm: 0.5,
          ci95Um: [-3, -1] as [number, number],
          points: EVIL.map((_, i) => point(i)),
        },
      ],
      test: { a: "=a\n=2+2", b: "b", welch: null, note: null },
    } as unknown as ConditionComparison;
    const text = comparisonToCsv(c);
    expect(text.split("\n").filter((l) => /^[=+\-@\t\r]/.test(l))).toEqual([]);
    const all = cells(text);
    expect(all.filter(startsFormula)).toEqual([]);
    for (const e of EVIL) expect(all).toContain(`'${e}`);
    const rows = Papa.parse<Record<string, string>>(text, { header: true, comments: "#", skipEmptyLines: true }).data;
    expect(rows[0].wavelength_um).toBe("-1.5");
    expect(rows[0].condition_ci95_low_um).toBe("-3");
  });
});

describe("the fit CSV", () => {
  it("writes kinetics labels and conditions as text, numbers as numbers", () => {
    const fit = {
      id: "f",
      name: "=fit",
      softwareVersion: "1",
      inputSha256: "x",
      provenance: { data: [{ readoutId: "@r" }] },
      result: {
        comparison: {
          ranking: [
            {
              rank: 1,
              label: "+label",
              aicc: -10.5,
              deltaAicc: 0,
              akaikeWeight: 1,
              bic: -9,
              chiSquare: 1,
              p: 2,
              verdict: "-best",
            },
          ],
        },
        models: [
          {
            label: "+label",
            fit: {
              n: 4,
              p: 2,
              chiSquare: 1,
              reducedChiSquare: 0.5,
              aicc: -10.5,
              bic: -9,
              identifiability: { identifiable: true },
              verdict: "=ok",
              parameters: [
                {
                  parameter: "@gamma",
                  condition: "-treated",
                  value: -0.25,
                  standardError: 0.1,
                  interval95: null,
                  log: false,
                  atBound: false,
                },
              ],
              residuals: [
                {
                  index: 0,
                  condition: "\t=c",
                  kind: "fourier",
                  measuredUm: 10,
                  measuredFourierUm: 10,
                  uncertaintyFourierUm: 1,
                  predictedUm: 10.5,
                  residual: -0.5,
                  turing: true,
                },
              ],
            },
          },
        ],
      },
    } as unknown as FitDetailDto;
    const text = fitToCsv(fit);
    const all = cells(text);
    expect(all.filter(startsFormula)).toEqual([]);
    for (const e of ["'+label", "'@gamma", "'-treated", "'\t=c", "'=ok", "'-best", "'@r"]) expect(all).toContain(e);
    for (const n of ["-0.25", "-10.5", "-0.5", "-9"]) expect(all).toContain(n);
  });
});
