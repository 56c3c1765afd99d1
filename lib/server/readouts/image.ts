/**
 * The image half of a readout job: decode, read the wavelength, map it locally, and render the
 * derived products (preview PNG of the whole image, FFT magnitude PNG, spectrum JSON).
 * Everything here is CPU work on the event loop; `yieldToLoop` between steps lets requests in.
 */
import "server-only";
import sharp from "sharp";
import { decodeImage, encodePng } from "@/lib/imaging";
import {
  mapLocalWavelength,
  readWavelength,
  renderFftMagnitude,
  renderPreview,
  type ReadoutOptions,
} from "@/lib/readout";
import type { ImageReadoutSettings } from "@/lib/contracts/readout";
import type { ImageReadoutResult, SpectrumProducts } from "./result";

/** Longest side of the stored preview (px); the ROI editor maps back with `previewScale`. */
const PREVIEW_MAX_SIDE = 1024;

const yieldToLoop = () => new Promise<void>((r) => setImmediate(r));

export interface ImageReadoutOutput {
  result: ImageReadoutResult;
  derived: { "spectrum.json": Buffer; "preview.png": Buffer; "fft.png": Buffer };
}

export async function runImageReadout(
  bytes: Uint8Array,
  settings: ImageReadoutSettings & { pixelSizeUm: number; pixelSizeSource: string | null },
  step: (fraction: number, note: string) => Promise<void>,
): Promise<ImageReadoutOutput> {
  const { image, info } = await decodeImage(bytes, { channel: settings.channel });
  await step(0.15, "decoded");
  const options: ReadoutOptions = {
    pixelSizeUm: settings.pixelSizeUm,
    roi: settings.roi,
    invert: settings.invert,
    flatten: settings.flatten,
    window: settings.window,
  };
  const t0 = Date.now();
  const readout = readWavelength(image, options);
  await step(0.5, "spectrum and peak");
  await yieldToLoop();
  const local = mapLocalWavelength(image, { ...options, axis: settings.profileAxis });
  await step(0.7, "local wavelength");
  await yieldToLoop();
  const fftImage = renderFftMagnitude(image, options, readout.wavelengthPx);
  const fft = await encodePng(fftImage.image);
  // The whole image as stored: no flattening, no tissue mask, no outlier treatment (the page draws the tissue outline).
  const whole = renderPreview(image, {
    pixelSizeUm: settings.pixelSizeUm,
    flatten: "none",
    tissueMask: "off",
    outliers: "off",
  });
  const computeMs = Date.now() - t0;
  const scale = Math.min(1, PREVIEW_MAX_SIDE / Math.max(image.width, image.height));
  let preview = await encodePng(whole);
  // renderPreview bins images above its analysis size; resize to the stored size either way.
  const previewWidth = Math.max(1, Math.round(image.width * scale));
  const previewHeight = Math.max(1, Math.round(image.height * scale));
  if (whole.width !== previewWidth || whole.height !== previewHeight) {
    preview = await sharp(preview).resize(previewWidth, previewHeight, { fit: "fill" }).png().toBuffer();
  }
  await step(0.85, "derived images");

  const { radialSpectrum, angularPower, ...numbers } = readout;
  const spectrum: SpectrumProducts = {
    radialSpectrum,
    angularPower,
    localWavelength: {
      tileSizePx: local.tileSizePx,
      stridePx: local.stridePx,
      columns: local.columns,
      rows: local.rows,
      centresXPx: local.centresXPx,
      centresYPx: local.centresYPx,
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
