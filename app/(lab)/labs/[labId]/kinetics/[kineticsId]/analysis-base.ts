/** What every analysis request of the kinetics page sends: the kinetics, its parameters and scales. */
export interface AnalysisBase {
  kinetics: string;
  version?: number;
  parameters: Record<string, number | string>;
  lengthScaleUm?: number | string;
  timeScaleS?: number | string;
}
