/**
 * The one map from core errors to HTTP: every code of every family answers a non-500 status with
 * the core's message unchanged and the field in `details`. The expected statuses are the ones the
 * four per-feature mappers answered before they became this table (the app's own contract, common
 * practice, no source): 413 for too large, 400 for bad input/options outside fitting and
 * simulation, 422 for what cannot be analysed.
 */
import { describe, expect, it } from "vitest";
import { CoreError } from "@/lib/errors";
import { KineticsInputError } from "@/lib/kinetics";
import { SpacingError } from "@/lib/spacing";
import { CORE_ERROR_HTTP, toAppError, withAppErrors } from "@/lib/server/core-errors";
import { AppError } from "@/lib/server/errors";
import { CODE_LISTS, MESSAGE, sampleCoreErrors } from "./core-error-families";

const EXPECTED_STATUS: Record<string, number> = {
  "readout.zero_area_roi": 422,
  "readout.missing_pixel_size": 422,
  "readout.no_variation": 422,
  "readout.too_large": 413,
  "readout.bad_option": 400,
  "readout.too_small": 422,
  "imaging.too_large": 413,
  "imaging.corrupt": 422,
  "imaging.unsupported": 422,
  "imaging.bad_option": 400,
  "spacing.bad_table": 422,
  "kinetics.bad_input": 400,
  "kinetics.too_large": 413,
  "kinetics.cannot_analyse": 422,
  "fitting.bad_option": 422,
  "fitting.bad_data": 422,
  "fitting.no_turing_region": 422,
  "simulation.bad_option": 422,
  "synthetic.bad_option": 400,
};

describe("core errors → HTTP", () => {
  it.each(sampleCoreErrors())("%s.%s maps to a non-500 status with the message passed through", (family, code, err) => {
    expect(err).toBeInstanceOf(CoreError);
    const app = toAppError(err);
    expect(app, `${family}.${code} is not mapped`).toBeInstanceOf(AppError);
    expect(app!.status).toBeLessThan(500);
    expect(app!.status).toBe(EXPECTED_STATUS[`${family}.${code}`]);
    expect(app!.message).toBe(MESSAGE);
    expect((app!.details as { field?: string }).field).toBe(err.field);
  });

  it("the table covers exactly the codes each family exports", () => {
    for (const [family, codes] of Object.entries(CODE_LISTS)) {
      expect(Object.keys(CORE_ERROR_HTTP[family as keyof typeof CODE_LISTS]).sort()).toEqual([...codes].sort());
    }
    expect(Object.keys(CORE_ERROR_HTTP).sort()).toEqual(Object.keys(CODE_LISTS).sort());
    expect(sampleCoreErrors().length).toBe(Object.keys(EXPECTED_STATUS).length);
  });

  it("keeps each family's details: the row and column of a table, the code of a fit", () => {
    expect(toAppError(new SpacingError(MESSAGE, "spacing", 3, "spacing"))!.details).toEqual({
      field: "spacing",
      row: 3,
      column: "spacing",
    });
    const fit = sampleCoreErrors().find(([f]) => f === "fitting")![2];
    expect(toAppError(fit)!.details).toEqual({ field: "parameters.d.start", code: fit.code });
  });

  it("passes an AppError through and knows nothing else (a bug answers 500)", () => {
    const app = new AppError("conflict", "taken");
    expect(toAppError(app)).toBe(app);
    expect(toAppError(new Error("boom"))).toBeNull();
    expect(toAppError(new RangeError("FFT size must be a power of two"))).toBeNull();
  });

  it("withAppErrors rethrows a core error as its AppError and anything else unchanged", () => {
    expect(() =>
      withAppErrors(() => {
        throw new KineticsInputError("parameters.a", "parameters.a must be positive.");
      }),
    ).toThrow(expect.objectContaining({ code: "bad_input", status: 400, message: "parameters.a must be positive." }));
    const boom = new Error("boom");
    expect(() =>
      withAppErrors(() => {
        throw boom;
      }),
    ).toThrow(boom);
  });
});
