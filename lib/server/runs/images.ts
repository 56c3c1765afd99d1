/**
 * Colour images of simulated fields in Morphokin's palette: warm paper (low) → deep green → ink
 * (high), min–max scaled per image (the page prints the range beside it; components/charts/
 * field-image.tsx draws the same stops as its colour bar). A 1-D field is drawn as a strip 24 px high.
 */
import "server-only";
import sharp from "sharp";

const STOPS: Array<[number, [number, number, number]]> = [
  [0, [0xf6, 0xf1, 0xe6]], // paper
  [0.35, [0xdc, 0xeb, 0xe2]], // moss-soft
  [0.7, [0x1f, 0x5c, 0x45]], // moss
  [1, [0x22, 0x20, 0x1b]], // ink
];

function colourAt(t: number, out: Uint8Array, o: number) {
  let i = 1;
  while (i < STOPS.length - 1 && t > STOPS[i][0]) i++;
  const [t0, c0] = STOPS[i - 1],
    [t1, c1] = STOPS[i];
  const f = Math.min(1, Math.max(0, (t - t0) / (t1 - t0)));
  for (let c = 0; c < 3; c++) out[o + c] = Math.round(c0[c] + f * (c1[c] - c0[c]));
}

export function fieldRange(field: Float64Array): { min: number; max: number } {
  let min = Infinity,
    max = -Infinity;
  for (const v of field) {
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { min, max };
}

/** PNG of one field (row-major nx × ny). */
export async function renderFieldPng(field: Float64Array, nx: number, ny: number): Promise<Buffer> {
  const height = ny === 1 ? 24 : ny;
  const { min, max } = fieldRange(field);
  const span = max > min ? max - min : 1;
  const px = new Uint8Array(nx * height * 3);
  for (let y = 0; y < height; y++) {
    const row = ny === 1 ? 0 : y;
    for (let x = 0; x < nx; x++) colourAt((field[row * nx + x] - min) / span, px, (y * nx + x) * 3);
  }
  return sharp(px, { raw: { width: nx, height, channels: 3 } })
    .png()
    .toBuffer();
}

/** Grey image of one field scaled to 0…1 for the readout; a 1-D field becomes a stripe image of `rows` rows. */
export function fieldToGrey(field: Float64Array, nx: number, ny: number, rows = 64) {
  const height = ny === 1 ? rows : ny;
  const { min, max } = fieldRange(field);
  const span = max > min ? max - min : 1;
  const data = new Float32Array(nx * height);
  for (let y = 0; y < height; y++)
    for (let x = 0; x < nx; x++) data[y * nx + x] = (field[(ny === 1 ? 0 : y) * nx + x] - min) / span;
  return { width: nx, height, data };
}
