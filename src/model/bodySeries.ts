/**
 * Per-body monthly filling series. A body-month counts when it was seen through clouds over at
 * least `coverage.minObservedShare` of its area; gaps of up to `coverage.maxFilledGap` months
 * between two counted months are filled by linear interpolation in time and flagged as filled.
 * Longer gaps, and months before the first or after the last counted month, stay missing.
 */
import type { BulletinInputs } from '../ingest/index.ts';

export const MISSING = 0;
export const OBSERVED = 1;
export const FILLED = 2;

export interface BodySeries {
  /** First month index of every series (year × 12 + month − 1). */
  firstMonth: number;
  months: number;
  /** Water area as percent of reference area, per body and month (body-major); NaN = missing. */
  filling: Float64Array[];
  /** MISSING, OBSERVED or FILLED per body and month. */
  state: Uint8Array[];
}

export function bodySeries(inputs: BulletinInputs): BodySeries {
  const { area, bodies, config, bulletinMonth } = inputs;
  let firstMonth = bulletinMonth;
  for (let k = 0; k < area.length; k++) firstMonth = Math.min(firstMonth, area.month[k] as number);
  const months = bulletinMonth - firstMonth + 1;
  const filling = bodies.map(() => new Float64Array(months).fill(Number.NaN));
  const state = bodies.map(() => new Uint8Array(months));
  for (let k = 0; k < area.length; k++) {
    if ((area.observedShare[k] as number) < config.coverage.minObservedShare) continue;
    const body = area.body[k] as number;
    const slot = (area.month[k] as number) - firstMonth;
    (filling[body] as Float64Array)[slot] = (100 * (area.waterHa[k] as number)) / (bodies[body] as { referenceHa: number }).referenceHa;
    (state[body] as Uint8Array)[slot] = OBSERVED;
  }
  for (let body = 0; body < bodies.length; body++)
    fillShortGaps(filling[body] as Float64Array, state[body] as Uint8Array, config.coverage.maxFilledGap);
  return { firstMonth, months, filling, state };
}

/** Linear interpolation across runs of at most `maxGap` missing months between two known ones. */
export function fillShortGaps(values: Float64Array, state: Uint8Array, maxGap: number): void {
  let last = -1;
  for (let k = 0; k < values.length; k++) {
    if (state[k] !== OBSERVED) continue;
    const gap = k - last - 1;
    if (last >= 0 && gap > 0 && gap <= maxGap) {
      const from = values[last] as number;
      const to = values[k] as number;
      for (let g = 1; g <= gap; g++) {
        values[last + g] = from + ((to - from) * g) / (gap + 1);
        state[last + g] = FILLED;
      }
    }
    last = k;
  }
}
