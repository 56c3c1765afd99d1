/**
 * Demo data for a laptop: an invented lab with one person per role, two studies with specimens
 * under two conditions, and synthetic pattern images that Morphokin generates itself (no
 * photographs of anyone's tissue). Runs only on a database without users.
 *
 * Demo-only password: see DEMO_PASSWORD (README lists the accounts).
 */
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { createHash } from "node:crypto";
import { tmpdir } from "node:os";
import path from "node:path";
import { encodePng, encodeTiff16 } from "@/lib/imaging";
import { makeHexSpots, makeStripes } from "@/lib/synthetic";
import type { Role } from "@/lib/access/roles";
import type { LabContext } from "@/lib/server/access";
import { createSpecimen } from "@/lib/server/studies/specimens";
import { createStudy } from "@/lib/server/studies/studies";
import { startReadout, type ReadoutDto } from "@/lib/server/readouts/readouts";
import { storeUpload } from "@/lib/server/uploads/uploads";
import { waitForJob } from "@/lib/server/jobs/queue";
import { startJobs } from "@/lib/server/jobs/wiring";
import { stopJobs } from "@/lib/server/jobs/worker";
import { hashPassword } from "@/lib/server/accounts/passwords";
import { database } from "@/lib/server/services";
import { recordAudit } from "@/lib/server/audit";
import { createThread } from "@/lib/server/discussions/discussions";
import { startFit } from "@/lib/server/fits/fits";
import { startRun } from "@/lib/server/runs/runs";

export const DEMO_PASSWORD = "morphokin-demo";
export const DEMO_LAB = "Bracken Hill Patterning Lab";
export const DEMO_PEOPLE: { name: string; email: string; role: Role }[] = [
  { name: "Mara Ellwood", email: "manager@brackenhill.example", role: "manager" },
  { name: "Teodor Varga", email: "scientist@brackenhill.example", role: "scientist" },
  { name: "Ines Carrow", email: "modeller@brackenhill.example", role: "modeller" },
  { name: "Sami Oduya", email: "collaborator@brackenhill.example", role: "collaborator" },
];

export async function seedDemo(): Promise<boolean> {
  const m = await database();
  if ((await m.User.count()) > 0) return false;
  startJobs(); // the demo's readouts, fit and run are done here, before the server starts
  try {
    await fillDemoLab(m);
  } finally {
    // The server runs the jobs from here on; a worker left in this process would outlive its database.
    await stopJobs();
  }
  return true;
}

