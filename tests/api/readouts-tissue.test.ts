/**
 * The tissue region through the API: found by default (the result says so, with its outline), and
 * "tissueMask": "off" analyses the whole region — stored with the readout's settings. Frame generated
 * by lib/synthetic (tissue ellipse over 50 % of a dark slide, stripes of 12 px; exact by construction).
 */
import { describe, expect, it } from "vitest";
import { encodePng } from "@/lib/imaging";
import type { ReadoutDto } from "@/lib/server/readouts/readouts";
import { makeTissueFrame } from "@/lib/synthetic";
import { setupReadoutLab } from "../support/readouts";

const { api, newSpecimen, uploadFile, finished } = setupReadoutLab();

describe("the tissue region of a readout", () => {
  it("is found by default, and can be turned off for a new readout", async () => {
    const frame = makeTissueFrame({
      width: 256,
      height: 256,
      pattern: "stripes",
      wavelengthPx: 12,
      angleDeg: 30,
      noise: 0.1,
      tissue: { shape: "ellipse", coverage: 0.5, slide: "dark" },
      seed: 4,
    });
    const max = frame.image.data.reduce((a, b) => Math.max(a, b), 0);
    const bytes = await encodePng({ ...frame.image, data: frame.image.data.map((v) => v / max) }, { bitDepth: 16 });
    const specimen = await newSpecimen();
    const up = await uploadFile(specimen.id, "tissue.png", bytes, { pixelSizeUm: "1" });
    expect(up.status).toBe(201);
    const first = await finished(up.body.readout);
    expect(first.settings).toMatchObject({ tissueMask: "auto" });
    const w1 = (
      first.result as { wavelength: { tissueRegion: { found: boolean; outline: unknown }; wavelengthPx: number } }
    ).wavelength;
    expect(w1.tissueRegion.found).toBe(true);
    expect(w1.tissueRegion.outline).not.toBeNull();
    // λ within 2 % (the acceptance figure; common practice, no source).
    expect(Math.abs(w1.wavelengthPx / 12 - 1)).toBeLessThan(0.02);
    const res = await api(
      "POST /api/v1/labs/[labId]/uploads/[uploadId]/readouts",
      { uploadId: up.body.id },
      { json: { tissueMask: "off" } },
    );
    expect(res.status).toBe(202);
    const second = await finished((await res.json()) as ReadoutDto);
    expect(second.settings).toMatchObject({ tissueMask: "off" });
    expect((second.result as { wavelength: { tissueRegion: { found: boolean } } }).wavelength.tissueRegion.found).toBe(
      false,
    );
    const bad = await api(
      "POST /api/v1/labs/[labId]/uploads/[uploadId]/readouts",
      { uploadId: up.body.id },
      { json: { tissueMask: "maybe" } },
    );
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as { error: { message: string } }).error.message).toContain(
      'Tissue region must be "auto" or "off"',
    );
  });
});
