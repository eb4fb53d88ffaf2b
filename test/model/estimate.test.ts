/**
 * Fixed-set estimation (src/model/estimate.ts), checked by simulation on generated data (not the
 * example's numbers): a depleted sub-region is hidden under cloud in the bulletin month, and the
 * regional figure is compared with the value every body's true water area gives (full information).
 *
 * The scenario (invented; common practice for surface-area series, no source): three sub-regions of
 * 20 bodies each, 10 to 10,000 ha; each body's filling is its own seasonal usual times a ratio that
 * is persistent from month to month (a sub-region's AR(1) driver with φ = 0.85 and the body's own
 * AR(1) with φ = 0.7, on the log scale); sub-region A falls into a drought over the last 18 months
 * (its ratio to about 0.45 of usual). One body-month in ten is unseen at random throughout.
 */
import { describe, expect, it } from 'vitest';
import { mulberry32 } from '../../scripts/random.ts';
import { aggregate } from '../../src/model/aggregate.ts';
import { fillShortGaps, MISSING, OBSERVED, type BodySeries } from '../../src/model/bodySeries.ts';
import { estimateAt, estimationBasis, MIN_NEIGHBOURS, type Estimate } from '../../src/model/estimate.ts';
import type { BulletinInputs } from '../../src/ingest/index.ts';

const YEARS = 10;
const FIRST_YEAR = 2016;
const MONTHS = YEARS * 12;
const PER_SUB_REGION = 20;
const SUB_REGIONS = ['A', 'B', 'C'];

function normal(random: () => number): number {
  // Box–Muller.
  return Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
}

interface Scenario {
  inputs: BulletinInputs;
  series: BodySeries;
  truth: Float64Array[];
  referenceHa: Float64Array;
}

function scenario(seed: number, hiddenMonths = 1, hideSubRegion = 'A'): Scenario {
  const random = mulberry32(seed);
  const n = SUB_REGIONS.length * PER_SUB_REGION;
  const bodies = Array.from({ length: n }, (_, k) => ({
    id: `b${k}`,
    subRegionId: SUB_REGIONS[Math.floor(k / PER_SUB_REGION)] as string,
    referenceHa: 10 ** (1 + 3 * random()),
  }));
  const drivers = SUB_REGIONS.map(() => {
    const x = new Float64Array(MONTHS);
    for (let t = 1; t < MONTHS; t++) x[t] = 0.85 * (x[t - 1] as number) + 0.05 * normal(random);
    return x;
  });
  const truth = bodies.map((body) => {
    const s = SUB_REGIONS.indexOf(body.subRegionId);
    const phase = 0.5 * random();
    let own = 0;
    const values = new Float64Array(MONTHS);
    for (let t = 0; t < MONTHS; t++) {
      own = 0.7 * own + 0.04 * normal(random);
      const drought = s === 0 && t >= MONTHS - 18 ? (Math.log(0.45) * (t - (MONTHS - 18) + 1)) / 18 : 0;
      const usual = 60 + 20 * Math.sin((2 * Math.PI * (t % 12)) / 12 + phase);
      values[t] = Math.min(100, usual * Math.exp((drivers[s] as Float64Array)[t] as number) * Math.exp(own + drought));
    }
    return values;
  });
  const filling = truth.map((values) => Float64Array.from(values));
  const state = truth.map(() => new Uint8Array(MONTHS).fill(OBSERVED));
  bodies.forEach((body, k) => {
    for (let t = 0; t < MONTHS; t++) {
      const hidden = (t >= MONTHS - hiddenMonths && body.subRegionId === hideSubRegion) || random() < 0.1;
      if (hidden) {
        (state[k] as Uint8Array)[t] = MISSING;
        (filling[k] as Float64Array)[t] = Number.NaN;
      }
    }
    fillShortGaps(filling[k] as Float64Array, state[k] as Uint8Array, 2);
  });
  const inputs = {
    bodies,
    subRegions: SUB_REGIONS.map((id) => ({ id })),
    config: {
      coverage: { maxCarriedMonths: 3 },
      baseline: { firstYear: FIRST_YEAR, lastYear: FIRST_YEAR + 7, minYears: 5 },
      sizeClasses: { surface: [100, 10_000] },
    },
  } as unknown as BulletinInputs;
  const series: BodySeries = { firstMonth: FIRST_YEAR * 12, months: MONTHS, filling, state };
  return { inputs, series, truth, referenceHa: Float64Array.from(bodies, (body) => body.referenceHa) };
}

