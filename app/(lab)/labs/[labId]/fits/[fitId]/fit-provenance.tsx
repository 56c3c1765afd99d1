"use client";
/** Where every number of a fit came from: data sources, kinetics versions, settings, software, hashes. */
import Link from "next/link";
import { formatNumber as f } from "@/components/charts/dispersion-format";
import { Panel } from "@/components/ui/panel";
import type { FitDetailDto } from "@/lib/server/fits/fits";

export function FitProvenance({ labId, fit }: { labId: string; fit: FitDetailDto }) {
  const p = fit.provenance;
  return (
    <Panel title="Provenance">
      <div className="grid gap-6 lg:grid-cols-2" data-testid="provenance">
        <div>
          <h3 className="mb-1 text-xs font-semibold text-ink-soft">Data</h3>
          {typeof p.settings.replicateCounts === "string" && (
            <p className="mb-1 text-xs" data-testid="fit-replicates">
              Replicates: <span className="num">{p.settings.replicateCounts}</span> — a specimen&apos;s images are
              averaged first
              {p.settings.uncertainty === "with-specimen-spread"
                ? "; the spread between specimens is in the weights"
                : ""}
              .
            </p>
          )}
          {p.settings.replicates === "images" && (
            <p className="mb-1 text-xs text-ochre" data-testid="fit-replicates">
              Every image is its own datum here: several images of one specimen are not independent
              (pseudo-replication).
            </p>
          )}
          <table className="w-full text-sm">
            <thead className="text-left text-xs text-ink-soft">
              <tr>
                <th className="py-1">#</th>
                <th>Condition</th>
                <th>Source</th>
                <th className="text-right">Value (µm)</th>
              </tr>
            </thead>
            <tbody>
              {p.data.map((d) => {
                // Several images of one specimen feed one fitted datum; a repeated file feeds none.
                const di = d.datumIndex === undefined ? d.index : d.datumIndex;
                const datum = di === null ? null : fit.spec.data[di];
                return (
                  <tr key={d.index} className="border-t border-rule/60 align-top">
                    <td className="num py-1 pr-2">{d.index + 1}</td>
                    <td>{d.condition}</td>
                    <td className="text-xs">
                      {d.readoutId ? (
                        <>
                          <Link className="text-moss hover:underline" href={`/labs/${labId}/readouts/${d.readoutId}`}>
                            readout of {d.filename}
                          </Link>
                          <br />
                          <span className="text-ink-soft">
                            {d.studyName} · {d.specimenLabel} · {d.measure} · input{" "}
                            <span className="num">{d.inputSha256?.slice(0, 12)}…</span>
                          </span>
                        </>
                      ) : (
                        <span className="text-ink-soft">typed in</span>
                      )}
                    </td>
                    <td className="num text-right text-moss">
                      {!datum ? (
                        <span className="text-xs text-ink-soft">{d.note ?? "not counted"}</span>
                      ) : (
                        <>
                          {d.kind === "nearest-neighbour" ? "a = " : "λ = "}
                          {f(datum.wavelengthUm)} ± {f(datum.uncertaintyUm, 2)}
                          {datum.domain ? (
                            <span className="block text-xs text-ink-soft">
                              tissue{" "}
                              {datum.domain.kind === "interval"
                                ? `${f(datum.domain.length)} µm`
                                : datum.domain.kind === "rectangle"
                                  ? `${f(datum.domain.lx)} × ${f(datum.domain.ly)} µm`
                                  : ""}
                            </span>
                          ) : null}
                          {fit.provenance.data.filter(
                            (x) => (x.datumIndex === undefined ? x.index : x.datumIndex) === di,
                          ).length > 1 && (
                            <span className="block text-xs text-ink-soft">mean of this specimen&apos;s images</span>
                          )}
                        </>
                      )}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
        <div className="space-y-3 text-sm">
          <div>
            <h3 className="mb-1 text-xs font-semibold text-ink-soft">Kinetics</h3>
            {p.kinetics.map((k, i) => {
              const m = fit.spec.models[i];
              return (
                <p key={k.label}>
                  <Link
                    className="text-moss hover:underline"
                    href={`/labs/${labId}/kinetics/${k.id}${k.version ? `?version=${k.version}` : ""}`}
                  >
                    {k.name}
                  </Link>
                  {k.version ? ` version ${k.version}` : " (catalogue)"}
                  {m?.lengthScaleUm !== undefined && (
                    <>
                      {" "}
                      · ℓ = <span className="num">{f(m.lengthScaleUm)} µm</span>
                    </>
                  )}
                  <span className="block text-xs text-ink-soft">
                    {k.source}
                    {k.definitionSha256 && (
                      <>
                        {" "}
                        · definition <span className="num">{k.definitionSha256.slice(0, 12)}…</span>
                      </>
                    )}
                  </span>
                </p>
              );
            })}
          </div>
          <div>
            <h3 className="mb-1 text-xs font-semibold text-ink-soft">Settings and software</h3>
            <p className="num text-xs">
              {Object.entries(p.settings)
                .map(([k, v]) => `${k} = ${String(v)}`)
                .join(" · ")}
            </p>
            <p className="text-xs">
              {fit.softwareVersion} · ran as a {fit.result?.runner ?? p.runner}
              {fit.result ? (
                <>
                  {" "}
                  in <span className="num">{f(fit.result.elapsedMs / 1000, 3)} s</span>
                </>
              ) : null}
            </p>
            <p className="text-xs">
              input SHA-256{" "}
              <span className="num" data-testid="input-sha">
                {fit.inputSha256}
              </span>
            </p>
            <p className="text-xs text-ink-soft">
              The stored spec is the command line&apos;s FIT.json (in the JSON export under{" "}
              <span className="num">spec</span>):{" "}
              <span className="num">npm run -s cli -- fit --spec FIT.json --json</span> gives the same numbers for
              catalogue kinetics.
            </p>
          </div>
        </div>
      </div>
    </Panel>
  );
}
