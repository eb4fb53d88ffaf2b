/**
 * Filling of a group of water bodies (the region, a sub-region, a size class, a grid cell) month by
 * month: Σ water area / Σ reference area over the group's bodies. With an estimation basis (the
 * fixed set, see estimate.ts) every body counts every month: seen, filled from a short gap, or
 * estimated; a range puts every estimated body at the low and at the high end of its spread.
 * Without one (a single body's own figure) only the body-months with a value count. Coverage is the
 * share of the group's reference area actually observed (filled and estimated months do not count);
 * below `minCoverage` percent no figure is stated for the month.
 */
import { MISSING, OBSERVED, type BodySeries } from './bodySeries.ts';
import { estimateAt, type Estimate, type EstimationBasis } from './estimate.ts';

export interface GroupMonth {
  month: number;
  /** Percent of reference area under water; null when coverage is too low. */
  fillingPercent: number | null;
  /** Share (0–1) of the group's reference area observed. */
  coverageShare: number;
  /** Share (0–1) of the group's reference area whose value was filled by interpolation. */
  filledShare: number;
  /** Share (0–1) of the group's reference area estimated (fixed set, estimate.ts); 0 without estimation. */
  estimatedShare: number;
  /** The figure with every estimated body at the low / high end of its spread; null when no figure is stated. */
  lowPercent: number | null;
  highPercent: number | null;
  /** Bodies seen or filled from a short gap. */
  bodiesWithValue: number;
  /** Bodies estimated. */
  bodiesEstimated: number;
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
  minCoverageShare: number,
  keep?: (month: number) => boolean,
  basis?: EstimationBasis,
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
  const low = new Float64Array(slots.length);
  const high = new Float64Array(slots.length);
  const estimated = new Float64Array(slots.length);
  const estimatedCount = new Int32Array(slots.length);
  const estimate: Estimate = { value: 0, low: 0, high: 0, source: 'carried' };
  for (let m = 0; m < members.length; m++) {
    const body = members[m] as number;
    const states = series.state[body] as Uint8Array;
    const filling = series.filling[body] as Float64Array;
    const ha = referenceHa[body] as number;
    for (let s = 0; s < slots.length; s++) {
      const slot = slots[s] as number;
      const state = states[slot];
      if (state === MISSING) {
        if (!basis || !estimateAt(basis, series, body, slot, estimate)) continue;
        water[s] = (water[s] as number) + estimate.value * ha;
        low[s] = (low[s] as number) + estimate.low * ha;
        high[s] = (high[s] as number) + estimate.high * ha;
        reference[s] = (reference[s] as number) + ha;
        estimated[s] = (estimated[s] as number) + ha;
        estimatedCount[s] = (estimatedCount[s] as number) + 1;
        continue;
      }
      const value = (filling[slot] as number) * ha;
      water[s] = (water[s] as number) + value;
      low[s] = (low[s] as number) + value;
      high[s] = (high[s] as number) + value;
      reference[s] = (reference[s] as number) + ha;
      count[s] = (count[s] as number) + 1;
      if (state === OBSERVED) observed[s] = (observed[s] as number) + ha;
      else filled[s] = (filled[s] as number) + ha;
    }
  }
  return slots.map((slot, s) => {
    const coverageShare = total > 0 ? (observed[s] as number) / total : 0;
    const ref = reference[s] as number;
    const stated = ref > 0 && coverageShare >= minCoverageShare;
    return {
      month: series.firstMonth + slot,
      fillingPercent: stated ? (water[s] as number) / ref : null,
      coverageShare,
      filledShare: total > 0 ? (filled[s] as number) / total : 0,
      estimatedShare: total > 0 ? (estimated[s] as number) / total : 0,
      lowPercent: stated ? (low[s] as number) / ref : null,
      highPercent: stated ? (high[s] as number) / ref : null,
      bodiesWithValue: count[s] as number,
      bodiesEstimated: estimatedCount[s] as number,
    };
  });
}

/** The months a status reads: the bulletin's calendar month in every year, and the month before the bulletin. */
export function statusMonths(bulletinMonth: number): (month: number) => boolean {
  return (month) => month % 12 === bulletinMonth % 12 || month === bulletinMonth - 1;
}
