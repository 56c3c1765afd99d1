import type { KineticsSource } from "../kinetics/resolve-kinetics";
import type { MapPlan } from "../stability/map-plan";

/** Main → worker: compute rows [y0, y1) of a map. */
export interface MapTask {
  id: number;
  source: KineticsSource;
  plan: MapPlan;
  y0: number;
  y1: number;
  startedAtMs: number;
}

/** Worker → main: the rows, or the error (class name, field, message) to rethrow. */
export type MapReply =
  | {
      id: number;
      ok: true;
      y0: number;
      y1: number;
      classes: Uint8Array;
      wavelength: Float64Array;
      sigmaStar: Float64Array;
    }
  | { id: number; ok: false; error: { name: string; field: string; message: string } };