async function fillDemoLab(m: Awaited<ReturnType<typeof database>>): Promise<void> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const lab = await m.Lab.create({ name: DEMO_LAB, createdBy: null });
  const users: { id: string; email: string; name: string | null }[] = [];
  for (const p of DEMO_PEOPLE) {
    const u = await m.User.create({ name: p.name, email: p.email, passwordHash, emailVerified: new Date() });
    await m.Membership.create({ labId: lab.id, userId: u.id, role: p.role });
    users.push(u);
  }
  const as = (i: number): LabContext => ({
    actor: { userId: users[i].id, email: users[i].email, name: users[i].name, via: "session" },
    labId: lab.id,
    labName: lab.name,
    role: DEMO_PEOPLE[i].role,
  });
  const [manager, scientist, modeller, collaborator] = [0, 1, 2, 3].map(as);
  await recordAudit(m, {
    labId: lab.id,
    actor: manager.actor,
    action: "lab.created",
    targetType: "lab",
    targetId: lab.id,
    summary: `Demo data: ${manager.actor.email} created the lab “${lab.name}” with four members`,
  });

  const tmp = mkdtempSync(path.join(tmpdir(), "morphokin-seed-"));
  try {
    const placodes = await createStudy(scientist, {
      name: "Dorsal placode spacing under a signalling inhibitor",
      tissue: "dorsal skin",
      organism: "chick",
      description:
        "Synthetic demo study: hexagonal placode lattices imaged at 2.0 µm/px, control against a made-up inhibitor that widens the spacing.",
    });
    const rugae = await createStudy(manager, {
      name: "Palatal ridge stripes in two genotypes",
      tissue: "palate",
      organism: "mouse",
      description: "Synthetic demo study: stripe patterns at 1.5 µm/px, wild type against an invented mutant line.",
    });
    const readouts: ReadoutDto[] = [];
    const plan: {
      study: string;
      label: string;
      condition: string;
      stage: string;
      genotype: string | null;
      image: () => Promise<{ name: string; bytes: Buffer; pixelSizeUm: number }>;
    }[] = [];
    const spots = (spacingPx: number, seed: number) => async () => {
      const img = makeHexSpots({
        width: 512,
        height: 512,
        spacingPx,
        angleDeg: 12 + seed,
        spotRadiusPx: spacingPx * 0.28,
        jitterPx: 0.8,
        noise: 0.08,
        seed,
      });
      return { name: `placodes-${seed}.tif`, bytes: await encodeTiff16(img, { pixelSizeUm: 2.0 }), pixelSizeUm: 2.0 };
    };
    const stripes = (wavelengthPx: number, seed: number) => async () => {
      const img = makeStripes({ width: 640, height: 480, wavelengthPx, angleDeg: 80 + seed, noise: 0.1, seed });
      return { name: `ridges-${seed}.png`, bytes: await encodePng(img, { bitDepth: 8 }), pixelSizeUm: 1.5 };
    };
    plan.push(
      { study: placodes.id, label: "DS-01", condition: "control", stage: "HH31", genotype: null, image: spots(22, 1) },
      {
        study: placodes.id,
        label: "DS-02",
        condition: "control",
        stage: "HH31",
        genotype: null,
        image: spots(22.5, 2),
      },
      {
        study: placodes.id,
        label: "DS-03",
        condition: "inhibitor 5 µM",
        stage: "HH31",
        genotype: null,
        image: spots(27, 3),
      },
      {
        study: placodes.id,
        label: "DS-04",
        condition: "inhibitor 5 µM",
        stage: "HH31",
        genotype: null,
        image: spots(27.6, 4),
      },
      {
        study: rugae.id,
        label: "PR-11",
        condition: "wild type",
        stage: "E14.5",
        genotype: "+/+",
        image: stripes(30, 1),
      },
      {
        study: rugae.id,
        label: "PR-12",
        condition: "wild type",
        stage: "E14.5",
        genotype: "+/+",
        image: stripes(31, 2),
      },
      {
        study: rugae.id,
        label: "PR-21",
        condition: "mutant",
        stage: "E14.5",
        genotype: "ridge-wide/ridge-wide",
        image: stripes(38, 3),
      },
    );
    for (const p of plan) {
      const ctx = p.study === rugae.id ? manager : scientist;
      const s = await createSpecimen(ctx, p.study, {
        label: p.label,
        condition: p.condition,
        stage: p.stage,
        genotype: p.genotype,
        notes: null,
      });
      const { name, bytes, pixelSizeUm } = await p.image();
      const file = path.join(tmp, name);
      writeFileSync(file, bytes);
      const tiff = name.endsWith(".tif");
      const u = await storeUpload(ctx, s.id, {
        path: file,
        filename: name,
        sizeBytes: bytes.length,
        sha256: createHash("sha256").update(bytes).digest("hex"),
        kind: "image",
        contentType: tiff ? "image/tiff" : "image/png",
        pixelSizeUm,
        pixelSizeSource: tiff ? "tiff-resolution" : "uploader",
      });
      readouts.push(await startReadout(ctx, u.id, {}));
    }
    // A spacing table: 1-D positions of ridges along a transect, µm (invented numbers).
    const table = await createSpecimen(manager, rugae.id, {
      label: "PR-13",
      condition: "wild type",
      stage: "E14.5",
      genotype: "+/+",
      notes: "Ridge positions measured along the midline.",
    });
    const positions = Array.from({ length: 12 }, (_, i) => (i * 45.5 + (i % 3) * 1.2).toFixed(1));
    const csv = `position_um\n${positions.join("\n")}\n`;
    const csvFile = path.join(tmp, "ridge-positions.csv");
    writeFileSync(csvFile, csv);
    const t = await storeUpload(manager, table.id, {
      path: csvFile,
      filename: "ridge-positions.csv",
      sizeBytes: Buffer.byteLength(csv),
      sha256: createHash("sha256").update(csv).digest("hex"),
      kind: "table",
      contentType: "text/csv",
      pixelSizeUm: null,
      pixelSizeSource: null,
    });
    readouts.push(await startReadout(manager, t.id, {}));
    // The demo images are small (≤ 640×480), so their readouts take well under a second each;
    // wait here so callers that close the database right after seeding find them finished.
    for (const r of readouts) await waitForJob(r.jobId!, 120_000);

    // The modeller's side of the path: Schnakenberg fitted to the placode readouts with γ free per
    // condition (the spread between replicate specimens counted), then a verification run from the
    // fit for the control condition (64² cells, ≈ 10 s), and a collaborator's question on the fit.
    const placodeReadouts = readouts.slice(0, 4);
    const fit = await startFit(modeller, {
      name: "Placode spacing: Schnakenberg, γ per condition",
      data: placodeReadouts.map((r) => ({ readoutId: r.id })),
      uncertainty: "with-specimen-spread",
      models: [
        {
          kinetics: "schnakenberg",
          lengthScaleUm: 40,
          parameters: {
            gamma: { mode: "per-condition", start: 100, lower: 10, upper: 1000, log: true },
            d: { mode: "fixed", value: 20 },
          },
        },
      ],
    });
    await waitForJob(fit.jobId!, 120_000);
    const run = await startRun(modeller, {
      name: "Control placodes, from the fit",
      kinetics: "schnakenberg",
      grid: { lengthUm: [8, 8], cells: [64, 64] },
      endTimeS: 8,
      seed: 5,
      fit: { fitId: fit.id, condition: "control" },
    });
    await waitForJob(run.jobId!, 300_000);
    await createThread(collaborator, {
      targetType: "fit",
      targetId: fit.id,
      body: "Does the inhibitor only change γ here? It would help to see a fit with d free per condition as well, before we read the 5 µM result as a change in reaction rate.",
    });
  } finally {
    rmSync(tmp, { recursive: true, force: true });
  }
}
