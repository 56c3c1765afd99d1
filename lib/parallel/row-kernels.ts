/**
 * The row kernels the spectrum worker runs on its share of a pass's rows (see
 * SpectrumExecutor.splitRows): the very functions the calling thread runs on its own rows.
 */
import type { RowKernel } from "../fft";
import { runResidualRows, type ResidualRowsJob } from "../readout/residual-rows";

export const ROW_KERNELS: Record<RowKernel, (job: never, from: number, to: number) => boolean> = {
  "residual-rows": (job: ResidualRowsJob, from, to) => runResidualRows(job, from, to),
};
