/**
 * Minimal ambient declaration for the parts of 'jstat' that jostle uses.
 * jstat is used only for quantiles and distribution functions, never for sampling
 * (its samplers use an unseeded global generator).
 */
declare module 'jstat' {
  interface JStatStudentT {
    /** Quantile of Student's t with `dof` degrees of freedom at probability `p`. */
    inv(p: number, dof: number): number;
    /** Cumulative distribution function of Student's t. */
    cdf(x: number, dof: number): number;
  }
  interface JStatBeta {
    /** Cumulative distribution function of Beta(alpha, beta) on [0, 1]. */
    cdf(x: number, alpha: number, beta: number): number;
    /** Quantile of Beta(alpha, beta). */
    inv(p: number, alpha: number, beta: number): number;
  }
  interface JStatNormal {
    /** Quantile of Normal(mean, std). */
    inv(p: number, mean: number, std: number): number;
    /** Cumulative distribution function of Normal(mean, std). */
    cdf(x: number, mean: number, std: number): number;
  }
  interface JStatStatic {
    readonly studentt: JStatStudentT;
    readonly beta: JStatBeta;
    readonly normal: JStatNormal;
  }
  const jStat: JStatStatic;
  export default jStat;
}
