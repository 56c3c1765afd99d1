/** The condition comparison of a study, as the API returns it (types only, so pages may import them). */
import "server-only";
import type { WelchResult } from "@/lib/spacing";
import type { WavelengthMeasure } from "./result";

export interface ComparisonPoint {
  condition: string;
  specimenId: string;
  specimenLabel: string;
  uploadId: string;
  filename: string;
  readoutId: string;
  measure: WavelengthMeasure;
  wavelengthUm: number;
  uncertaintyUm: number | null;
  pixelSizeUm: number | null;
  readoutCreatedAt: string;
}

/** One biological replicate: the mean of its images' wavelengths (technical replicates). */
export interface SpecimenValue {
  specimenId: string;
  specimenLabel: string;
  wavelengthUm: number;
  images: number;
}

export type ReplicateUnit = "specimen" | "image";

export interface ConditionGroup {
  condition: string;
  /** The replicates the statistics use: specimens (default) or images (`replicate: "image"`). */
  n: number;
  nSpecimens: number;
  nImages: number;
  meanUm: number;
  sdUm: number | null;
  semUm: number | null;
  /** 95 % CI of the mean (t with n − 1 df); null for n < 2. */
  ci95Um: [number, number] | null;
  specimens: SpecimenValue[];
  points: ComparisonPoint[];
}

export interface ConditionComparison {
  studyId: string;
  studyName: string;
  conditions: string[];
  replicate: ReplicateUnit;
  groups: ConditionGroup[];
  /** Uploads left out, with why (no finished readout, or no significant period). */
  excluded: Array<{ uploadId: string; filename: string; specimenLabel: string; condition: string; reason: string }>;
  test: { a: string | null; b: string | null; welch: WelchResult | null; note: string | null };
  measures: Record<string, string>;
  warnings: string[];
}
