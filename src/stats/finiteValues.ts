/**
 * The one convention for missing values in stats/: `null`, `undefined`, `NaN` and ±Infinity are
 * skipped; every other number counts. Cost O(n).
 */
export function finiteValues(values: Iterable<number | null | undefined>): number[] {
  const kept: number[] = [];
  for (const value of values) if (typeof value === 'number' && Number.isFinite(value)) kept.push(value);
  return kept;
}
