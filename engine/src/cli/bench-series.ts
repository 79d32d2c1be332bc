/**
 * The simulated series of `npm run bench`: ARMA(2,1) with φ = (0.6, −0.2), θ = 0.4 and unit
 * Gaussian innovations from a Park–Miller generator and Box–Muller, 200 burn-in values dropped.
 * Deterministic, so that R can be run on exactly the same numbers (bench-r.R) and tests can
 * check values R gave for them.
 */
export function simulateArma21(n: number, seed: number): number[] {
  let s = seed;
  const u = () => (s = (s * 16807) % 2147483647) / 2147483647;
  const g = () => Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u());
  const x: number[] = [];
  let e1 = 0;
  for (let t = 0; t < n + 200; t++) {
    const e = g();
    const v = 0.6 * (x[t - 1] ?? 0) - 0.2 * (x[t - 2] ?? 0) + e + 0.4 * e1;
    e1 = e;
    x.push(v);
  }
  return x.slice(200);
}
