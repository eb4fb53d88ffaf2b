export type TrophicClass = 'ultra-oligotrophic' | 'oligotrophic' | 'mesotrophic' | 'eutrophic' | 'hypertrophic';

/**
 * Upper bounds (µg/L, inclusive) of the OECD (1982) fixed-boundary trophic classes for mean
 * chlorophyll-a (OECD, Eutrophication of Waters: Monitoring, Assessment and Control, Paris):
 * ultra-oligotrophic ≤ 1, oligotrophic ≤ 2.5, mesotrophic ≤ 8, eutrophic ≤ 25, hypertrophic above.
 */
export const TROPHIC_BOUNDS: ReadonlyArray<[TrophicClass, number]> = [
  ['ultra-oligotrophic', 1],
  ['oligotrophic', 2.5],
  ['mesotrophic', 8],
  ['eutrophic', 25],
  ['hypertrophic', Number.POSITIVE_INFINITY],
];

/**
 * Trophic class of a mean chlorophyll-a concentration (µg/L) on the OECD (1982) fixed-boundary
 * scheme; null for a missing or negative value. The scheme is meant for annual means: applied to
 * one month of satellite estimates it describes that month only. Cost O(1).
 */
export function trophicClass(chlorophyll: number): TrophicClass | null {
  if (!(chlorophyll >= 0) || !Number.isFinite(chlorophyll)) return null;
  for (const [name, upper] of TROPHIC_BOUNDS) if (chlorophyll <= upper) return name;
  return 'hypertrophic';
}
