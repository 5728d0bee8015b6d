// The slice of jStat 1.9 that crosswise uses; the package ships no type declarations.
declare module 'jstat' {
  interface StudentT {
    /** Cumulative distribution function of Student's t with `dof` degrees of freedom. */
    cdf(x: number, dof: number): number;
    /** Quantile (inverse CDF) of Student's t with `dof` degrees of freedom. */
    inv(p: number, dof: number): number;
  }
  interface JStat {
    readonly studentt: StudentT;
  }
  const jStat: JStat;
  export default jStat;
}
