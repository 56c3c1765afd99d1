"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { RoiEditor } from "@/components/ui/roi-editor";
import { ApiError, sendJson } from "@/lib/client/api";
import type { RoiInput } from "@/lib/contracts/readout";
import type { ReadoutDetailDto, ReadoutDto } from "@/lib/server/readouts/readouts";
import { initialStackChoice, StackFields } from "./stack-fields";
import { optionalTypedNumber } from "@/lib/format/typed-number";

const selectClass = "rounded-md border border-rule bg-card px-2 py-1.5 text-sm";

function Select({
  label,
  value,
  onChange,
  options,
  testId,
}: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  options: Array<[string, string]>;
  testId: string;
}) {
  return (
    <label className="flex flex-col gap-1 text-sm">
      <span className="font-medium">{label}</span>
      <select className={selectClass} value={value} onChange={(e) => onChange(e.target.value)} data-testid={testId}>
        {options.map(([v, l]) => (
          <option key={v} value={v}>
            {l}
          </option>
        ))}
      </select>
    </label>
  );
}

/** A new readout of the same file with other settings; this one stays as it is. */
export function RerunForm({ labId, readout }: { labId: string; readout: ReadoutDetailDto }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const s = readout.settings;
  const img = s.kind === "image" ? s : null;
  const tab = s.kind === "table" ? s : null;
  const [roi, setRoi] = useState<RoiInput | null>((img?.roi as RoiInput | null) ?? null);
  const [channel, setChannel] = useState(String(img?.channel ?? "luminance"));
  const [invert, setInvert] = useState(img?.invert ?? false);
  const [flatten, setFlatten] = useState<string>(img?.flatten ?? "auto");
  const [win, setWin] = useState<string>(img?.window ?? "hann");
  const [tissue, setTissue] = useState<string>(img?.tissueMask ?? "auto");
  const [axis, setAxis] = useState<string>(img?.profileAxis ?? "x");
  const [stack, setStack] = useState(() => initialStackChoice(readout));
  const used = readout.result?.type === "table" ? readout.result.mapping : null;
  const [cols, setCols] = useState({
    x: tab?.columns?.x ?? used?.x ?? "",
    y: tab?.columns?.y ?? used?.y ?? "",
    position: tab?.columns?.position ?? used?.position ?? "",
    spacing: tab?.columns?.spacing ?? used?.spacing ?? "",
  });
  // "" = the unit the header states (µm when it states none)
  const [unit, setUnit] = useState<string>(tab?.unit ?? "");
  const [sheet, setSheet] = useState<string>(
    tab?.sheet ??
      (readout.result?.type === "table" && readout.result.source?.kind === "xlsx" ? readout.result.source.sheet : ""),
  );
  const [pixelSize, setPixelSize] = useState("");
  const image = readout.result?.type === "image" ? readout.result.image : null;
  const tissueOutline =
    readout.result?.type === "image" ? (readout.result.wavelength.tissueRegion?.outline ?? null) : null;
  const channels = image?.channels ?? 3;

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setError(null);
    const px = optionalTypedNumber(pixelSize);
    const body = img
      ? {
          roi,
          channel: channel === "luminance" ? "luminance" : Number(channel),
          invert,
          flatten,
          window: win,
          tissueMask: tissue,
          profileAxis: axis,
          ...stack,
          ...(px !== undefined ? { pixelSizeUm: px } : {}),
        }
      : {
          columns: Object.fromEntries(Object.entries(cols).filter(([, v]) => v.trim() !== "")),
          ...(unit !== "" ? { unit } : {}),
          ...(sheet.trim() !== "" ? { sheet: sheet.trim() } : {}),
          ...(px !== undefined ? { pixelSizeUm: px } : {}),
        };
    try {
      const created = await sendJson<ReadoutDto>(
        "POST",
        `/api/v1/labs/${labId}/uploads/${readout.uploadId}/readouts`,
        body,
      );
      router.push(`/labs/${labId}/readouts/${created.id}`);
    } catch (err) {
      setError(err instanceof ApiError ? err.message : "Could not start the readout.");
      setBusy(false);
    }
  }

  return (
    <Panel title="Read again with other settings">
      <form onSubmit={submit} className="space-y-4" data-testid="rerun-form">
        <p className="text-sm text-ink-soft">
          A readout never changes: this makes a new one and keeps this one in the list.
        </p>
        {img && (
          <>
            {image && tissueOutline && (
              <Button
                type="button"
                variant="secondary"
                onClick={() => setRoi({ kind: "polygon", points: tissueOutline })}
                data-testid="rerun-correct-region"
              >
                Correct the region
              </Button>
            )}
            {image ? (
              <RoiEditor
                imageUrl={readout.derived["preview.png"] ?? null}
                width={image.width}
                height={image.height}
                value={roi}
                onChange={setRoi}
              />
            ) : (
              <p className="text-sm text-ink-soft">
                The image size is not known from this readout, so the ROI cannot be drawn here; run with the whole image
                first.
              </p>
            )}
            <StackFields readout={readout} value={stack} onChange={setStack} />
            <div className="flex flex-wrap items-end gap-4">
              <Select
                label="Channel"
                value={channel}
                onChange={setChannel}
                testId="rerun-channel"
                options={[
                  ["luminance", "luminance (Rec. 709)"],
                  ...Array.from({ length: Math.min(channels, 16) }, (_, i): [string, string] => [
                    String(i),
                    `channel ${i}`,
                  ]),
                ]}
              />
              <Select
                label="Background flattening"
                value={flatten}
                onChange={setFlatten}
                testId="rerun-flatten"
                options={[
                  ["auto", "on — plane, then a smooth background inside the tissue"],
                  ["plane", "on — subtract a fitted plane"],
                  ["blur", "on — subtract a heavy blur"],
                  ["none", "off"],
                ]}
              />
              <Select
                label="Tissue region"
                value={tissue}
                onChange={setTissue}
                testId="rerun-tissue"
                options={[
                  ["auto", "found automatically (by texture)"],
                  ["off", "off — analyse the whole region"],
                ]}
              />
              <Select
                label="Window"
                value={win}
                onChange={setWin}
                testId="rerun-window"
                options={[
                  ["hann", "Hann"],
                  ["tukey", "Tukey (α 0.25)"],
                  ["none", "none"],
                ]}
              />
              <Select
                label="Local profile along"
                value={axis}
                onChange={setAxis}
                testId="rerun-axis"
                options={[
                  ["x", "x (columns)"],
                  ["y", "y (rows)"],
                ]}
              />
              <label className="flex items-center gap-2 pb-2 text-sm">
                <input
                  type="checkbox"
                  checked={invert}
                  onChange={(e) => setInvert(e.target.checked)}
                  data-testid="rerun-invert"
                />{" "}
                invert (dark pattern on light)
              </label>
            </div>
          </>
        )}
        {tab && (
          <div className="flex flex-wrap items-end gap-4">
            {(["x", "y", "position", "spacing"] as const).map((k) => (
              <label key={k} className="flex flex-col gap-1 text-sm">
                <span className="font-medium">{k} column</span>
                <input
                  className={`${selectClass} w-36`}
                  value={cols[k]}
                  onChange={(e) => setCols({ ...cols, [k]: e.target.value })}
                  data-testid={`rerun-column-${k}`}
                  placeholder="header or letter (A, B…)"
                />
              </label>
            ))}
            <Select
              label="Unit of the numbers"
              value={unit}
              onChange={setUnit}
              testId="rerun-unit"
              options={[
                ["", "as the header says (else µm)"],
                ["um", "µm"],
                ["nm", "nm"],
                ["mm", "mm"],
                ["px", "px (needs a pixel size)"],
              ]}
            />
            <label className="flex flex-col gap-1 text-sm">
              <span className="font-medium">Sheet (XLSX workbooks)</span>
              <input
                className={`${selectClass} w-36`}
                value={sheet}
                onChange={(e) => setSheet(e.target.value)}
                data-testid="rerun-sheet"
                placeholder="the first sheet"
              />
            </label>
          </div>
        )}
        <div className="flex flex-wrap items-end gap-4">
          <label className="flex flex-col gap-1 text-sm">
            <span className="font-medium">Pixel size for this readout (µm/px)</span>
            <input
              className={`${selectClass} num w-40`}
              inputMode="decimal"
              value={pixelSize}
              onChange={(e) => setPixelSize(e.target.value)}
              placeholder={readout.pixelSizeUm ? String(readout.pixelSizeUm) : "none"}
              data-testid="rerun-pixel-size"
            />
          </label>
          <Button type="submit" disabled={busy} data-testid="rerun-submit">
            {busy ? "Starting…" : "Start new readout"}
          </Button>
        </div>
        {error && (
          <Notice tone="error" testId="rerun-error">
            {error}
          </Notice>
        )}
      </form>
    </Panel>
  );
}
