/**
 * Image readouts through the API: an upload starts its readout job, the wavelength matches the
 * generated pattern, derived products are served, re-runs make new readouts, deleting the upload
 * removes readouts and derived objects.
 */
import { createHash } from "node:crypto";
import sharp from "sharp";
import { describe, expect, it } from "vitest";
import packageJson from "@/package.json";
import { encodePng } from "@/lib/imaging";
import { makeHexSpots, makeStripes } from "@/lib/synthetic";
import type { ReadoutDetailDto, ReadoutDto } from "@/lib/server/readouts/readouts";
import { database, services } from "@/lib/server/services";
import { setupReadoutLab } from "../support/readouts";

const { api, newSpecimen, uploadFile, finished } = setupReadoutLab();
const sha256 = (b: Uint8Array) => createHash("sha256").update(b).digest("hex");

describe("image readouts", () => {
  let stripes: { uploadId: string; first: ReadoutDetailDto; bytes: Uint8Array };

  it("an upload starts a readout whose wavelength matches the generated stripes within 1 %", async () => {
    // Geometry is the source: stripes of period 16 px at 0.5 µm/px have λ = 8 µm.
    const bytes = await encodePng(
      makeStripes({ width: 192, height: 160, wavelengthPx: 16, angleDeg: 30, noise: 0.1, seed: 11 }),
    );
    const sp = await newSpecimen();
    const up = await uploadFile(sp.id, "stripes.png", bytes, { pixelSizeUm: "0.5" });
    expect(up.status).toBe(201);
    expect(up.body.readout).toMatchObject({
      status: "queued",
      kind: "image",
      uploadId: up.body.id,
      inputSha256: sha256(bytes),
      softwareVersion: `morphokin ${packageJson.version}`,
      pixelSizeUm: 0.5,
      pixelSizeSource: "uploader",
    });
    const r = await finished(up.body.readout);
    expect(r.status).toBe("succeeded");
    expect(r.progress).toBe(1);
    expect(r.headline!.periodFound).toBe(true);
    expect(Math.abs(r.headline!.wavelengthUm! - 8) / 8).toBeLessThan(0.01);
    if (r.result?.type !== "image") throw new Error("expected an image readout");
    expect(r.result.wavelength.symmetry).toBe("stripes");
    expect(Math.abs(r.result.wavelength.wavelengthPx! - 16) / 16).toBeLessThan(0.01);
    expect(r.result.wavelength.uncertaintyMethod).not.toBeNull();
    // Wave vector perpendicular to the stripes at 30° (geometry); a few degrees of slack for noise.
    expect(Math.abs(r.result.wavelength.orientationDeg! - 30)).toBeLessThan(3);
    expect(r.result.pixelSizeSource).toBe("uploader");
    expect(Object.keys(r.derived).sort()).toEqual(["fft.png", "preview.png", "spectrum.json"]);
    stripes = { uploadId: up.body.id, first: r, bytes };
  });

  it("serves the derived products: a preview of the whole image, the FFT image and the spectrum", async () => {
    const get = (product: string) =>
      api("GET /api/v1/labs/[labId]/readouts/[readoutId]/derived/[product]", { readoutId: stripes.first.id, product });
    const preview = await get("preview.png");
    expect(preview.headers.get("content-type")).toBe("image/png");
    const meta = await sharp(Buffer.from(await preview.arrayBuffer())).metadata();
    expect([meta.width, meta.height]).toEqual([192, 160]); // the source size (under the 1024 px cap)
    const fft = await get("fft.png");
    // Cropped to ± 3 × the peak frequency of the 256-point padded transform: 2 · round(3/16 · 256) = 96 px.
    expect((await sharp(Buffer.from(await fft.arrayBuffer())).metadata()).width).toBe(96);
    const fftInfo = (stripes.first.result as { fft?: { ringFraction: number | null } }).fft;
    expect(fftInfo?.ringFraction).toBeCloseTo(1 / 3, 2); // the ring at 1/λ, a third of the way to the edge
    const spectrum = await (await get("spectrum.json")).json();
    expect(spectrum.radialSpectrum.frequencyPerUm.length).toBe(spectrum.radialSpectrum.power.length);
    expect(spectrum.angularPower).toHaveLength(180);
    expect(spectrum.localWavelength.profile.axis).toBe("x");
    expect((await get("other.png")).status).toBe(404);
    expect((await get("toString")).status).toBe(404);
  });

  it("re-running with an ROI makes a second readout and keeps the first unchanged", async () => {
    const roi = { kind: "rect", x: 0, y: 0, width: 128, height: 128 };
    const res = await api(
      "POST /api/v1/labs/[labId]/uploads/[uploadId]/readouts",
      { uploadId: stripes.uploadId },
      { json: { roi, flatten: "none", window: "tukey", profileAxis: "y" } },
    );
    expect(res.status).toBe(202);
    const second = await finished((await res.json()) as ReadoutDto);
    expect(second.id).not.toBe(stripes.first.id);
    expect(second.settings).toMatchObject({ kind: "image", roi, flatten: "none", window: "tukey", profileAxis: "y" });
    expect(Math.abs(second.headline!.wavelengthUm! - 8) / 8).toBeLessThan(0.01);
    const list = await (
      await api("GET /api/v1/labs/[labId]/uploads/[uploadId]/readouts", { uploadId: stripes.uploadId })
    ).json();
    expect(list.total).toBe(2);
    const again = (await (
      await api("GET /api/v1/labs/[labId]/readouts/[readoutId]", { readoutId: stripes.first.id })
    ).json()) as ReadoutDetailDto;
    expect(again.settings).toEqual(stripes.first.settings);
    expect(again.headline).toEqual(stripes.first.headline);
  });

  it("hexagonal spots report the Fourier wavelength and the nearest-neighbour spacing, a = (2/√3)·λ", async () => {
    // Generated lattice spacing a = 24 px at 1 µm/px: λ = (√3/2)·24 = 20.785 µm (SCIENCE.md §4).
    const bytes = await encodePng(
      makeHexSpots({ width: 256, height: 256, spacingPx: 24, angleDeg: 8, spotRadiusPx: 6, noise: 0.05, seed: 3 }),
    );
    const up = await uploadFile((await newSpecimen()).id, "spots.png", bytes, { pixelSizeUm: "1" });
    const r = await finished(up.body.readout);
    expect(r.headline!.symmetry).toBe("hexagonal");
    expect(Math.abs(r.headline!.wavelengthUm! - (Math.sqrt(3) / 2) * 24) / 20.785).toBeLessThan(0.01);
    expect(Math.abs(r.headline!.nearestNeighbourUm! - 24) / 24).toBeLessThan(0.01);
  });

  it("deleting the upload removes its readouts and every derived object", async () => {
    const m = await database();
    const rows = await m.Readout.findAll({ where: { uploadId: stripes.uploadId } });
    const keys = rows.flatMap((r) => Object.values(r.derivedKeys ?? {}));
    expect(keys).toHaveLength(6);
    for (const k of keys) expect(await services().store.exists(k)).toBe(true);
    expect((await api("DELETE /api/v1/labs/[labId]/uploads/[uploadId]", { uploadId: stripes.uploadId })).status).toBe(
      204,
    );
    expect(await m.Readout.count({ where: { uploadId: stripes.uploadId } })).toBe(0);
    for (const k of keys) expect(await services().store.exists(k)).toBe(false);
    expect((await api("GET /api/v1/labs/[labId]/readouts/[readoutId]", { readoutId: stripes.first.id })).status).toBe(
      404,
    );
  });
});
