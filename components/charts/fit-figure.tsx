"use client";
/**
 * A figure frame with SVG and PNG downloads, made in the browser from the chart's own SVG
 * (the largest <svg> inside; PNG at 2× through a canvas). Paper background, fonts as drawn; the
 * file carries the legend and a caption line with the provenance of the data (figure-export.ts).
 */
import { createContext, useContext, useRef } from "react";
import { composeFigure, largestSvg, legendOf } from "./figure-export";

/**
 * The caption line of every figure below it, naming where the data came from ("Fit <id> …",
 * "Readout <id> …"); set once by the page that knows the id.
 */
export const FigureCaption = createContext<string>("");

function download(blob: Blob, filename: string) {
  const a = document.createElement("a");
  a.href = URL.createObjectURL(blob);
  a.download = filename;
  a.click();
  setTimeout(() => URL.revokeObjectURL(a.href), 1000);
}

export function FitFigure({
  filename,
  children,
  testId,
  caption,
}: {
  filename: string;
  children: React.ReactNode;
  testId?: string;
  /** This figure's own caption; otherwise the page's (FigureCaption). */
  caption?: string;
}) {
  const ref = useRef<HTMLDivElement>(null);
  const pageCaption = useContext(FigureCaption);
  const compose = () => {
    const root = ref.current;
    const svg = root && largestSvg(root);
    return root && svg ? composeFigure(svg, legendOf(root), caption ?? pageCaption) : null;
  };
  const svgOut = () => {
    const figure = compose();
    if (figure) download(new Blob([figure.text], { type: "image/svg+xml" }), `${filename}.svg`);
  };
  const pngOut = () => {
    const figure = compose();
    if (!figure) return;
    const img = new Image();
    img.onload = () => {
      const canvas = document.createElement("canvas");
      canvas.width = Math.round(figure.width * 2);
      canvas.height = Math.round(figure.height * 2);
      const ctx = canvas.getContext("2d")!;
      ctx.scale(2, 2);
      ctx.drawImage(img, 0, 0);
      canvas.toBlob((b) => b && download(b, `${filename}.png`), "image/png");
    };
    img.src = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(figure.text)}`;
  };
  return (
    <figure className="space-y-1" data-testid={testId}>
      <div ref={ref}>{children}</div>
      <figcaption className="flex justify-end gap-2 text-xs text-ink-soft">
        <button type="button" className="hover:text-ink hover:underline" onClick={svgOut} data-testid="figure-svg">
          SVG
        </button>
        <button type="button" className="hover:text-ink hover:underline" onClick={pngOut} data-testid="figure-png">
          PNG
        </button>
      </figcaption>
    </figure>
  );
}
