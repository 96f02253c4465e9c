/**
 * Minimal type declaration for the parts of `jstat` (v1.9) that the outcomes
 * engine uses. jstat ships no types of its own; only the functions listed
 * here are declared, so any other use fails the type-check on purpose.
 */
declare module 'jstat' {
  interface JStatStatic {
    studentt: {
      /** Quantile of Student's t with `dof` degrees of freedom. */
      inv(p: number, dof: number): number;
    };
    normal: {
      /** Quantile of the normal distribution with mean `mean` and SD `sd`. */
      inv(p: number, mean: number, sd: number): number;
    };
    chisquare: {
      /** Cumulative distribution function of chi-square with `dof` degrees of freedom. */
      cdf(x: number, dof: number): number;
    };
    /** Natural logarithm of the gamma function. */
    gammaln(x: number): number;
  }
  const jStat: JStatStatic;
  export default jStat;
}
