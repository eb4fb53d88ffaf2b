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

export type CarlsonClass = 'oligotrophic' | 'mesotrophic' | 'eutrophic' | 'hypereutrophic';

/**
 * Carlson's own divisions of his index (Carlson & Simpson 1996, A Coordinator's Guide to
 * Volunteer Lake Monitoring Methods, North American Lake Management Society, table of trophic
 * state and TSI): below 40 oligotrophic, 40 to 50 mesotrophic, 50 to 70 eutrophic, 70 and above
 * hypereutrophic (boundaries written from memory of that table, lower bound inclusive). These are
 * not the OECD classes and the two are never mixed. Null for NaN.
 */
export function carlsonClass(index: number): CarlsonClass | null {
  if (Number.isNaN(index)) return null;
  return index < 40 ? 'oligotrophic' : index < 50 ? 'mesotrophic' : index < 70 ? 'eutrophic' : 'hypereutrophic';
}
