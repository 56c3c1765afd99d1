"use client";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import type { Summary } from "@/lib/spacing";
import type { TableReadoutResult } from "@/lib/server/readouts/result";
import { formatSig, pixelSizeLabel } from "../readout-format";

const KIND_WORDS = {
  "positions-1d": "1-D positions (successive differences)",
  "centroids-2d": "2-D centroids (nearest-neighbour distances)",
  spacings: "a list of spacings",
} as const;
const UNIT_WORDS = { um: "µm", nm: "nm", mm: "mm", px: "px" } as const;

function SummaryTable({ title, s, testId }: { title: string; s: Summary; testId: string }) {
  const cells: Array<[string, string]> = [
    ["n", String(s.n)],
    ["mean", `${formatSig(s.mean)} µm`],
    ["SD", `${formatSig(s.sd)} µm`],
    ["SEM", `${formatSig(s.sem)} µm`],
    ["CV", `${formatSig(s.cv * 100, 3)} %`],
    ["median", `${formatSig(s.median)} µm`],
    ["95 % CI of the mean", `${formatSig(s.ci95[0])} – ${formatSig(s.ci95[1])} µm`],
    ["range", `${formatSig(s.min)} – ${formatSig(s.max)} µm`],
  ];
  return (
    <table className="w-full max-w-xl text-sm" data-testid={testId}>
      <caption className="pb-1 text-left text-sm font-medium">{title}</caption>
      <tbody>
        {cells.map(([k, v]) => (
          <tr key={k} className="border-t border-rule">
            <th scope="row" className="py-1 pr-6 text-left font-normal text-ink-soft">
              {k}
            </th>
            <td className="num py-1">{v}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export function TableResult({ result }: { result: TableReadoutResult }) {
  const t = result.table;
  const m = result.mapping;
  // Readouts made before the columns were named with their letters carry only the header names.
  const cols =
    result.columnsTaken ??
    (["x", "y", "position", "spacing"] as const)
      .filter((k) => m[k])
      .map((k) => `${k} = “${m[k]}”`)
      .join(", ");
  const source = result.source;
  return (
    <Panel title="Numbers">
      <p className="mb-3 text-sm" data-testid="table-columns">
        Read as {KIND_WORDS[t.kind]}
        {source?.kind === "xlsx" && (
          <>
            {" "}
            from the sheet <span className="num">“{source.sheet}”</span>
          </>
        )}
        . Columns {m.guessed ? "taken from the header" : "chosen"}: <span className="num">{cols}</span>; unit{" "}
        {UNIT_WORDS[m.unit]}
        {result.decimalMark === "," ? "; numbers written with decimal commas" : ""}
        {m.guessed ? " (if a column is wrong, choose the columns below and read again)" : ""}. Values below in µm.
        {result.pixelSizeUm !== null && (
          <>
            {" "}
            Pixel size <span className="num">{pixelSizeLabel(result.pixelSizeUm, result.pixelSizeSource)}</span>.
          </>
        )}
      </p>
      <div className="grid gap-5 lg:grid-cols-2">
        {t.kind === "positions-1d" && (
          <div>
            <SummaryTable title="Spacing between successive positions" s={t.spacingUm} testId="table-summary" />
            <p className="mt-2 text-sm">
              Mean spacing (last − first)/(n − 1):{" "}
              <span className="num font-semibold text-moss" data-testid="readout-wavelength">
                {formatSig(t.meanSpacingUm)} µm
              </span>{" "}
              over <span className="num">{t.n}</span> positions.
            </p>
          </div>
        )}
        {t.kind === "spacings" && <SummaryTable title="Listed spacings" s={t.spacingUm} testId="table-summary" />}
        {t.kind === "centroids-2d" && (
          <>
            <div>
              <SummaryTable
                title={`Nearest-neighbour distance, all ${t.n} points`}
                s={t.nearestNeighbourUm}
                testId="table-summary"
              />
              {t.interiorNearestNeighbourUm && (
                <div className="mt-4">
                  <SummaryTable
                    title="Interior points only (edge-bias corrected)"
                    s={t.interiorNearestNeighbourUm}
                    testId="table-interior"
                  />
                </div>
              )}
            </div>
            <dl className="grid h-fit grid-cols-[max-content_1fr] gap-x-6 gap-y-1.5 text-sm">
              <dt className="text-ink-soft">Clark–Evans R</dt>
              <dd className="num" data-testid="clark-evans">
                {formatSig(t.clarkEvansR, 4)}{" "}
                <span className="font-sans text-xs text-ink-soft">(1 random, ≈ 2.15 hexagonal)</span>
              </dd>
              <dt className="text-ink-soft">Density</dt>
              <dd className="num">{formatSig(t.densityPerUm2 * 1e6, 4)} per mm²</dd>
              <dt className="text-ink-soft">Equivalent Fourier wavelength, hexagonal packing (√3/2 · mean NN)</dt>
              <dd className="num font-semibold text-moss" data-testid="readout-wavelength">
                {formatSig(t.equivalentHexWavelengthUm)} µm
              </dd>
            </dl>
          </>
        )}
      </div>
      {t.warnings.length > 0 && (
        <div className="mt-3 space-y-1">
          {t.warnings.map((x) => (
            <Notice key={x} tone="warning">
              {x}
            </Notice>
          ))}
        </div>
      )}
    </Panel>
  );
}
