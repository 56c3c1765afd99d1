import Link from "next/link";
import { redirect } from "next/navigation";
import { getActor } from "@/lib/server/accounts/actor";

export const dynamic = "force-dynamic";

const steps = [
  [
    "Upload",
    "Stained images (PNG, JPEG, 8- or 16-bit TIFF) and spacing tables go to the lab's shared store, each with its checksum and pixel size.",
  ],
  [
    "Read the spacing",
    "The server reads the dominant wavelength by 2-D FFT, with an uncertainty from the data and a significance against the background.",
  ],
  [
    "Ask the kinetics",
    "Dispersion relations, Turing-space maps and admissible modes tell which wavelength a reaction–diffusion model predicts.",
  ],
  [
    "Fit and compare",
    "Fit kinetics to the measured wavelengths across conditions, with confidence intervals and a ranking, then discuss the fit with collaborators.",
  ],
];

export default async function Landing() {
  if (await getActor()) redirect("/labs");
  return (
    <div className="space-y-12 py-6">
      <section className="grid gap-10 md:grid-cols-[1.2fr_1fr] md:items-center">
        <div className="space-y-5">
          <h1 className="text-4xl font-semibold leading-tight text-ink">
            Does the model&apos;s wavelength match the tissue&apos;s spacing?
          </h1>
          <p className="text-lg text-ink-soft">
            Morphokin is the lab&apos;s shared workspace for periodic tissue patterns — placodes, scales, teeth, digits,
            stripes. Bench scientists measure the spacing, modellers test which reaction–diffusion kinetics explain it,
            and everyone can check the numbers.
          </p>
          <div className="flex gap-3">
            <Link href="/signup" className="rounded-md bg-moss px-4 py-2 font-medium text-white hover:bg-moss-dark">
              Start a lab workspace
            </Link>
            <Link
              href="/login"
              className="rounded-md border border-rule bg-card px-4 py-2 font-medium hover:bg-paper-deep"
            >
              Sign in
            </Link>
          </div>
        </div>
        <svg
          viewBox="0 0 320 200"
          className="w-full rounded-lg border border-rule bg-card"
          role="img"
          aria-label="A hexagonal lattice of spots with its measured spacing"
        >
          {Array.from({ length: 7 }).flatMap((_, r) =>
            Array.from({ length: 11 }).map((__, c) => (
              <circle
                key={`${r}-${c}`}
                cx={20 + c * 28 + (r % 2) * 14}
                cy={20 + r * 24.25}
                r={7}
                fill="var(--color-moss)"
                opacity={0.85}
              />
            )),
          )}
          <line x1={104} y1={92.75} x2={132} y2={92.75} stroke="var(--color-iris)" strokeWidth={2} />
          <text x={118} y={86} textAnchor="middle" fontSize={10} fill="var(--color-iris)" className="num">
            a
          </text>
        </svg>
      </section>
      <section className="grid gap-4 md:grid-cols-4">
        {steps.map(([title, text], i) => (
          <div key={title} className="rounded-lg border border-rule bg-card p-4">
            <div className="num text-xs text-ink-soft">step {i + 1}</div>
            <h2 className="mt-1 font-semibold">{title}</h2>
            <p className="mt-1 text-sm text-ink-soft">{text}</p>
          </div>
        ))}
      </section>
    </div>
  );
}
