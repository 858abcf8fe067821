// Types for the parts of jstat (an npm statistics library, used only to cross-check the engine) the tests call.
declare module "jstat" {
  const jStat: {
    binomial: { cdf(k: number, n: number, p: number): number; pdf(k: number, n: number, p: number): number };
    beta: { inv(p: number, a: number, b: number): number; cdf(x: number, a: number, b: number): number };
    noncentralt: { cdf(x: number, dof: number, ncp: number): number };
    normal: { cdf(x: number, mean: number, sd: number): number };
  };
  export default jStat;
}
