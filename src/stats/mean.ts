import { finiteValues } from './finiteValues.ts';

/** Arithmetic mean; missing values skipped; NaN for an empty sample. Cost O(n). */
export function mean(values: Iterable<number | null | undefined>): number {
  const x = finiteValues(values);
  if (x.length === 0) return Number.NaN;
  let sum = 0;
  for (const value of x) sum += value;
  return sum / x.length;
}
