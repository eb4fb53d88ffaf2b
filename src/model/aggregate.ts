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

/**
 * `keep` limits the months computed (a status needs only its own calendar month and the month
 * before): the rows of other months are left out. Bodies are visited one by one over their months
 * (each body's arrays read in order), summing in member order month by month as before.
 */
export function aggregate(
  series: BodySeries,
  members: ArrayLike<number>,
  referenceHa: ArrayLike<number>,
  minCoveragePercent: number,
  keep?: (month: number) => boolean,
): GroupMonth[] {
  let total = 0;
  for (let m = 0; m < members.length; m++) total += referenceHa[members[m] as number] as number;
  const slots: number[] = [];
  for (let slot = 0; slot < series.months; slot++) if (!keep || keep(series.firstMonth + slot)) slots.push(slot);
  const water = new Float64Array(slots.length);
  const reference = new Float64Array(slots.length);
  const observed = new Float64Array(slots.length);
  const filled = new Float64Array(slots.length);
  const count = new Int32Array(slots.length);
  for (let m = 0; m < members.length; m++) {
    const body = members[m] as number;
    const states = series.state[body] as Uint8Array;
    const filling = series.filling[body] as Float64Array;
    const ha = referenceHa[body] as number;
    for (let s = 0; s < slots.length; s++) {
      const slot = slots[s] as number;
      const state = states[slot];
      if (state !== OBSERVED && state !== FILLED) continue;
      water[s] = (water[s] as number) + (filling[slot] as number) * ha;
      reference[s] = (reference[s] as number) + ha;
      count[s] = (count[s] as number) + 1;
      if (state === OBSERVED) observed[s] = (observed[s] as number) + ha;
      else filled[s] = (filled[s] as number) + ha;
    }
  }
  return slots.map((slot, s) => {
    const coveragePercent = total > 0 ? (100 * (observed[s] as number)) / total : 0;
    return {
      month: series.firstMonth + slot,
      fillingPercent:
        (reference[s] as number) > 0 && coveragePercent >= minCoveragePercent ? (water[s] as number) / (reference[s] as number) : null,
      coveragePercent,
      filledPercent: total > 0 ? (100 * (filled[s] as number)) / total : 0,
      bodiesWithValue: count[s] as number,
    };
  });
}

/** The months a status reads: the bulletin's calendar month in every year, and the month before the bulletin. */
export function statusMonths(bulletinMonth: number): (month: number) => boolean {
  return (month) => month % 12 === bulletinMonth % 12 || month === bulletinMonth - 1;
}
