"use client";
/**
 * A figure frame with SVG and PNG downloads, made in the browser from the chart's own SVG
 * (the largest <svg> inside; PNG at 2× through a canvas). Paper background, fonts as drawn.
 */
import { useRef } from "react";

function largestSvg(root: HTMLElement): SVGSVGElement | null {
  let best: SVGSVGElement | null = null,
    area = 0;
  root.querySelectorAll("svg").forEach((s) => {
    const r = s.getBoundingClientRect();
    if (r.width * r.height > area) {
      area = r.width * r.height;
      best = s;
    }
  });
  return best;
}

function serialise(svg: SVGSVGElement): { text: string; width: number; height: number } {
  const r = svg.getBoundingClientRect();
  const copy = svg.cloneNode(true) as SVGSVGElement;
  copy.setAttribute("xmlns", "http://www.w3.org/2000/svg");
  copy.setAttribute("width", String(Math.round(r.width)));
  copy.setAttribute("height", String(Math.round(r.height)));
  const bg = document.createElementNS("http://www.w3.org/2000/svg", "rect");
  bg.setAttribute("width", "100%");
  bg.setAttribute("height", "100%");
  bg.setAttribute("fill", "#fbf8f1");
  copy.insertBefore(bg, copy.firstChild);
  return { text: new XMLSerializer().serializeToString(copy), width: r.width, height: r.height };
}

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
}: {
  filename: string;
  children: React.ReactNode;
  testId?: string;
}) {
  const ref = useRef<HTMLDivElement>(null);
  const svgOut = () => {
    const svg = ref.current && largestSvg(ref.current);
    if (svg) download(new Blob([serialise(svg).text], { type: "image/svg+xml" }), `${filename}.svg`);
  };
  const pngOut = () => {
    const svg = ref.current && largestSvg(ref.current);
    if (!svg) return;
    const { text, width, height } = serialise(svg);
    const img = new Image();
    img.onload = () => {
      const canvas = document.createElement("canvas");
      canvas.width = Math.round(width * 2);
      canvas.height = Math.round(height * 2);
      const ctx = canvas.getContext("2d")!;
      ctx.scale(2, 2);
      ctx.drawImage(img, 0, 0);
      canvas.toBlob((b) => b && download(b, `${filename}.png`), "image/png");
    };
    img.src = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(text)}`;
  };
  return (
    <figure className="space-y-1" data-testid={testId}>
      <div ref={ref}>{children}</div>
      <figcaption className="flex justify-end gap-2 text-xs text-ink-soft">
        <button type="button" className="hover:text-ink hover:underline" onClick={svgOut}>
          SVG
        </button>
        <button type="button" className="hover:text-ink hover:underline" onClick={pngOut}>
          PNG
        </button>
      </figcaption>
    </figure>
  );
}
