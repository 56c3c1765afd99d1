import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import command from "@/lib/cli/commands/simulate";
import { CliError } from "@/lib/cli/command";

const dir = mkdtempSync(path.join(tmpdir(), "sim-cli-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function writeSpec(spec: unknown): string {
  const file = path.join(dir, `spec-${Math.random().toString(36).slice(2)}.json`);
  writeFileSync(file, JSON.stringify(spec));
  return file;
}

describe("cli simulate", () => {
  it("runs a catalogue kinetics, writes raw fields, PNGs and result.json, and reports a readout", async () => {
    const spec = writeSpec({
      kinetics: { catalogue: "schnakenberg" },
      parameters: { gamma: 1, a: 0.1, b: 0.9, d: 40 },
      grid: { lengthUm: [40, 40], cells: [32, 32] },
      endTimeS: 20,
      initial: { seed: 2 },
      scales: { lengthScaleUm: 3, timeScaleS: 60 },
    });
    const out = path.join(dir, "out");
    const { json } = (await command.run(["--spec", spec, "--out", out], { json: true })) as {
      json: Record<string, unknown>;
    };
    expect(json).toMatchObject({
      kinetics: "schnakenberg",
      stopReason: "end-time",
      steps: 200,
      timeS: 20,
      seed: "2",
      lengthUnit: "model",
    });
    expect((json.fields as { species: string }[]).map((f) => f.species)).toEqual(["u", "v"]);
    expect(json.readout).toHaveProperty("periodFound");
    // SCIENCE.md §3: physical time = model time × τ.
    expect(json.physical).toMatchObject({ timeS: 20 * 60, lengthScaleUm: 3, timeScaleS: 60 });
    const raw = readFileSync(path.join(out, "final-u.f64"));
    expect(raw.byteLength).toBe(32 * 32 * 8);
    // The mean written in the summary equals the mean of the raw field (same data).
    const field = new Float64Array(raw.buffer, raw.byteOffset, 32 * 32);
    expect((json.fields as { mean: number }[])[0].mean).toBeCloseTo(
      field.reduce((a, b) => a + b, 0) / field.length,
      12,
    );
    expect(existsSync(path.join(out, "final-v.png"))).toBe(true);
    expect(JSON.parse(readFileSync(path.join(out, "result.json"), "utf8")).steps).toBe(200);
  });

  it.each([
    [[], "Give --spec RUN.json."],
    [["--spec", "/nonexistent/run.json"], /^Cannot read \/nonexistent\/run.json as JSON/],
    [["--spec", "SPEC", "--threads", "3"], "--threads must be 1 or 2 (got 3)."],
  ])("%j fails with a CliError", async (args, message) => {
    const spec = writeSpec({
      kinetics: { catalogue: "schnakenberg" },
      grid: { lengthUm: [10], cells: [16] },
      endTimeS: 1,
    });
    const argv = (args as string[]).map((a) => (a === "SPEC" ? spec : a));
    const p = command.run(argv, { json: true });
    await expect(p).rejects.toBeInstanceOf(CliError);
    await expect(p).rejects.toThrow(message);
  });

  it("passes solver option errors through as CliError with the solver's sentence", async () => {
    const spec = writeSpec({
      kinetics: { catalogue: "schnakenberg" },
      grid: { lengthUm: [10], cells: [12] },
      endTimeS: 1,
    });
    await expect(command.run(["--spec", spec], { json: true })).rejects.toThrow(
      "grid.cells[0] must be a power of two (fft.js sizes), got 12; use 8 or 16.",
    );
  });

  it("continues from chosen initial fields: 20 s then 10 s from the written fields equals 30 s in one go, to the bit", async () => {
    // A one-step scheme restarted from its own state repeats the same steps (common practice, no source).
    const base = {
      kinetics: { catalogue: "schnakenberg" },
      parameters: { gamma: 1, a: 0.1, b: 0.9, d: 40 },
      grid: { lengthUm: [20, 20], cells: [16, 16] },
      dtS: 0.01,
      scheme: "implicit-euler",
    };
    const first = path.join(dir, "first"),
      whole = path.join(dir, "whole"),
      second = path.join(dir, "second");
    await command.run(["--spec", writeSpec({ ...base, endTimeS: 20, initial: { seed: 9 } }), "--out", first], {
      json: true,
    });
    await command.run(["--spec", writeSpec({ ...base, endTimeS: 30, initial: { seed: 9 } }), "--out", whole], {
      json: true,
    });
    const cont = path.join(first, "continue.json");
    writeFileSync(
      cont,
      JSON.stringify({ ...base, endTimeS: 10, initial: { fieldFiles: ["final-u.f64", "final-v.f64"] } }),
    );
    const { json } = (await command.run(["--spec", cont, "--out", second], { json: true })) as {
      json: Record<string, unknown>;
    };
    expect(json).toMatchObject({ steps: 1000, seed: null });
    for (const f of ["final-u.f64", "final-v.f64"])
      expect(readFileSync(path.join(second, f)).equals(readFileSync(path.join(whole, f)))).toBe(true);
    // Seeded noise on top of given fields is recorded and changes the result.
    writeFileSync(
      cont,
      JSON.stringify({
        ...base,
        endTimeS: 10,
        initial: { fieldFiles: ["final-u.f64", "final-v.f64"], noiseAmplitude: 0.01, seed: 4 },
      }),
    );
    const noisy = (await command.run(["--spec", cont], { json: true })) as {
      json: { seed: string; fields: { mean: number }[] };
    };
    expect(noisy.json.seed).toBe("4");
    expect(noisy.json.fields[0].mean).not.toBe((json.fields as { mean: number }[])[0].mean);
  });

  it.each([
    [
      { fieldFiles: ["short.f64", "short.f64"] },
      "initial.fieldFiles[0] (short.f64) has 80 bytes; the grid 16 × 16 needs 2048 (8 bytes of float64 per cell).",
    ],
    [{ fieldFiles: ["short.f64"] }, "initial.fieldFiles must list 2 files (one per species), got 1."],
    [{ fieldFiles: ["missing.f64", "missing.f64"] }, "initial.fieldFiles[0]: cannot read missing.f64 (ENOENT)."],
    [{ fields: [[1], [2]], fieldFiles: ["a", "b"] }, "initial: give fields or fieldFiles, not both."],
    [
      {
        fields: [
          [1, 2],
          [3, 4],
        ],
      },
      "initial.fields[0] must have 256 values (one per cell), got 2.",
    ],
  ])("refuses a bad chosen initial field: %j", async (initial, message) => {
    writeFileSync(path.join(dir, "short.f64"), Buffer.alloc(80));
    const spec = writeSpec({
      kinetics: { catalogue: "schnakenberg" },
      grid: { lengthUm: [20, 20], cells: [16, 16] },
      endTimeS: 1,
      initial,
    });
    await expect(command.run(["--spec", spec], { json: true })).rejects.toThrow(message);
  });
});
