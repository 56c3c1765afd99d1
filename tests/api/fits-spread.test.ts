/**
 * "Plus the spread between specimens": each datum's uncertainty becomes √(u² + s²) with s the
 * condition's sample SD, in the stored spec and its provenance (hand-computed; common practice,
 * no source).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { FitDetailDto } from "@/lib/server/fits/fits";
import { cancelJob } from "@/lib/server/jobs/queue";
import { call, discoverRoutes } from "../support/api";
import { startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";

let stack: TestStack;
let w: World;
let routes: Awaited<ReturnType<typeof discoverRoutes>>;
beforeAll(async () => {
  stack = await startTestStack();
  w = await makeWorld();
  routes = await discoverRoutes();
});
afterAll(async () => stack?.close());

const body = (uncertainty?: string) => ({
  name: "Spread",
  data: [
    { condition: "control", kind: "fourier", wavelengthUm: 40, uncertaintyUm: 0.1 },
    { condition: "control", kind: "fourier", wavelengthUm: 42, uncertaintyUm: 0.1 },
    { condition: "treated", kind: "fourier", wavelengthUm: 50, uncertaintyUm: 0.2 },
    { condition: "treated", kind: "fourier", wavelengthUm: 53, uncertaintyUm: 0.2 },
  ],
  models: [
    {
      kinetics: "schnakenberg",
      lengthScaleUm: 40,
      parameters: { gamma: { mode: "per-condition", start: 100, lower: 10, upper: 1000, log: true } },
    },
  ],
  options: { profiles: false },
  ...(uncertainty ? { uncertainty } : {}),
});
const start = (json: unknown) =>
  call(routes.get("POST /api/v1/labs/[labId]/fits")!, "POST", "/api/v1/labs/[labId]/fits", {
    token: w.people.modeller.token,
    params: { labId: w.labId },
    json,
  });

describe("fit uncertainty with the spread between specimens", () => {
  it("adds each condition's SD in quadrature and records it", async () => {
    const res = await start(body("with-specimen-spread"));
    expect(res.status).toBe(202);
    const fit = (await res.json()) as FitDetailDto;
    await cancelJob(w.labId, fit.jobId!).catch(() => undefined); // the spec is what is checked here
    // control: SD{40, 42} = √2, √(0.01 + 2) = 1.417744688; treated: SD{50, 53} = 2.121320344, √(0.04 + 4.5) = 2.130727575.
    expect(fit.spec.data.map((d) => Number(d.uncertaintyUm.toFixed(9)))).toEqual([
      1.417744688, 1.417744688, 2.130727575, 2.130727575,
    ]);
    expect(fit.provenance.settings.uncertainty).toBe("with-specimen-spread");
    expect(fit.provenance.settings.specimenSpreadUm).toBe("control: SD 1.41 µm (n = 2); treated: SD 2.12 µm (n = 2)");
  });

  it("adds the spread by default, keeps the data's own uncertainties on request, and refuses an unknown choice", async () => {
    const byDefault = (await (await start(body())).json()) as FitDetailDto;
    await cancelJob(w.labId, byDefault.jobId!).catch(() => undefined);
    expect(byDefault.spec.data.map((d) => Number(d.uncertaintyUm.toFixed(9)))).toEqual([
      1.417744688, 1.417744688, 2.130727575, 2.130727575,
    ]);
    expect(byDefault.provenance.settings.uncertainty).toBe("with-specimen-spread");
    const res = await start(body("per-readout"));
    const fit = (await res.json()) as FitDetailDto;
    await cancelJob(w.labId, fit.jobId!).catch(() => undefined); // the spec is what is checked here
    expect(fit.spec.data.map((d) => d.uncertaintyUm)).toEqual([0.1, 0.1, 0.2, 0.2]);
    expect(fit.provenance.settings.uncertainty).toBe("per-readout");
    const bad = await start(body("guess"));
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as { error: { message: string } }).error.message).toBe(
      'Uncertainty of each condition must be "per-readout" or "with-specimen-spread"',
    );
  });

  it("takes “Control” and “ CONTROL” as one condition, spelled as first given", async () => {
    const b = body("with-specimen-spread");
    b.data[1] = { ...b.data[1], condition: " CONTROL" };
    b.data[0] = { ...b.data[0], condition: "Control" };
    const res = await start(b);
    expect(res.status).toBe(202);
    const fit = (await res.json()) as FitDetailDto;
    await cancelJob(w.labId, fit.jobId!).catch(() => undefined);
    expect(fit.spec.data.map((d) => d.condition)).toEqual(["Control", "Control", "treated", "treated"]);
    // One condition, so one spread: SD{40, 42} = √2 as above (hand-computed; common practice, no source).
    expect(fit.provenance.settings.specimenSpreadUm).toBe("Control: SD 1.41 µm (n = 2); treated: SD 2.12 µm (n = 2)");
  });
});
