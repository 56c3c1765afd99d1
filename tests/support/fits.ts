/**
 * What the fit API tests share: the fit routes as a member, the round-trip data generated from
 * known Schnakenberg parameters (the generating parameters are the source), starting a fit and
 * waiting for it, and a member's inbox. Finished jobs mail at once (JOB_MAIL_AFTER_S = 0).
 */
import { expect } from "vitest";
import { createKineticsPredictor } from "@/lib/fitting/kinetics-predictor";
import { getCatalogueKinetics } from "@/lib/kinetics";
import type { FitCreateInput } from "@/lib/contracts/fit";
import type { FitDetailDto } from "@/lib/server/fits/fits";
import { waitForJob } from "@/lib/server/jobs/queue";
import { setupLabApi } from "./lab-api";
import type { Person } from "./world";

export const FITS = "/api/v1/labs/[labId]/fits";

/** Schnakenberg's 2π/k* in µm at ℓ = 40 µm (the generating model of every synthetic datum). */
export const schnakenberg = createKineticsPredictor(getCatalogueKinetics("schnakenberg"), { lengthScaleUm: 40 });
export const lambdaUm = (p: Record<string, number>) =>
  schnakenberg({ a: 0.1, b: 0.9, d: 20, ...p }, "", undefined)!.wavelengthUm;
// Generating parameters: γ = 180 (control), 120 (inhibitor); a = 0.1, b = 0.9, d = 20 fixed.
export const TRUE_GAMMA = { control: 180, inhibitor: 120 };
export const roundTripData = Object.entries(TRUE_GAMMA).flatMap(([condition, gamma]) => {
  const l = lambdaUm({ gamma });
  // Two measurements per condition, ±1 % around the model value (symmetric, so the mean is exact).
  return [0.99, 1.01].map((f) => ({
    condition,
    kind: "fourier" as const,
    wavelengthUm: l * f,
    uncertaintyUm: 0.02 * l,
  }));
});
export const gammaPerCondition = {
  gamma: { mode: "per-condition" as const, start: 100, lower: 10, upper: 1000, log: true },
};
export const roundTrip: FitCreateInput = {
  name: "Round trip",
  data: roundTripData,
  // The hand-computed χ² of the round trip weighs each datum by its own uncertainty only.
  uncertainty: "per-readout",
  models: [
    {
      kinetics: "schnakenberg",
      lengthScaleUm: 40,
      parameters: { ...gammaPerCondition, d: { mode: "fixed", value: 20 } },
    },
  ],
};

export function setupFitsLab() {
  const lab = setupLabApi({
    who: "modeller",
    before: () => {
      process.env.JOB_MAIL_AFTER_S = "0";
    },
    after: () => {
      delete process.env.JOB_MAIL_AFTER_S;
    },
  });
  async function api(
    method: "GET" | "POST",
    path: string,
    o: { who?: Person; params?: Record<string, string>; json?: unknown; query?: string } = {},
  ) {
    const res = await lab.raw(method, path, {
      who: o.who ?? "modeller",
      params: o.params,
      json: o.json,
      query: o.query,
    });
    return { status: res.status, res };
  }
  async function startAndWait(body: unknown, who?: Person): Promise<FitDetailDto> {
    const r = await api("POST", FITS, { json: body, who });
    expect(r.status, await r.res.clone().text()).toBe(202);
    const fit = (await r.res.json()) as FitDetailDto;
    const job = await waitForJob(fit.jobId!, 60_000);
    expect(job.status, job.error ?? "").toBe("succeeded");
    const got = await api("GET", `${FITS}/[fitId]`, { params: { fitId: fit.id }, who });
    return (await got.res.json()) as FitDetailDto;
  }

  async function inbox(email: string): Promise<{ subject: string; text: string }[]> {
    const res = await fetch(`${lab.stack.mailboxUrl}/messages?to=${encodeURIComponent(email)}`);
    return ((await res.json()) as { messages: { subject: string; text: string }[] }).messages;
  }
  return { lab, api, startAndWait, inbox };
}
