/**
 * Carlson's (1977) trophic state index from chlorophyll-a (µg/L), in the paper's original form
 * TSI(Chl) = 10·(6 − (2.04 − 0.68·ln Chl)/ln 2) (Carlson 1977, Limnology and Oceanography 22,
 * 361–369), rather than the rounded 9.81·ln Chl + 30.6 often quoted. NaN for a value that is not
 * positive. Cost O(1).
 */
export function trophicStateIndex(chlorophyll: number): number {
  if (!(chlorophyll > 0) || !Number.isFinite(chlorophyll)) return Number.NaN;
  return 10 * (6 - (2.04 - 0.68 * Math.log(chlorophyll)) / Math.LN2);
}
