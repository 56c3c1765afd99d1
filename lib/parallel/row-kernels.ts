/**
 * The row kernels the spectrum worker runs on its share of a pass's rows (see
 * SpectrumExecutor.splitRows): the very functions the calling thread runs on its own rows.
 */
import type { RowKernel } from "../fft";
import { runScaleSamples, type ScaleSamplesJob } from "../imaging/read-plain-tiff16";
import { runBoxColumns, runBoxRows, type BoxJob } from "../readout/box-blur";
import { runRadialRows, type RadialRowsJob } from "../readout/radial-spectrum";
import { runRegionStatsRows, type RegionStatsJob } from "../readout/region-stats";
import { runBlurGrids, runTextureRows, type BlurGridsJob, type TextureRowsJob } from "../readout/texture-map";
import { runResidualRows, type ResidualRowsJob } from "../readout/residual-rows";

export const ROW_KERNELS: Record<RowKernel, (job: never, from: number, to: number) => boolean> = {
  "residual-rows": (job: ResidualRowsJob, from, to) => runResidualRows(job, from, to),
  "region-stats": (job: RegionStatsJob, from, to) => runRegionStatsRows(job, from, to),
  "scale-samples": (job: ScaleSamplesJob, from, to) => runScaleSamples(job, from, to),
  "box-rows": (job: BoxJob, from, to) => runBoxRows(job, from, to),
  "box-columns": (job: BoxJob, from, to) => runBoxColumns(job, from, to),
  "radial-rows": (job: RadialRowsJob, from, to) => runRadialRows(job, from, to),
  "texture-rows": (job: TextureRowsJob, from, to) => runTextureRows(job, from, to),
  "blur-grids": (job: BlurGridsJob, from, to) => runBlurGrids(job, from, to),
};
