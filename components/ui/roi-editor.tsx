"use client";
/**
 * Region of interest on an image preview: drag a rectangle, click the vertices of a polygon, or
 * type the rectangle in pixels. Coordinates are source-image pixels (x right, y down) whatever
 * size the preview is shown at: the SVG's viewBox is the source size.
 */
import { useRef, useState } from "react";
import type { RoiInput } from "@/lib/contracts/readout";

export interface RoiEditorProps {
  /** Preview of the whole image; null draws a blank field of the same size. */
  imageUrl: string | null;
  /** Source image size (px). */
  width: number;
  height: number;
  value: RoiInput | null;
  onChange?: (roi: RoiInput | null) => void;
  readOnly?: boolean;
  testId?: string;
}

type Mode = "rect" | "polygon";

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));

export function RoiShape({ roi, width }: { roi: RoiInput; width: number }) {
  const stroke = Math.max(1, width / 300);
  if (roi.kind === "rect")
    return (
      <rect
        x={roi.x}
        y={roi.y}
        width={Math.max(0, roi.width)}
        height={Math.max(0, roi.height)}
        fill="#1f5c45"
        fillOpacity={0.12}
        stroke="#a8650a"
        strokeWidth={stroke * 2}
        data-testid="roi-shape"
      />
    );
  return (
    <polygon
      points={roi.points.map((p) => p.join(",")).join(" ")}
      fill="#1f5c45"
      fillOpacity={0.12}
      stroke="#a8650a"
      strokeWidth={stroke * 2}
      data-testid="roi-shape"
    />
  );
}

export function RoiEditor({
  imageUrl,
  width,
  height,
  value,
  onChange,
  readOnly = false,
  testId = "roi-editor",
}: RoiEditorProps) {
  const svgRef = useRef<SVGSVGElement>(null);
  const [mode, setMode] = useState<Mode>(value?.kind === "polygon" ? "polygon" : "rect");
  const [drag, setDrag] = useState<{ x0: number; y0: number } | null>(null);
  const [draft, setDraft] = useState<Array<[number, number]>>([]);

  const toImage = (e: React.PointerEvent | React.MouseEvent): [number, number] => {
    const svg = svgRef.current!;
    const pt = svg.createSVGPoint();
    pt.x = e.clientX;
    pt.y = e.clientY;
    const p = pt.matrixTransform(svg.getScreenCTM()!.inverse());
    return [Math.round(clamp(p.x, 0, width)), Math.round(clamp(p.y, 0, height))];
  };
  const down = (e: React.PointerEvent) => {
    if (readOnly || mode !== "rect") return;
    const [x, y] = toImage(e);
    (e.target as Element).setPointerCapture?.(e.pointerId);
    setDrag({ x0: x, y0: y });
    onChange?.({ kind: "rect", x, y, width: 0, height: 0 });
  };
  const move = (e: React.PointerEvent) => {
    if (!drag) return;
    const [x, y] = toImage(e);
    onChange?.({
      kind: "rect",
      x: Math.min(x, drag.x0),
      y: Math.min(y, drag.y0),
      width: Math.abs(x - drag.x0),
      height: Math.abs(y - drag.y0),
    });
  };
  const click = (e: React.MouseEvent) => {
    if (readOnly || mode !== "polygon") return;
    setDraft((d) => [...d, toImage(e)]);
  };
  const closePolygon = () => {
    if (draft.length >= 3) onChange?.({ kind: "polygon", points: draft });
    setDraft([]);
  };
  const rect = value?.kind === "rect" ? value : null;
  const setRect = (k: "x" | "y" | "width" | "height", v: string) => {
    const n = Number(v);
    const base = rect ?? { kind: "rect" as const, x: 0, y: 0, width, height };
    onChange?.({ ...base, [k]: Number.isFinite(n) ? n : 0 });
  };
  const stroke = Math.max(1, width / 300);

  return (
    <div className="space-y-2" data-testid={testId}>
      <svg
        ref={svgRef}
        viewBox={`0 0 ${width} ${height}`}
        className={`block h-auto w-full max-w-xl touch-none select-none rounded border border-rule bg-paper-deep ${readOnly ? "" : mode === "rect" ? "cursor-crosshair" : "cursor-copy"}`}
        onPointerDown={down}
        onPointerMove={move}
        onPointerUp={() => setDrag(null)}
        onClick={click}
        onDoubleClick={closePolygon}
        role="img"
        aria-label={`preview of the image, ${width}×${height} px, with the region of interest`}
      >
        {imageUrl ? (
          <image href={imageUrl} x={0} y={0} width={width} height={height} preserveAspectRatio="none" />
        ) : (
          <rect x={0} y={0} width={width} height={height} fill="#ece4d3" />
        )}
        {value && <RoiShape roi={value} width={width} />}
        {draft.length > 0 && (
          <polyline
            points={draft.map((p) => p.join(",")).join(" ")}
            fill="none"
            stroke="#a8650a"
            strokeDasharray={`${stroke * 4} ${stroke * 3}`}
            strokeWidth={stroke * 2}
          />
        )}
        {draft.map(([x, y], i) => (
          <circle key={i} cx={x} cy={y} r={stroke * 3} fill="#a8650a" />
        ))}
      </svg>
      {!readOnly && (
        <div className="space-y-2 text-sm">
          <div className="flex flex-wrap items-center gap-3">
            <span className="font-medium">Region of interest</span>
            <label className="flex items-center gap-1">
              <input
                type="radio"
                name="roi-mode"
                checked={mode === "rect"}
                onChange={() => {
                  setMode("rect");
                  setDraft([]);
                }}
              />{" "}
              rectangle (drag)
            </label>
            <label className="flex items-center gap-1">
              <input type="radio" name="roi-mode" checked={mode === "polygon"} onChange={() => setMode("polygon")} />{" "}
              polygon (click vertices, double-click to close)
            </label>
            {mode === "polygon" && draft.length >= 3 && (
              <button type="button" className="text-moss underline" onClick={closePolygon}>
                Close polygon ({draft.length} points)
              </button>
            )}
            <button
              type="button"
              className="text-ink-soft underline"
              onClick={() => {
                setDraft([]);
                onChange?.(null);
              }}
              data-testid="roi-clear"
            >
              Whole image
            </button>
          </div>
          {mode === "rect" && (
            <div className="flex flex-wrap gap-3">
              {(["x", "y", "width", "height"] as const).map((k) => (
                <label key={k} className="flex items-center gap-1">
                  <span className="text-ink-soft">{k} (px)</span>
                  <input
                    type="number"
                    step={1}
                    className="num w-20 rounded border border-rule bg-card px-2 py-1"
                    aria-label={`ROI ${k} (px)`}
                    data-testid={`roi-${k}`}
                    value={rect ? rect[k] : ""}
                    placeholder={k === "width" ? String(width) : k === "height" ? String(height) : "0"}
                    onChange={(e) => setRect(k, e.target.value)}
                  />
                </label>
              ))}
            </div>
          )}
          <p className="text-xs text-ink-soft">
            Coordinates are pixels of the original image ({width}×{height} px).{" "}
            {value ? describeRoi(value) : "No ROI: the whole image is read."}
          </p>
        </div>
      )}
    </div>
  );
}

export function describeRoi(roi: RoiInput | null): string {
  if (!roi) return "whole image";
  if (roi.kind === "rect") return `rectangle x ${roi.x}, y ${roi.y}, ${roi.width}×${roi.height} px`;
  return `polygon of ${roi.points.length} vertices`;
}
