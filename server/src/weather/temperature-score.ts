/**
 * A temperature forecast's error over some hours: mean absolute error and bias (forecast −
 * observed, °C) over the hours that have both; the same definitions as the load scores of
 * shared/src/accuracy.ts.
 */
export function temperatureScore(observed: readonly (number | null)[], forecast: readonly (number | null)[]): { hours: number; maeC: number | null; biasC: number | null } {
  let hours = 0;
  let abs = 0;
  let sum = 0;
  for (let i = 0; i < observed.length; i++) {
    const o = observed[i];
    const f = forecast[i];
    if (o === null || f === null || f === undefined) continue;
    hours++;
    abs += Math.abs(f - o);
    sum += f - o;
  }
  const round = (x: number) => Math.round(x * 1000) / 1000;
  return { hours, maeC: hours > 0 ? round(abs / hours) : null, biasC: hours > 0 ? round(sum / hours) : null };
}
