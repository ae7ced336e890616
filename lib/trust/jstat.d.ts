// jstat 1.9.6 ships no type declarations; this covers the part Shoal uses.
declare module "jstat" {
  type NormalDistribution = {
    /** Quantile (inverse CDF) of the normal distribution. */
    inv(p: number, mean: number, std: number): number;
    cdf(x: number, mean: number, std: number): number;
  };
  const jStat: { normal: NormalDistribution };
  export default jStat;
}
