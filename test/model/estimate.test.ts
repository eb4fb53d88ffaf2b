/** estimateAt (src/model/estimate.ts) on small hand-built series; its behaviour over many regions is in estimateSimulation.test.ts. */
import { describe, expect, it } from 'vitest';
import { OBSERVED, MISSING, type BodySeries } from '../../src/model/bodySeries.ts';
import { estimateAt, estimationBasis, MIN_NEIGHBOURS, type Estimate } from '../../src/model/estimate.ts';
import type { BulletinInputs } from '../../src/ingest/index.ts';

describe('estimateAt', () => {
  /** One sub-region of MIN_NEIGHBOURS + 1 bodies, 3 years, every value 50 % (usual 50) unless set. */
  function small(setup: (filling: Float64Array[], state: Uint8Array[]) => void) {
    const n = MIN_NEIGHBOURS + 1;
    const months = 36;
    const filling = Array.from({ length: n }, () => new Float64Array(months).fill(50));
    const state = Array.from({ length: n }, () => new Uint8Array(months).fill(OBSERVED));
    // Months alternate 45 / 55 around the usual 50 so that each body has a spread of changes.
    filling.forEach((values) => values.forEach((_, t) => (values[t] = t % 2 === 0 ? 45 : 55)));
    setup(filling, state);
    const inputs = {
      bodies: Array.from({ length: n }, (_, k) => ({ id: `b${k}`, subRegionId: 'S', referenceHa: 50 })),
      subRegions: [{ id: 'S' }],
      config: {
        coverage: { maxCarriedMonths: 3 },
        baseline: { firstYear: 2020, lastYear: 2022, minYears: 2 },
        sizeClasses: { surface: [100, 10_000] },
      },
    } as unknown as BulletinInputs;
    const series: BodySeries = { firstMonth: 2020 * 12, months, filling, state };
    return { series, basis: estimationBasis(inputs, series) };
  }
  const into: Estimate = { value: 0, low: 0, high: 0, source: 'carried' };

  it("carries the body's own ratio to usual from its last value, with the spread of its own changes", () => {
    const { series, basis } = small((filling, state) => {
      (state[0] as Uint8Array)[35] = MISSING;
      (filling[0] as Float64Array)[35] = Number.NaN;
    });
    expect(estimateAt(basis, series, 0, 35, into)).toBe(true);
    // Usual of every calendar month: median of its baseline values. Month 35 is odd (55 in
    // each year), month 34 even (45): usual 55 and 45. The last value 45 is 1.0 × its usual, so
    // the estimate is 1.0 × 55 = 55. One-month changes of the ratio are all 0 (always at usual).
    expect(into.source).toBe('carried');
    expect(into.value).toBeCloseTo(55, 12);
    expect(into.low).toBeCloseTo(55, 12);
    expect(into.high).toBeCloseTo(55, 12);
  });

  it("takes the seen neighbours' median ratio when the body has no value of its own in the carry window", () => {
    const { series, basis } = small((filling, state) => {
      for (let t = 31; t < 36; t++) {
        (state[0] as Uint8Array)[t] = MISSING;
        (filling[0] as Float64Array)[t] = Number.NaN;
      }
      // The neighbours are at 0.8, 0.9 and 1.0 × their usual 55 in month 35: median 0.9.
      (filling[1] as Float64Array)[35] = 0.8 * 55;
      (filling[2] as Float64Array)[35] = 0.9 * 55;
      (filling[3] as Float64Array)[35] = 1.0 * 55;
    });
    expect(estimateAt(basis, series, 0, 35, into)).toBe(true);
    expect(into.source).toBe('neighbours');
    expect(into.value).toBeCloseTo(0.9 * 55, 9);
    // 10th and 90th percentiles of 0.8, 0.9, 1.0 (type 7): 0.82 and 0.98.
    expect(into.low).toBeCloseTo(0.82 * 55, 9);
    expect(into.high).toBeCloseTo(0.98 * 55, 9);
  });

  it('makes no estimate without its own recent value and with fewer than MIN_NEIGHBOURS seen', () => {
    const { series, basis } = small((filling, state) => {
      for (let body = 0; body < 2; body++)
        for (let t = 20; t < 36; t++) {
          (state[body] as Uint8Array)[t] = MISSING;
          (filling[body] as Float64Array)[t] = Number.NaN;
        }
    });
    expect(estimateAt(basis, series, 0, 35, into)).toBe(false);
  });
});
