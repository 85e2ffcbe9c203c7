/**
 * Minimal type declarations for the parts of jstat 1.9.6 the statistics layer uses (jstat ships
 * no types). Only the functions below are declared on purpose: anything else must be declared
 * here before use.
 */
declare module 'jstat' {
  interface JStatDistributions {
    studentt: { inv(p: number, dof: number): number; pdf(x: number, dof: number): number };
    chisquare: { inv(p: number, dof: number): number; pdf(x: number, dof: number): number };
    tukey: { cdf(q: number, nmeans: number, df: number): number; inv(p: number, nmeans: number, df: number): number };
    noncentralt: { cdf(x: number, dof: number, ncp: number): number };
  }
  export const jStat: JStatDistributions;
}
