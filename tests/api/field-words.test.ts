/**
 * Error answers in the words of the forms: a field is named by its label, positions count from
 * 1, and the JSON keeps the machine `details.field` for the form to highlight. A role refused in
 * its own lab is told what it may and may not do (403); another lab answers Not found (404).
 * Expected words are the forms' labels (lib/contracts/field-labels.ts; common practice, no source).
 */
import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { createSpecimen } from "@/lib/server/studies/specimens";
import { createStudy } from "@/lib/server/studies/studies";
import { labSchnakenberg } from "./permission-cases/kinetics";
import { multipart } from "../support/api";
import { setupLabApi } from "../support/lab-api";

let specimenId: string;
let png: Uint8Array;
const lab = setupLabApi({
  setup: async (l) => {
    const ctx = l.ctx("scientist");
    const s = await createStudy(ctx, { name: "S", tissue: "skin", organism: "chick", description: null });
    specimenId = (
      await createSpecimen(ctx, s.id, { label: "A", condition: "control", stage: null, genotype: null, notes: null })
    ).id;
    png = new Uint8Array(
      await sharp({ create: { width: 16, height: 16, channels: 3, background: "#336655" } })
        .png()
        .toBuffer(),
    );
  },
});
const UPLOADS = "/api/v1/labs/[labId]/specimens/[specimenId]/uploads";
const upload = (pixelSizeUm: string) =>
  lab.api("POST", UPLOADS, {
    params: { specimenId },
    body: multipart({ name: "tile.png", bytes: png }, { pixelSizeUm }),
  });

describe("messages name fields in the form's words", () => {
  it("a wrong pixel size", async () => {
    const r = await upload("-2");
    expect(r.status).toBe(400);
    expect(r.body.error.message).toBe("Pixel size (µm per pixel) must be above 0 µm/px");
    expect(r.body.error.details).toEqual({ field: "pixelSizeUm" });
  });

  it("a decimal comma in the pixel size is read where unambiguous, or the message says to use a point", async () => {
    const ok = await upload("0,65");
    expect(ok.status).toBe(201);
    expect(ok.body.pixelSizeUm).toBe(0.65);
    const ambiguous = await upload("1,000");
    expect(ambiguous.status).toBe(400);
    expect(ambiguous.body.error.message).toBe(
      "Pixel size (µm per pixel): “1,000” could be a thousands separator or a decimal comma; use a point for decimals (e.g. 0.65)",
    );
  });

  it("a bad reaction in the second equation", async () => {
    const definition = { ...labSchnakenberg("Words"), reactions: ["a - u + u^2 * v", "b - u^2 *"] };
    const r = await lab.api("POST", "/api/v1/labs/[labId]/kinetics", { who: "modeller", json: { definition } });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/^Equation for dv\/dt does not parse: /);
    expect(r.body.error.details).toEqual({ field: "definition.reactions[1]" });
  });

  it("a fit with a bad length scale of the second kinetics", async () => {
    const models = [
      { kinetics: "schnakenberg", parameters: {} },
      { kinetics: "schnakenberg", lengthScaleUm: -5, parameters: {} },
    ];
    const r = await lab.api("POST", "/api/v1/labs/[labId]/fits", { json: { name: "W", data: [], models } });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toBe("Length scale of the second kinetics (µm) must be above 0");
    expect(r.body.error.details.field).toBe("models[1].lengthScaleUm");
  });

  it("a run with a bad end time", async () => {
    const json = { kinetics: "schnakenberg", grid: { lengthUm: [100], cells: [64] }, endTimeS: -1 };
    const r = await lab.api("POST", "/api/v1/labs/[labId]/runs", { who: "modeller", json });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toBe("Simulated time must be above 0");
    expect(r.body.error.details.field).toBe("endTimeS");
  });
});

describe("a role refused in its own lab is told why (403); another lab is Not found (404)", () => {
  it("a collaborator may not start a fit, a bench scientist may not start a run", async () => {
    const fit = await lab.api("POST", "/api/v1/labs/[labId]/fits", { who: "collaborator", json: { name: "x" } });
    expect(fit.status).toBe(403);
    expect(fit.body.error.message).toBe("Collaborators can read fits but not start them.");
    const run = await lab.api("POST", "/api/v1/labs/[labId]/runs", { who: "scientist", json: {} });
    expect(run.status).toBe(403);
    expect(run.body.error.message).toBe("Bench scientists can read verification runs but not start them.");
  });

  it("another lab's fits answer 404 to the same person", async () => {
    const other = await lab.api("POST", "/api/v1/labs/[labId]/fits", {
      who: "collaborator",
      params: { labId: lab.w.otherLabId },
      json: { name: "x" },
    });
    expect(other.status).toBe(404);
    expect(other.body.error.message).toBe("lab not found");
  });
});
