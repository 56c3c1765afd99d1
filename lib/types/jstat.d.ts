// Minimal types for the parts of jstat 1.9 that Morphokin uses (the package ships none).
// Extend here when another part is needed; keep one declaration of the module.
declare module "jstat" {
  interface Distribution1 {
    pdf(x: number, dof: number): number;
    cdf(x: number, dof: number): number;
    inv(p: number, dof: number): number;
  }
  export const jStat: {
    studentt: Distribution1;
    chisquare: Distribution1;
  };
}
