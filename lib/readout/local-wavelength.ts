import type { GreyImage } from "../imaging/grey-image";
import { nextPowerOfTwo } from "../fft";
import { measureTile } from "./measure-tile";
import { resolveReadoutOptions, type ReadoutOptions } from "./options";
import { prepareRegion } from "./prepare-region";
import { readWavelength } from "./read-wavelength";

export interface LocalWavelengthOptions extends ReadoutOptions {
  /** Tile side (px of the analysed grid). @default the power of two ≥ 6 global wavelengths, at least 32 */
  tileSizePx?: number;
  /** Axis of the profile. @default "x" */
  axis?: "x" | "y";
}

/** Local wavelength on overlapping tiles (stride ½ tile) and its profile along one axis. */
export interface LocalWavelengthMap {
  tileSizePx: number;
  stridePx: number;
  columns: number;
  rows: number;
  /** Tile centres in source-image pixels. */
  centresXPx: number[];
  centresYPx: number[];
  /** Row-major rows × columns, µm; null where the tile shows no significant period. */
  wavelengthUm: Array<number | null>;
  /** Mean and SD of the tiles at each position along the axis (µm). */
  profile: {
    axis: "x" | "y";
    positionUm: number[];
    wavelengthUm: Array<number | null>;
    sdUm: Array<number | null>;
    tiles: number[];
  };
  /** The whole-region wavelength the tiles searched around (µm), null if none. */
  globalWavelengthUm: number | null;
}

/** Runs the readout on overlapping tiles, each searched within ±50 % of the whole-region peak. */
export function mapLocalWavelength(image: GreyImage, options: LocalWavelengthOptions): LocalWavelengthMap {
  const global = readWavelength(image, { ...options, subregions: false, autocorrelation: false });
  const settings = resolveReadoutOptions(options, image.width, image.height);
  const region = prepareRegion(image, settings);
  const bin = region.binFactor;
  const lambdaPx = global.wavelengthPx !== null ? global.wavelengthPx / bin : null;
  const tile = Math.min(
    options.tileSizePx ?? Math.max(32, nextPowerOfTwo(Math.ceil(6 * (lambdaPx ?? 8)))),
    region.width,
    region.height,
  );
  const stride = Math.max(1, Math.floor(tile / 2));
  const columns = Math.floor((region.width - tile) / stride) + 1;
  const rows = Math.floor((region.height - tile) / stride) + 1;
  const axis = options.axis ?? "x";
  const out: LocalWavelengthMap = {
    tileSizePx: tile * bin,
    stridePx: stride * bin,
    columns,
    rows,
    centresXPx: [],
    centresYPx: [],
    wavelengthUm: [],
    profile: { axis, positionUm: [], wavelengthUm: [], sdUm: [], tiles: [] },
    globalWavelengthUm: global.wavelengthUm,
  };
  for (let c = 0; c < columns; c++) out.centresXPx.push(region.x0 + (c * stride + tile / 2) * bin);
  for (let r = 0; r < rows; r++) out.centresYPx.push(region.y0 + (r * stride + tile / 2) * bin);
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < columns; c++) {
      const m = lambdaPx ? measureTile(region, c * stride, r * stride, tile, tile, settings, 1 / lambdaPx, 0.5) : null;
      out.wavelengthUm.push(m ? region.pixelSizeUm / m.frequencyPerPx : null);
    }
  }
  const along = axis === "x" ? columns : rows;
  for (let k = 0; k < along; k++) {
    const vals: number[] = [];
    const across = axis === "x" ? rows : columns;
    for (let j = 0; j < across; j++) {
      const v = out.wavelengthUm[axis === "x" ? j * columns + k : k * columns + j];
      if (v !== null) vals.push(v);
    }
    const mean = vals.length ? vals.reduce((s, v) => s + v, 0) / vals.length : null;
    const sd =
      vals.length > 1 && mean !== null
        ? Math.sqrt(vals.reduce((s, v) => s + (v - mean) ** 2, 0) / (vals.length - 1))
        : null;
    out.profile.positionUm.push((axis === "x" ? out.centresXPx[k] : out.centresYPx[k]) * settings.pixelSizeUm);
    out.profile.wavelengthUm.push(mean);
    out.profile.sdUm.push(sd);
    out.profile.tiles.push(vals.length);
  }
  return out;
}
