/** Minimal typing for the parts of jstat (https://jstat.github.io) the engine uses. */
declare module 'jstat' {
  export const jStat: {
    normal: { inv(p: number, mean: number, sd: number): number; cdf(x: number, mean: number, sd: number): number };
    chisquare: { cdf(x: number, dof: number): number };
  };
}
