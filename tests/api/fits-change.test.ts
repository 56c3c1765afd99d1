/**
 * "Change and re-run" of a fit: the builder filled in from a stored fit holds its data (a readout,
 * typed measurements with their own uncertainties, a tissue size), kinetics and every parameter
 * setting, replicate and uncertainty choices and options; sent unchanged it asks for exactly the
 * same stored spec (same SHA-256). The new fit records where it came from and both fits link;
 * the original is not changed; a foreign or unknown fit to change from is refused with nothing written.
 */
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { requireLab, type LabContext } from "@/lib/server/access";
import type { FitDetailDto } from "@/lib/server/fits/fits";
import { loadNewFitPage } from "@/lib/server/fits/pages";
import { database } from "@/lib/server/services";
import { startingDrafts } from "@/app/(lab)/labs/[labId]/fits/new/fit-prefill-drafts";
import { buildFitBody } from "@/app/(lab)/labs/[labId]/fits/new/fit-request-body";
import { listConditions } from "@/app/(lab)/labs/[labId]/fits/new/fit-data-drafts";
import { FITS, lambdaUm, setupFitsLab } from "../support/fits";
import { makeWorld } from "../support/world";

const { lab, api, startAndWait } = setupFitsLab();
let ctx: LabContext;
let original: FitDetailDto;
let readoutId: string;

// Typed measurements as a person types them (invented demo numbers around Schnakenberg's 2π/k*).
const TYPED = [
  { condition: "control", kind: "fourier" as const, wavelengthUm: 38.2, uncertaintyUm: 0.7 },
  { condition: "inhibitor", kind: "fourier" as const, wavelengthUm: 47.5, uncertaintyUm: 0.9 },
  { condition: "inhibitor", kind: "fourier" as const, wavelengthUm: 48.9, uncertaintyUm: 1.1 },
];

const CONTROL_TISSUE = { kind: "interval" as const, length: 600 };

async function makeReadout(): Promise<string> {
  const m = await database();
  const by = lab.w.people.manager.userId;
  const study = await m.Study.create({
    labId: lab.w.labId,
    name: "Placodes",
    tissue: "skin",
    organism: "chick",
    description: null,
    createdBy: by,
  });
  const specimen = await m.Specimen.create({
    labId: lab.w.labId,
    studyId: study.id,
    label: "DS-3",
    condition: "control",
    stage: null,
    genotype: null,
    notes: null,
    createdBy: by,
  });
  const upload = await m.Upload.create({
    id: randomUUID(),
    labId: lab.w.labId,
    specimenId: specimen.id,
    filename: "stripes.tif",
    storageKey: `test/${specimen.id}`,
    sizeBytes: 1,
    sha256: "c".repeat(64),
    kind: "image",
    contentType: "image/tiff",
    pixelSizeUm: 2,
    pixelSizeSource: "uploader",
    createdBy: by,
  } as never);
  const lambda = lambdaUm({ gamma: 180 });
  const readout = await m.Readout.create({
    labId: lab.w.labId,
    uploadId: upload.id,
    specimenId: specimen.id,
    jobId: null,
    status: "succeeded",
    kind: "image",
    settings: {},
    result: {
      type: "image",
      wavelength: {
        wavelengthUm: lambda,
        uncertaintyUm: 0.5,
        periodFound: true,
        significance: 40,
        symmetry: "stripes",
      },
    } as never,
    wavelengthUm: lambda,
    uncertaintyUm: 0.5,
    periodFound: true,
    pixelSizeUm: 2,
    inputSha256: "d".repeat(64),
    softwareVersion: "morphokin test",
    createdBy: by,
  });
  return readout.id;
}

beforeAll(async () => {
  ctx = await requireLab(lab.w.people.modeller.actor, lab.w.labId);
  readoutId = await makeReadout();
  original = await startAndWait({
    name: "Placode spacing",
    // The builder sets a tissue size per condition, so every control datum carries it.
    data: [
      { readoutId, condition: "control", domain: CONTROL_TISSUE },
      { ...TYPED[0], domain: CONTROL_TISSUE },
      TYPED[1],
      TYPED[2],
    ],
    models: [
      {
        kinetics: "schnakenberg",
        lengthScaleUm: 40,
        gridSize: 64,
        parameters: {
          gamma: { mode: "per-condition", start: 150, lower: 20, upper: 900, log: true },
          d: { mode: "fixed", value: 20 },
        },
      },
    ],
    options: { profiles: false, seed: "placodes", seededStarts: 2 },
    uncertainty: "with-specimen-spread",
    replicates: "specimens",
  });
}, 90_000);