/** The bulletin month's regional figure three ways: full information, seen bodies only, fixed set with its range. */
function regionalFigures({ inputs, series, truth, referenceHa }: Scenario) {
  const members = inputs.bodies.map((_, k) => k);
  const last = MONTHS - 1;
  let water = 0;
  let total = 0;
  for (const k of members) {
    water += ((truth[k] as Float64Array)[last] as number) * (referenceHa[k] as number);
    total += referenceHa[k] as number;
  }
  const keep = (month: number) => month === series.firstMonth + last;
  const [seenOnly] = aggregate(series, members, referenceHa, 0, keep);
  const [fixed] = aggregate(series, members, referenceHa, 0, keep, estimationBasis(inputs, series));
  return { full: water / total, seenOnly: seenOnly?.fillingPercent as number, fixed: fixed as NonNullable<typeof fixed> };
}

function simulate(hiddenMonths: number, hideSubRegion = 'A', runs = 200) {
  let inside = 0;
  let errorFixed = 0;
  let errorSeenOnly = 0;
  let biasSeenOnly = 0;
  let estimated = 0;
  for (let seed = 1; seed <= runs; seed++) {
    const { full, seenOnly, fixed } = regionalFigures(scenario(seed, hiddenMonths, hideSubRegion));
    if ((fixed.lowPercent as number) <= full && full <= (fixed.highPercent as number)) inside++;
    errorFixed += Math.abs((fixed.fillingPercent as number) - full);
    errorSeenOnly += Math.abs(seenOnly - full);
    biasSeenOnly += seenOnly - full;
    estimated += fixed.estimatedPercent;
  }
  return {
    inside: inside / runs,
    meanErrorFixed: errorFixed / runs,
    meanErrorSeenOnly: errorSeenOnly / runs,
    biasSeenOnly: biasSeenOnly / runs,
    meanEstimatedPercent: estimated / runs,
  };
}

describe('fixed-set estimation, by simulation', () => {
  // Seen on this simulation (200 runs each; percentage points of reference area):
  //   hidden 1 month: range holds the full value in 99 %, mean error 0.58 against 9.9 seen-only;
  //   3 months: 97 %, 1.24 against 10.0;  6 months: 87.5 %, 2.57 against 9.9.
  // The floor asserted is the nominal one: every unseen body at once at its own 10th or 90th
  // percentile should hold a group's value at least 80 % of the time; errors within half the
  // seen-only estimator's show the fixed set is the better of the two, not by how much.
  it.each([1, 3, 6])(
    'holds the full-information value within its range when the depleted sub-region is unseen for %i month(s)',
    (months) => {
      const figures = simulate(months);
      expect(figures.meanEstimatedPercent).toBeGreaterThan(5);
      expect(figures.inside).toBeGreaterThanOrEqual(0.8);
      expect(figures.meanErrorFixed).toBeLessThan(0.5 * figures.meanErrorSeenOnly);
      // The old, seen-only estimator lets the wetter sub-regions stand in for the dry one: biased upwards.
      expect(figures.biasSeenOnly).toBeGreaterThan(5);
    },
  );

  it('agrees with the seen-only estimator when clouds fall at random', () => {
    const figures = simulate(0, 'none', 100);
    expect(figures.inside).toBeGreaterThanOrEqual(0.8);
    expect(Math.abs(figures.biasSeenOnly)).toBeLessThan(1);
    expect(figures.meanErrorFixed).toBeLessThan(1);
  });
});

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
