/**
 * Turns a chart on screen into a stand-alone SVG file that reads without the page: the chart's
 * own SVG (axes and their labels with units as drawn), its legend (recharts draws the legend as
 * HTML beside the SVG, so it is redrawn here as SVG text with colour swatches) and a caption line
 * naming the data's provenance id. Browser-only (DOM), no React.
 */
const NS = "http://www.w3.org/2000/svg";
const PAPER = "#fbf8f1";
const INK = "#22201b";
const INK_SOFT = "#5c574c";
const LINE_PX = 18;

export interface LegendEntry {
  label: string;
  color: string;
}

export function largestSvg(root: HTMLElement): SVGSVGElement | null {
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

/** The legend entries recharts drew as HTML inside `root`, with the colour of each swatch. */
export function legendOf(root: HTMLElement): LegendEntry[] {
  return [...root.querySelectorAll<HTMLElement>(".recharts-legend-item")].map((item) => {
    const swatch = item.querySelector("svg path, svg line, svg rect, svg circle");
    const color =
      swatch?.getAttribute("fill") && swatch.getAttribute("fill") !== "none"
        ? swatch.getAttribute("fill")!
        : (swatch?.getAttribute("stroke") ?? INK);
    return { label: (item.textContent ?? "").trim(), color };
  });
}

function text(x: number, y: number, content: string, fill: string, size: number): SVGTextElement {
  const t = document.createElementNS(NS, "text");
  t.setAttribute("x", String(x));
  t.setAttribute("y", String(y));
  t.setAttribute("fill", fill);
  t.setAttribute("font-size", String(size));
  t.setAttribute("font-family", "Inter, sans-serif");
  t.textContent = content;
  return t;
}

/** Legend lines (several entries per line while they fit the width), then the chart, then the caption. */
export function composeFigure(
  svg: SVGSVGElement,
  legend: LegendEntry[],
  caption: string,
): { text: string; width: number; height: number } {
  const r = svg.getBoundingClientRect();
  const width = Math.round(r.width);
  const chartHeight = Math.round(r.height);
  const out = document.createElementNS(NS, "svg");
  out.setAttribute("xmlns", NS);
  const bg = document.createElementNS(NS, "rect");
  bg.setAttribute("width", "100%");
  bg.setAttribute("height", "100%");
  bg.setAttribute("fill", PAPER);
  out.appendChild(bg);

  // Legend: ~6.5 px per character at 12 px is a safe width estimate for Inter (common practice, no source).
  let x = 8,
    y = LINE_PX - 4;
  const legendGroup = document.createElementNS(NS, "g");
  legendGroup.setAttribute("class", "figure-legend");
  for (const entry of legend) {
    const w = 16 + entry.label.length * 6.5 + 16;
    if (x > 8 && x + w > width) {
      x = 8;
      y += LINE_PX;
    }
    const swatch = document.createElementNS(NS, "rect");
    swatch.setAttribute("x", String(x));
    swatch.setAttribute("y", String(y - 9));
    swatch.setAttribute("width", "10");
    swatch.setAttribute("height", "10");
    swatch.setAttribute("fill", entry.color);
    legendGroup.appendChild(swatch);
    legendGroup.appendChild(text(x + 14, y, entry.label, INK, 12));
    x += w;
  }
  out.appendChild(legendGroup);
  const top = legend.length ? y + 8 : 0;

  const chart = svg.cloneNode(true) as SVGSVGElement;
  chart.setAttribute("x", "0");
  chart.setAttribute("y", String(top));
  chart.setAttribute("width", String(width));
  chart.setAttribute("height", String(chartHeight));
  // The on-screen legend is HTML; any legend drawn inside the SVG stays where the chart put it.
  out.appendChild(chart);

  const captionY = top + chartHeight + LINE_PX - 2;
  const cap = text(8, captionY, caption, INK_SOFT, 11);
  cap.setAttribute("class", "figure-caption");
  out.appendChild(cap);

  const height = captionY + 8;
  out.setAttribute("width", String(width));
  out.setAttribute("height", String(height));
  out.setAttribute("viewBox", `0 0 ${width} ${height}`);
  return { text: new XMLSerializer().serializeToString(out), width, height };
}
