/** Worker side of createSpectrumThreads: the second half of the rows, then of the columns, of each job; or its rows of a row kernel. */
import { parentPort, receiveMessageOnPort, workerData } from "node:worker_threads";
import { transformColumnsToPower, transformRows, type HalfPowerJob, type RowKernel } from "../fft";
import { ROW_KERNELS } from "./row-kernels";
import { raiseFailureWord, type FailureWord } from "./start-worker";

const GEN = 0,
  DONE = 1,
  RESULT = 3;
/** Busy-wait iterations before sleeping, as in diffusion-worker.ts. */
const SPIN_LOOPS = 200_000;

interface Job extends HalfPowerJob {
  /** The worker's rows start at this row. */
  rowOffset: number;
  /** `src` holds source rows from this row on (0: the whole image, shared). */
  srcFirstRow: number;
  half: Float32Array | Float64Array;
  power: Float32Array;
  colSplit: number;
}

/** Rows [from, to) of a row kernel's job (SpectrumExecutor.splitRows). */
interface RowsJob {
  kernel: RowKernel;
  job: never;
  from: number;
  to: number;
}

function serve({ ctrl }: { ctrl: Int32Array }): void {
  let seen = 0;
  const next = () => {
    let spin = 0;
    while (Atomics.load(ctrl, GEN) === seen) if (++spin > SPIN_LOOPS) Atomics.wait(ctrl, GEN, seen, 10_000);
    seen = Atomics.load(ctrl, GEN);
  };
  const done = () => {
    Atomics.store(ctrl, DONE, seen);
    Atomics.notify(ctrl, DONE);
  };
  for (;;) {
    next();
    const message = receiveMessageOnPort(parentPort!)?.message as Job | RowsJob;
    if ("kernel" in message) {
      const ok = ROW_KERNELS[message.kernel](message.job, message.from, message.to);
      Atomics.store(ctrl, RESULT, ok ? 1 : 0);
      done();
      continue;
    }
    const job = message;
    const { srcWidth, srcHeight, width, height, rowOffset, srcFirstRow, half, power, colSplit } = job;
    transformRows(
      job.src,
      srcWidth,
      srcHeight,
      width,
      half,
      job.windowX,
      job.windowY,
      rowOffset,
      srcHeight,
      srcFirstRow,
    );
    done();
    next();
    transformColumnsToPower(half, width / 2 + 1, height, srcHeight, power, colSplit, width / 2 + 1);
    done();
  }
}

try {
  serve(workerData as { ctrl: Int32Array });
} catch (err) {
  raiseFailureWord(workerData as { failure?: FailureWord });
  throw err;
}