describe("the builder filled in from a fit", () => {
  it("holds the fit's readout, typed measurements with their own uncertainties, tissue size, settings and options", async () => {
    const { prefill } = await loadNewFitPage(ctx, { from: original.id });
    expect(prefill!.fromFit).toEqual({ id: original.id, name: "Placode spacing" });
    expect(prefill!.name).toBe("Placode spacing (changed)");
    expect(prefill!.picks).toEqual([{ readoutId, condition: "control", kind: "fourier" }]);
    // The stored uncertainties are √(u² + SD²) (with-specimen-spread); the typed u come back as typed.
    expect(prefill!.typed).toEqual(
      TYPED.map((t) => ({ ...t, wavelengthUm: String(t.wavelengthUm), uncertaintyUm: String(t.uncertaintyUm) })),
    );
    expect(prefill!.tissues).toEqual({ control: { kind: "interval", a: "600", b: "" } });
    expect(prefill!.models).toHaveLength(1);
    expect(prefill!.models[0]).toMatchObject({
      kinetics: "schnakenberg",
      lengthScaleUm: "40",
      timeScaleS: "",
      gridSize: 64,
    });
    expect(prefill!.models[0].params.gamma).toEqual({
      mode: "per-condition",
      value: "150",
      start: "150",
      lower: "20",
      upper: "900",
      log: true,
    });
    expect(prefill!.models[0].params.d).toMatchObject({ mode: "fixed", value: "20" });
    // Left out of the request, a is written down at its catalogue default (0.1) and comes back so.
    expect(prefill!.models[0].params.a).toMatchObject({ mode: "fixed", value: "0.1" });
    expect(prefill!.profiles).toBe(false);
    expect(prefill!.otherOptions).toEqual({ seed: "placodes", seededStarts: 2 });
    expect(prefill!.uncertainty).toBe("with-specimen-spread");
    expect(prefill!.replicates).toBe("specimens");
    expect(prefill!.notes).toEqual([]);
  });

  it("sent unchanged, asks for exactly the same stored spec (same SHA-256), as a new fit that links back", async () => {
    const data = await loadNewFitPage(ctx, { from: original.id });
    const first = data.kinetics.find((k) => k.id === "schnakenberg")!;
    const d = startingDrafts(data.candidates, first, data.prefill);
    const body = buildFitBody({
      ...d,
      candidates: data.candidates,
      conditions: listConditions(d.picks, d.typed),
      kinetics: data.kinetics,
      otherOptions: data.prefill!.otherOptions,
      changedFrom: data.prefill!.fromFit.id,
    });
    const r = await api("POST", FITS, { json: body });
    expect(r.status, await r.res.clone().text()).toBe(202);
    const changed = (await r.res.json()) as FitDetailDto;
    expect(changed.inputSha256).toBe(original.inputSha256);
    expect(changed.name).toBe("Placode spacing (changed)");
    expect(changed.changedFrom).toEqual({ id: original.id, name: "Placode spacing", status: "succeeded" });
    expect(changed.rerunOf).toBeNull();
    const back = (await (
      await api("GET", `${FITS}/[fitId]`, { params: { fitId: original.id } })
    ).res.json()) as FitDetailDto;
    expect(back.changedInto.map((x) => x.id)).toEqual([changed.id]);
    expect(back.changedFrom).toBeNull();
    // The original is as it was: results are immutable.
    expect(back.inputSha256).toBe(original.inputSha256);
    expect(back.result).toEqual(original.result);
    const m = await database();
    const audit = await m.AuditEvent.findOne({ where: { targetId: changed.id } });
    expect(audit?.summary).toMatch(/changed and re-ran the fit “Placode spacing \(changed\)”/);
  }, 60_000);

  it("a bound changed in the builder changes the spec, and the link still holds", async () => {
    const data = await loadNewFitPage(ctx, { from: original.id });
    const d = startingDrafts(data.candidates, data.kinetics[0], data.prefill);
    d.models[0].params.gamma = { ...d.models[0].params.gamma, upper: "800" };
    const body = buildFitBody({
      ...d,
      candidates: data.candidates,
      conditions: listConditions(d.picks, d.typed),
      kinetics: data.kinetics,
      otherOptions: data.prefill!.otherOptions,
      changedFrom: original.id,
    });
    const r = await api("POST", FITS, { json: body });
    expect(r.status).toBe(202);
    const changed = (await r.res.json()) as FitDetailDto;
    expect(changed.inputSha256).not.toBe(original.inputSha256);
    expect(changed.spec.models[0].parameters.gamma).toMatchObject({ upper: 800, lower: 20 });
    expect(changed.changedFrom?.id).toBe(original.id);
  });
});

describe("what may be changed from", () => {
  it("refuses another lab's fit or an unknown id as changedFrom (422 naming the field), writing nothing", async () => {
    const other = await makeWorld();
    const m = await database();
    const foreign = await m.Fit.create({
      labId: other.labId,
      name: "Elsewhere",
      kind: "fit",
      status: "failed",
      jobId: null,
      spec: {},
      provenance: {},
      inputSha256: "0".repeat(64),
      softwareVersion: "test",
      rerunOf: null,
      createdBy: null,
    });
    const before = await m.Fit.count({ where: { labId: lab.w.labId } });
    for (const id of [foreign.id, randomUUID()]) {
      const r = await api("POST", FITS, {
        json: {
          name: "x",
          data: TYPED,
          models: [{ kinetics: "schnakenberg", lengthScaleUm: 40, parameters: {} }],
          changedFrom: id,
        },
      });
      expect(r.status).toBe(422);
      const body = (await r.res.json()) as { error: { message: string; details: { field: string } } };
      expect(body.error.message).toBe("Changed from: there is no fit with this id in this lab");
      expect(body.error.details.field).toBe("changedFrom");
    }
    expect(await m.Fit.count({ where: { labId: lab.w.labId } })).toBe(before);
  });

  it("answers Not found for the builder filled in from another lab's fit", async () => {
    const other = await makeWorld();
    const m = await database();
    const foreign = await m.Fit.create({
      labId: other.labId,
      name: "Elsewhere",
      kind: "fit",
      status: "failed",
      jobId: null,
      spec: {},
      provenance: {},
      inputSha256: "0".repeat(64),
      softwareVersion: "test",
      rerunOf: null,
      createdBy: null,
    });
    await expect(loadNewFitPage(ctx, { from: foreign.id })).rejects.toMatchObject({ code: "not_found" });
  });
});
