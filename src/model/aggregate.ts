/**
 * Filling of a group of water bodies (the region, a sub-region, a size class, a grid cell) month by
 * month, as a ratio estimator: Σ water area / Σ reference area over the bodies with a value that
 * month (observed or filled), so the bodies with a value stand for the others in proportion to
 * their size. Coverage is the share of the group's reference area actually observed (filled months
 * do not count); below `minCoverage` percent no figure is stated for the month.
 */
import { FILLED, OBSERVED, type BodySeries } from './bodySeries.ts';

export interface GroupMonth {
  month: number;
  /** Percent of reference area under water; null when coverage is too low. */
  fillingPercent: number | null;
  /** Percent of the group's reference area observed. */
  coveragePercent: number;
  /** Percent of the group's reference area whose value was filled by interpolation. */
  filledPercent: number;
  bodiesWithValue: number;
}

export function aggregate(series: BodySeries, members: number[], referenceHa: ArrayLike<number>, minCoveragePercent: number): GroupMonth[] {
  let total = 0;
  for (const body of members) total += referenceHa[body] as number;
  const out: GroupMonth[] = [];
  for (let slot = 0; slot < series.months; slot++) {
    let water = 0;
    let reference = 0;
    let observed = 0;
    let filled = 0;
    let count = 0;
    for (const body of members) {
      const state = (series.state[body] as Uint8Array)[slot];
      if (state !== OBSERVED && state !== FILLED) continue;
      const ha = referenceHa[body] as number;
      water += ((series.filling[body] as Float64Array)[slot] as number) * ha;
      reference += ha;
      count++;
      if (state === OBSERVED) observed += ha;
      else filled += ha;
    }
    const coveragePercent = total > 0 ? (100 * observed) / total : 0;
    out.push({
      month: series.firstMonth + slot,
      fillingPercent: reference > 0 && coveragePercent >= minCoveragePercent ? water / reference : null,
      coveragePercent,
      filledPercent: total > 0 ? (100 * filled) / total : 0,
      bodiesWithValue: count,
    });
  }
  return out;
}
