/**
 * Reader for the NIST StRD nonlinear-regression `.dat` files, committed unchanged under
 * `tests/fixtures/nist/` (CRLF line endings; source and licence in its README.md), and the model
 * of each dataset, written from the formula printed in its own file.
 */
import { readFileSync } from "node:fs";
import path from "node:path";

export const NIST_DIR = path.resolve(import.meta.dirname, "../../fixtures/nist");
export const NIST_URL = "https://www.itl.nist.gov/div898/strd/";

export interface NistDataset {
  name: string;
  starts: [number[], number[]];
  certified: number[];
  certifiedSd: number[];
  residualSumOfSquares: number;
  residualSd: number;
  x: number[];
  y: number[];
}

/** Parse one `.dat` file: the `bN = start1 start2 certified sd` rows, the RSS, and the data block. */
export function parseNistFile(text: string, name: string): NistDataset {
  const lines = text.split(/\r?\n/);
  const starts: [number[], number[]] = [[], []];
  const certified: number[] = [];
  const certifiedSd: number[] = [];
  let rss = NaN;
  let rsd = NaN;
  let dataAt = -1;
  lines.forEach((line, i) => {
    const b = /^\s*b\d+\s*=\s*(\S+)\s+(\S+)\s+(\S+)\s+(\S+)\s*$/.exec(line);
    if (b) {
      starts[0].push(Number(b[1]));
      starts[1].push(Number(b[2]));
      certified.push(Number(b[3]));
      certifiedSd.push(Number(b[4]));
    }
    const s = /^Residual Sum of Squares:\s+(\S+)/.exec(line);
    if (s) rss = Number(s[1]);
    const d = /^Residual Standard Deviation:\s+(\S+)/.exec(line);
    if (d) rsd = Number(d[1]);
    if (/^Data:\s+y\s+x\s*$/.test(line)) dataAt = i + 1;
  });
  const x: number[] = [];
  const y: number[] = [];
  for (const line of lines.slice(dataAt)) {
    const parts = line.trim().split(/\s+/).filter(Boolean);
    if (parts.length !== 2) continue;
    y.push(Number(parts[0]));
    x.push(Number(parts[1]));
  }
  return { name, starts, certified, certifiedSd, residualSumOfSquares: rss, residualSd: rsd, x, y };
}

export function readNist(name: string): NistDataset {
  return parseNistFile(readFileSync(path.join(NIST_DIR, `${name}.dat`), "utf8"), name);
}

type Model = (b: readonly number[], x: number) => number;

/** Each dataset's model, transcribed from the "Model:" section of its file. */
export const NIST_MODELS: Record<string, Model> = {
  // y = b1*(1-exp[-b2*x])
  Misra1a: (b, x) => b[0] * (1 - Math.exp(-b[1] * x)),
  // y = exp(-b1*x)/(b2+b3*x)
  Chwirut2: (b, x) => Math.exp(-b[0] * x) / (b[1] + b[2] * x),
  // y = b1*x**b2
  DanWood: (b, x) => b[0] * x ** b[1],
  // y = b1 * (1-(1+2*b2*x)**(-.5))
  Misra1c: (b, x) => b[0] * (1 - (1 + 2 * b[1] * x) ** -0.5),
  // y = b1 - b2*x - arctan[b3/(x-b4)]/pi
  Roszman1: (b, x) => b[0] - b[1] * x - Math.atan(b[2] / (x - b[3])) / Math.PI,
  // y = (b1 + b2*x + b3*x**2) / (1 + b4*x + b5*x**2)
  Kirby2: (b, x) => (b[0] + b[1] * x + b[2] * x ** 2) / (1 + b[3] * x + b[4] * x ** 2),
  // y = b1*(x**2+x*b2) / (x**2+x*b3+b4)
  MGH09: (b, x) => (b[0] * (x ** 2 + x * b[1])) / (x ** 2 + x * b[2] + b[3]),
  // y = (b1 + b2*x + b3*x**2 + b4*x**3) / (1 + b5*x + b6*x**2 + b7*x**3)
  Thurber: (b, x) => (b[0] + b[1] * x + b[2] * x ** 2 + b[3] * x ** 3) / (1 + b[4] * x + b[5] * x ** 2 + b[6] * x ** 3),
  // y = (b1/b2) * exp[-0.5*((x-b3)/b2)**2]
  Eckerle4: (b, x) => (b[0] / b[1]) * Math.exp(-0.5 * ((x - b[2]) / b[1]) ** 2),
  // y = b1*(1-exp[-b2*x])
  BoxBOD: (b, x) => b[0] * (1 - Math.exp(-b[1] * x)),
  // y = b1 / ((1+exp[b2-b3*x])**(1/b4))
  Rat43: (b, x) => b[0] / (1 + Math.exp(b[1] - b[2] * x)) ** (1 / b[3]),
};

/** NIST's log relative error, −log₁₀(|est − cert|/|cert|), capped at 15 (full double agreement). */
export function logRelativeError(estimate: number, certified: number): number {
  const rel = Math.abs(estimate - certified) / Math.abs(certified);
  if (!Number.isFinite(rel)) return 0;
  return rel === 0 ? 15 : Math.min(15, Math.max(0, -Math.log10(rel)));
}
