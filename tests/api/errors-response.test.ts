/**
 * Every route wrapper answers through `errorResponse`: a core error that reaches it (no feature
 * mapper on the way) is a 4xx with the core's message and field, never a 500. Before the one
 * mapper, a SpacingError or SimulationOptionError thrown outside a readout or run plan answered
 * 500 "something went wrong". Statuses are the app's own contract (common practice, no source).
 */
import { describe, expect, it } from "vitest";
import { FitError } from "@/lib/fitting";
import { SimulationOptionError } from "@/lib/simulation";
import { SpacingError } from "@/lib/spacing";
import { errorResponse, route } from "@/lib/server/web/http";

const body = async (r: Response) => (await r.json()) as { error: { code: string; message: string; details?: unknown } };

describe("errorResponse", () => {
  it("answers a table error 422 with its row and column", async () => {
    const r = errorResponse(
      new SpacingError("Row 3: spacing must be a positive number (got -2).", "spacing", 3, "spacing"),
    );
    expect(r.status).toBe(422);
    expect(await body(r)).toEqual({
      error: {
        code: "unprocessable",
        message: "Row 3: spacing must be a positive number (got -2).",
        details: { field: "spacing", row: 3, column: "spacing" },
      },
    });
  });

  it("answers a solver option error 422 naming the field", async () => {
    const r = errorResponse(new SimulationOptionError("grid.cells", "Cells per axis must be a power of two, got 12."));
    expect(r.status).toBe(422);
    expect((await body(r)).error).toMatchObject({ code: "unprocessable", details: { field: "grid.cells" } });
  });

  it("a wrapped handler that throws a fit error answers 422, not 500", async () => {
    const handler = route(async () => {
      throw new FitError("bad_data", "Measurements: give at least one measurement.", "data");
    });
    const r = await handler(new Request("http://127.0.0.1:3000/api/v1/x"), { params: Promise.resolve({}) });
    expect(r.status).toBe(422);
    expect((await body(r)).error.message).toBe("Measurements: give at least one measurement.");
  });

  it("still answers 500 for an error that is a bug", async () => {
    const r = errorResponse(new TypeError("x is undefined"));
    expect(r.status).toBe(500);
    expect((await body(r)).error.code).toBe("internal");
  });
});
