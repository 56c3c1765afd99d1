/**
 * The lab the server-load bench reads: 3 studies, 30 specimens under two conditions each, 100
 * image uploads with their readouts, 2 fits and 2 verification runs, all made through the
 * functions the app uses (so the audit trail fills as it would). Names are invented; images come
 * from lib/synthetic. The small readouts and the fits run in this process (quicker to seed; the
 * bench measures the server, not the seeding), the runs in their child process as always.
 */
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { createHash } from "node:crypto";
import { tmpdir } from "node:os";
import path from "node:path";
import { encodePng } from "../../lib/imaging";
import { makeHexSpots } from "../../lib/synthetic";
import type { LabContext } from "../../lib/server/access";
import { readConfig } from "../../lib/server/config";
import { AppError } from "../../lib/server/errors";
import { startFit } from "../../lib/server/fits/fits";
import { waitForJob } from "../../lib/server/jobs/queue";
import { startReadout } from "../../lib/server/readouts/readouts";
import { startRun } from "../../lib/server/runs/runs";
import { createSpecimen } from "../../lib/server/studies/specimens";
import { createStudy } from "../../lib/server/studies/studies";
import { storeUpload } from "../../lib/server/uploads/uploads";

export interface SeededLab {
  studyIds: string[];
  specimenIds: string[];
  readoutIds: string[];
  fitIds: string[];
  runIds: string[];
  uploads: number;
}

const STUDIES = [
  { name: "Feather placodes under an invented inhibitor", tissue: "dorsal skin", organism: "chick" },
  { name: "Scale primordia at two temperatures", tissue: "flank skin", organism: "gecko" },
  { name: "Hair follicle spacing in two lines", tissue: "back skin", organism: "mouse" },
];
const CONDITIONS = ["control", "treated"] as const;
/** Placode spacing in px per condition (treated spaced wider), 2 µm/px: λ ≈ 38 and 47 µm. */
const SPACING_PX = { control: 22, treated: 27 } as const;
const PIXEL_SIZE_UM = 2;
const SIDE_PX = 256;

/** storeUpload, tried up to 3 times: the fake S3 has timed out on a machine loaded by other work. */
async function storeWithRetry(...args: Parameters<typeof storeUpload>) {
  for (let attempt = 1; ; attempt++) {
    try {
      return await storeUpload(...args);
    } catch (err) {
      if (attempt >= 3 || !(err instanceof AppError && err.code === "unavailable")) throw err;
    }
  }
}

export async function seedLoadLab(scientist: LabContext, modeller: LabContext): Promise<SeededLab> {
  const config = readConfig();
  const [readoutBefore, fitBefore] = [config.readoutInProcess, config.fitInProcess];
  config.readoutInProcess = true;
  config.fitInProcess = true;
  const tmp = mkdtempSync(path.join(tmpdir(), "morphokin-load-seed-"));
  const out: SeededLab = { studyIds: [], specimenIds: [], readoutIds: [], fitIds: [], runIds: [], uploads: 0 };
  const jobs: string[] = [];
  try {
    for (const s of STUDIES) {
      const study = await createStudy(scientist, { ...s, description: "Synthetic bench study." });
      out.studyIds.push(study.id);
      for (let i = 0; i < 10; i++) {
        const condition = CONDITIONS[i % 2];
        const specimen = await createSpecimen(scientist, study.id, {
          label: `${s.tissue.slice(0, 2).toUpperCase()}-${String(i + 1).padStart(2, "0")}`,
          condition,
          stage: "HH31",
          genotype: null,
          notes: null,
        });
        out.specimenIds.push(specimen.id);
        // 3 images per specimen and a 4th on every third one: 100 uploads over 30 specimens.
        const images = 3 + (out.specimenIds.length % 3 === 1 ? 1 : 0);
        for (let k = 0; k < images && out.uploads < 100; k++) {
          const seed = out.uploads + 1;
          const img = makeHexSpots({
            width: SIDE_PX,
            height: SIDE_PX,
            spacingPx: SPACING_PX[condition] + (seed % 5) * 0.2,
            angleDeg: 5 + seed,
            jitterPx: 0.8,
            noise: 0.08,
            seed,
          });
          const bytes = await encodePng(img, { bitDepth: 8 });
          const name = `placodes-${seed}.png`;
          const file = path.join(tmp, name);
          writeFileSync(file, bytes);
          const upload = await storeWithRetry(scientist, specimen.id, {
            path: file,
            filename: name,
            sizeBytes: bytes.length,
            sha256: createHash("sha256").update(bytes).digest("hex"),
            kind: "image",
            contentType: "image/png",
            pixelSizeUm: PIXEL_SIZE_UM,
            pixelSizeSource: "uploader",
          });
          const readout = await startReadout(scientist, upload.id, {});
          out.readoutIds.push(readout.id);
          jobs.push(readout.jobId!);
          out.uploads++;
        }
      }
    }
    for (const id of jobs) await waitForJob(id, 300_000);

    // Two fits of the first study's readouts (Schnakenberg, γ per condition), as a modeller would.
    const firstStudyReadouts = out.readoutIds.slice(0, 34);
    for (const [i, d] of [20, 30].entries()) {
      const fit = await startFit(modeller, {
        name: `Placode spacing, Schnakenberg d = ${d} (${i + 1})`,
        data: firstStudyReadouts.map((readoutId) => ({ readoutId })),
        uncertainty: "with-specimen-spread",
        models: [
          {
            kinetics: "schnakenberg",
            lengthScaleUm: 40,
            parameters: {
              gamma: { mode: "per-condition", start: 100, lower: 10, upper: 1000, log: true },
              d: { mode: "fixed", value: d },
            },
          },
        ],
      });
      out.fitIds.push(fit.id);
      await waitForJob(fit.jobId!, 300_000);
    }
    for (const [i, condition] of CONDITIONS.entries()) {
      const run = await startRun(modeller, {
        name: `Bench run ${i + 1}, ${condition}`,
        kinetics: "schnakenberg",
        grid: { lengthUm: [8, 8], cells: [32, 32] },
        endTimeS: 4,
        seed: i + 1,
        fit: { fitId: out.fitIds[0], condition },
      });
      out.runIds.push(run.id);
      await waitForJob(run.jobId!, 300_000);
    }
    return out;
  } finally {
    config.readoutInProcess = readoutBefore;
    config.fitInProcess = fitBefore;
    rmSync(tmp, { recursive: true, force: true });
  }
}
