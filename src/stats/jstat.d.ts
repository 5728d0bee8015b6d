// The slice of jStat 1.9 that crosswise uses; the package ships no type declarations.
declare module 'jstat' {
  interface StudentT {
    /** Cumulative distribution function of Student's t with `dof` degrees of freedom. */
    cdf(x: number, dof: number): number;
    /** Quantile (inverse CDF) of Student's t with `dof` degrees of freedom. */
    inv(p: number, dof: number): number;
  }
  interface Normal {
    /** Cumulative distribution function of N(mean, std²). */
    cdf(x: number, mean: number, std: number): number;
    /** Density of N(mean, std²). */
    pdf(x: number, mean: number, std: number): number;
  }
  interface ChiSquare {
    /** Cumulative distribution function of χ² with `dof` degrees of freedom. */
    cdf(x: number, dof: number): number;
  }
  interface JStat {
    readonly studentt: StudentT;
    readonly normal: Normal;
    readonly chisquare: ChiSquare;
  }
  const jStat: JStat;
  export default jStat;
}
