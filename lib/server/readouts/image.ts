/**
 * The image half of a readout job: decode, read the wavelength, map it locally, and render the
 * derived products (preview PNG of the whole image, FFT magnitude PNG, spectrum JSON).
 * Everything here is CPU work on the event loop; `yieldToLoop` between steps lets requests in.
 */
import "server-only";
import sharp from "sharp";
import { encodePng, type ImageInput } from "@/lib/imaging";
import {
  mapLocalWavelength,
  readWavelength,
  renderFftMagnitude,
  renderPreview,
  type ReadoutOptions,
  type WavelengthReadout,
} from "@/lib/readout";
import type { ImageReadoutSettings } from "@/lib/contracts/readout";
import type { ImageReadoutResult, SpectrumProducts } from "./result";
import { PREVIEW_MAX_SIDE, readReadoutSource } from "./image-source";

const yieldToLoop = () => new Promise<void>((r) => setImmediate(r));

export interface ImageReadoutOutput {
  result: ImageReadoutResult;
  derived: { "spectrum.json": Buffer; "preview.png": Buffer; "fft.png": Buffer };
}

export async function runImageReadout(
  input: ImageInput,
  settings: ImageReadoutSettings & { pixelSizeUm: number; pixelSizeSource: string | null },
  step: (fraction: number, note: string) => Promise<void>,
): Promise<ImageReadoutOutput> {
  const source = await readReadoutSource(input, settings);
  const { image, info, factor, x0, y0 } = source;
  await step(0.15, "decoded");
  const options: ReadoutOptions = {
    pixelSizeUm: settings.pixelSizeUm * factor,
    roi: source.roi,
    invert: settings.invert,
    flatten: settings.flatten,
    window: settings.window,
    // Settings stored before the tissue region existed have no choice: the default then.
    tissueMask: settings.tissueMask ?? "auto",
  };
  const t0 = Date.now();
  const readout = toSourcePixels(readWavelength(image, options), settings, factor);
  readout.warnings.push(...info.notes);
  await step(0.5, "spectrum and peak");
  await yieldToLoop();
  const local = mapLocalWavelength(image, { ...options, axis: settings.profileAxis });
  await step(0.7, "local wavelength");
  await yieldToLoop();
  const fftImage = renderFftMagnitude(
    image,
    options,
    readout.wavelengthPx === null ? null : readout.wavelengthPx / factor,
  );
  const fft = await encodePng(fftImage.image);
  // The whole image as stored: no flattening, no tissue mask, no outlier treatment (the page draws the tissue outline).
  const whole = renderPreview(source.whole, {
    pixelSizeUm: settings.pixelSizeUm,
    flatten: "none",
    tissueMask: "off",
    outliers: "off",
  });
  const computeMs = Date.now() - t0;
  const scale = Math.min(1, PREVIEW_MAX_SIDE / Math.max(info.width, info.height));
  let preview = await encodePng(whole);
  // renderPreview bins images above its analysis size; resize to the stored size either way.
  const previewWidth = Math.max(1, Math.round(info.width * scale));
  const previewHeight = Math.max(1, Math.round(info.height * scale));
  if (whole.width !== previewWidth || whole.height !== previewHeight) {
    preview = await sharp(preview).resize(previewWidth, previewHeight, { fit: "fill" }).png().toBuffer();
  }
  await step(0.85, "derived images");

  const { radialSpectrum, angularPower, ...numbers } = readout;
  const spectrum: SpectrumProducts = {
    radialSpectrum,
    angularPower,
    localWavelength: {
      tileSizePx: local.tileSizePx * factor,
      stridePx: local.stridePx * factor,
      columns: local.columns,
      rows: local.rows,
      centresXPx: local.centresXPx.map((x) => x * factor + x0),
      centresYPx: local.centresYPx.map((y) => y * factor + y0),
      wavelengthUm: local.wavelengthUm,
      profile: local.profile,
    },
  };
  const result: ImageReadoutResult = {
    type: "image",
    image: {
      width: info.width,
      height: info.height,
      channels: info.channels,
      bitDepth: info.bitDepth,
      format: info.format,
      channelUsed: info.channelUsed,
      planes: info.stack.planes,
      timePoints: info.stack.timePoints,
      planeUsed: info.planeUsed,
      timePointUsed: info.timePointUsed,
      projection: info.projection,
      orientation: info.orientation,
      reduceFactor: factor,
    },
    pixelSizeUm: settings.pixelSizeUm,
    pixelSizeSource: settings.pixelSizeSource,
    wavelength: numbers,
    preview: { width: previewWidth, height: previewHeight, scale: previewWidth / info.width },
    fft: { maxFrequencyPerUm: fftImage.maxFrequencyPerUm, ringFraction: fftImage.ringFraction },
    computeMs,
  };
  return {
    result,
    derived: { "spectrum.json": Buffer.from(JSON.stringify(spectrum)), "preview.png": preview, "fft.png": fft },
  };
}

/**
 * A readout of a reduced image (factor > 1) in the source's pixels: lengths in px × factor, the
 * settings as the user gave them, the binning counted in full. µm values need no change.
 */
function toSourcePixels(
  r: WavelengthReadout,
  settings: ImageReadoutSettings & { pixelSizeUm: number },
  factor: number,
): WavelengthReadout {
  if (factor === 1) return r;
  const px = (v: number | null) => (v === null ? null : v * factor);
  return {
    ...r,
    wavelengthPx: px(r.wavelengthPx),
    uncertaintyPx: px(r.uncertaintyPx),
    settings: {
      ...r.settings,
      pixelSizeUm: settings.pixelSizeUm,
      roi: settings.roi,
      binFactor: r.settings.binFactor * factor,
    },
  };
}
