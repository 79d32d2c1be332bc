/** A forecast laid out on the hours of a readings series (null where it says nothing). */
export interface ForecastLine {
  mean: (number | null)[];
  lower80: (number | null)[];
  upper80: (number | null)[];
  lower95: (number | null)[];
  upper95: (number | null)[];
}

export function emptyForecastLine(length: number): ForecastLine {
  const empty = () => new Array<number | null>(length).fill(null);
  return { mean: empty(), lower80: empty(), upper80: empty(), lower95: empty(), upper95: empty() };
}
