import { finiteValues } from './finiteValues.ts';

/**
 * Sample standard deviation with Bessel's correction, √(Σ(xᵢ − x̄)²/(n − 1)), by two passes
 * (mean first, then squared deviations) to avoid the cancellation of the one-pass formula.
 * Missing values are skipped; NaN for fewer than 2 values. Cost O(n).
 */
export function sampleStandardDeviation(values: Iterable<number | null | undefined>): number {
  const x = finiteValues(values);
  const n = x.length;
  if (n < 2) return Number.NaN;
  let sum = 0;
  for (const value of x) sum += value;
  const mean = sum / n;
  let squares = 0;
  for (const value of x) squares += (value - mean) ** 2;
  return Math.sqrt(squares / (n - 1));
}
