/**
 * What a TIFF's ImageDescription says about its stack: OME-XML (OME data model, `<Pixels SizeC
 * SizeZ SizeT DimensionOrder PhysicalSizeX/Y[Unit]>`, https://docs.openmicroscopy.org/ome-model/)
 * or an ImageJ hyperstack header (`ImageJ=… channels= slices= frames=`, pages in C, Z, T order).
 */
export interface StackDescription {
  source: "ome-xml" | "imagej";
  sizeC: number;
  sizeZ: number;
  sizeT: number;
  /** Fastest-varying first, after X and Y: e.g. "ZCT" for DimensionOrder XYZCT. */
  order: string;
  /** µm/px from PhysicalSizeX / PhysicalSizeY (OME), null when absent or unusable. */
  pixelSizeXUm: number | null;
  pixelSizeYUm: number | null;
  /** OME SizeX / SizeY, to compare with the pixel data. */
  sizeX: number | null;
  sizeY: number | null;
}

/** Length units of the OME model's UnitsLength (and ImageJ's `unit=`) in µm. */
export const UNIT_UM: Record<string, number> = {
  µm: 1,
  μm: 1,
  um: 1,
  micron: 1,
  microns: 1,
  nm: 1e-3,
  mm: 1e3,
  cm: 1e4,
  m: 1e6,
  Å: 1e-4,
};

const ORDERS = ["XYZCT", "XYZTC", "XYCTZ", "XYCZT", "XYTCZ", "XYTZC"];

function attribute(element: string, name: string): string | undefined {
  return new RegExp(`\\b${name}="([^"]*)"`).exec(element)?.[1];
}

function size(element: string, name: string): number {
  const v = Number(attribute(element, name) ?? "1");
  return Number.isInteger(v) && v >= 1 ? v : Number.NaN;
}

function physical(element: string, axis: "X" | "Y"): number | null {
  const raw = attribute(element, `PhysicalSize${axis}`);
  if (raw === undefined) return null;
  const v = Number(raw);
  const scale = UNIT_UM[attribute(element, `PhysicalSize${axis}Unit`) ?? "µm"];
  return Number.isFinite(v) && v > 0 && scale ? v * scale : null;
}

/** Reads the stack sizes from an ImageDescription, or null when it is neither OME-XML nor ImageJ. */
export function readStackDescription(description: string | null): StackDescription | null {
  if (!description) return null;
  if (description.includes("<OME")) {
    const pixels = /<(?:\w+:)?Pixels\b[^>]*>/.exec(description)?.[0];
    if (!pixels) return null;
    const order = attribute(pixels, "DimensionOrder") ?? "XYZCT";
    const sizeX = Number(attribute(pixels, "SizeX"));
    const sizeY = Number(attribute(pixels, "SizeY"));
    return {
      source: "ome-xml",
      sizeC: size(pixels, "SizeC"),
      sizeZ: size(pixels, "SizeZ"),
      sizeT: size(pixels, "SizeT"),
      order: ORDERS.includes(order) ? order.slice(2) : "invalid:" + order,
      pixelSizeXUm: physical(pixels, "X"),
      pixelSizeYUm: physical(pixels, "Y"),
      sizeX: Number.isInteger(sizeX) ? sizeX : null,
      sizeY: Number.isInteger(sizeY) ? sizeY : null,
    };
  }
  if (/^ImageJ=/.test(description)) {
    const field = (name: string) => {
      const v = Number(new RegExp(`^${name}=(\\d+)$`, "m").exec(description)?.[1] ?? "1");
      return Number.isInteger(v) && v >= 1 ? v : Number.NaN;
    };
    return {
      source: "imagej",
      sizeC: field("channels"),
      sizeZ: field("slices"),
      sizeT: field("frames"),
      order: "CZT",
      pixelSizeXUm: null,
      pixelSizeYUm: null,
      sizeX: null,
      sizeY: null,
    };
  }
  return null;
}
