/**
 * Every statistic against test/fixtures/stats-reference.json, written by
 * scripts/reference/stats_reference.py with scipy 1.17.1 and numpy 2.4.6 (scipy functions where
 * scipy has one, independent numpy lines where it has none; the script says which). Agreement is
 * required to 1e-9 relative (with an absolute floor of 1e-12 for values that should be 0).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  agreement,
  logAgreement,
  ar1MannKendall,
  ar1Pettitt,
  studentTTwoSided,
  benjaminiHochberg,
  chiSquareSurvival,
  hamedRao,
  kruskalWallis,
  weightedMedian,
  mannKendall,
  normalQuantile,
  normalSurvival,
  percentileRank,
  pettitt,
  quantile,
  sampleStandardDeviation,
  seasonalKendall,
  sensSlope,
} from '../../src/stats/index.ts';

type Numbers = Array<number | null>;
interface Case {
  name: string;
  t: number[];
  y: Numbers;
  months?: number[];
  mannKendall: Record<string, number>;
  sensSlope?: Record<string, number>;
  hamedRao?: { correctionFactor: number; significantLags: number[]; varianceS: number | null; z: number | null; p: number | null };
  pettitt?: Record<string, number>;
  ar1Pettitt?: Record<'lag1' | 'phi' | 'correctionFactor' | 'p', number>;
  ar1MannKendall?: Record<'lag1' | 'phi' | 'correctionFactor' | 'degreesOfFreedom' | 'z' | 'p', number>;
  kruskalWallis?: { h: number; p: number };
  seasonalKendall?: { s: number; varianceS: number; z: number; p: number; slope: number; covariance?: Record<string, number> };
}
const reference = JSON.parse(readFileSync(join(import.meta.dirname, '..', 'fixtures', 'stats-reference.json'), 'utf8')) as {
  cases: Case[];
  benjaminiHochberg: Array<{ p: number[]; adjusted: number[] }>;
  quantile: { sample: number[]; probabilities: number[]; values: number[] };
  percentileRank: { sample: number[]; scores: number[]; values: number[] };
  standardDeviation: { sample: number[]; value: number };
  agreement: Record<string, number[] | number> & { reference: number[]; estimate: number[] };
  logAgreement: Record<'medianSymmetricAccuracy' | 'symmetricSignedBias' | 'log10Bias' | 'rSquaredLog10', number>;
  normal: { z: number[]; survival: number[]; p: number[]; quantile: number[] };
  chiSquare: { x: number[]; df: number[]; survival: number[] };
  studentT: { t: number[]; df: number[]; twoSided: number[] };
  weightedMedian: Array<{ values: number[]; weights: number[]; median: number }>;
};

/** |actual − expected| ≤ 1e-9 · |expected|, or ≤ 1e-12 when expected is 0 or near it. */
function close(actual: number, expected: number | null | undefined, label: string): void {
  if (expected === null || expected === undefined) {
    expect(Number.isNaN(actual), `${label}: expected no value, got ${actual}`).toBe(true);
    return;
  }
  const tolerance = Math.max(1e-9 * Math.abs(expected), 1e-12);
  expect(Math.abs(actual - expected), `${label}: ${actual} against ${expected}`).toBeLessThanOrEqual(tolerance);
}

const values = (y: Numbers) => y.map((value) => (value === null ? Number.NaN : value));

describe('statistics against the scipy and numpy reference', () => {
  it('has at least 25 cases, n from 3 to 360', () => {
    expect(reference.cases.length).toBeGreaterThanOrEqual(25);
    const sizes = reference.cases.map((c) => c.y.length);
    expect(Math.min(...sizes)).toBe(3);
    expect(Math.max(...sizes)).toBe(360);
  });

  for (const c of reference.cases) {
    it(`mannKendall(${c.name}) matches S, Var(S), Z, p and tau-b`, () => {
      const result = mannKendall(values(c.y));
      const expected = c.mannKendall;
      expect(result.n).toBe(expected.n);
      close(result.s, expected.s, 'S');
      close(result.varianceS, expected.varianceS, 'Var(S)');
      if (expected.p === undefined) {
        expect(result.reason).not.toBeNull();
        return;
      }
      close(result.z, expected.z, 'Z');
      close(result.zUncorrected, expected.zUncorrected, 'Z without correction');
      close(result.p, expected.p, 'p');
      close(result.pUncorrected, expected.pUncorrected, 'p without correction (scipy kendalltau)');
      close(result.tau, expected.tau, 'tau-b (scipy kendalltau)');
    });

    if (c.sensSlope) {
      const expected = c.sensSlope;
      it(`sensSlope(${c.name}) matches scipy theilslopes slope, intercept and 95 % limits`, () => {
        const result = sensSlope(c.t, values(c.y));
        close(result.slope, expected.slope, 'slope');
        close(result.intercept, expected.intercept, 'intercept');
        close(result.lower, expected.lower, 'lower');
        close(result.upper, expected.upper, 'upper');
      });
    }

    if (c.hamedRao) {
      const expected = c.hamedRao;
      it(`hamedRao(${c.name}) matches the correction factor, lags, Z and p`, () => {
        const result = hamedRao(c.t, values(c.y));
        close(result.correctionFactor, expected.correctionFactor, 'n/n*');
        expect(result.significantLags).toEqual(expected.significantLags);
        close(result.varianceS, expected.varianceS, 'Var*(S)');
        close(result.z, expected.z, 'Z');
        close(result.p, expected.p, 'p');
      });
    }

    if (c.ar1MannKendall) {
      const expected = c.ar1MannKendall;
      it(`ar1MannKendall(${c.name}${c.months ? ', by calendar month' : ''}) matches r₁, φ, n/n*, the degrees of freedom, Z and p`, () => {
        const result = ar1MannKendall(c.t, values(c.y), c.months);
        close(result.lag1, expected.lag1, 'r1');
        close(result.phi, expected.phi, 'phi');
        close(result.correctionFactor, expected.correctionFactor, 'n/n*');
        close(result.degreesOfFreedom, expected.degreesOfFreedom, 'df');
        close(result.z, expected.z, 'Z');
        close(result.p, expected.p, 'p');
      });
    }

    if (c.ar1Pettitt) {
      const expected = c.ar1Pettitt;
      it(`ar1Pettitt(${c.name}) matches r₁, φ, n/n* and p`, () => {
        const result = ar1Pettitt(values(c.y));
        close(result.lag1, expected.lag1, 'r1');
        close(result.phi, expected.phi, 'phi');
        close(result.correctionFactor, expected.correctionFactor, 'n/n*');
        close(result.p, expected.p, 'p');
      });
    }

    if (c.pettitt) {
      const expected = c.pettitt;
      it(`pettitt(${c.name}) matches K, location and p`, () => {
        const result = pettitt(values(c.y));
        close(result.k, expected.k, 'K');
        expect(result.location).toBe(expected.location);
        close(result.p, expected.p, 'p');
      });
    }

    if (c.seasonalKendall && c.months) {
      const expected = c.seasonalKendall;
      const months = c.months;
      it(`seasonalKendall(${c.name}) matches S, Var(S), Z, p, the seasonal slope and the covariance variant`, () => {
        const result = seasonalKendall(months, values(c.y));
        close(result.s, expected.s, 'S');
        close(result.varianceS, expected.varianceS, 'Var(S)');
        close(result.z, expected.z, 'Z');
        close(result.p, expected.p, 'p');
        close(result.slope, expected.slope, 'seasonal slope');
        if (expected.covariance) {
          expect(result.covariance.applied).toBe(true);
          if (!result.covariance.applied) return;
          close(result.covariance.varianceS, expected.covariance.varianceS, 'Var(S) with covariance');
          close(result.covariance.z, expected.covariance.z, 'Z with covariance');
          close(result.covariance.p, expected.covariance.p, 'p with covariance');
        } else {
          expect(result.covariance.applied).toBe(false);
        }
      });
    }
  }

  for (const c of reference.cases.filter((entry) => entry.kruskalWallis && entry.months)) {
    it(`kruskalWallis(${c.name}) by calendar month matches scipy kruskal`, () => {
      const result = kruskalWallis(
        (c.months as number[]).map((month) => month % 12),
        values(c.y),
      );
      close(result.h, c.kruskalWallis?.h, 'H');
      close(result.p, c.kruskalWallis?.p, 'p');
    });
  }

  it('chiSquareSurvival(x, k) matches scipy chi2.sf', () => {
    const q = reference.chiSquare;
    q.x.forEach((x, k) => close(chiSquareSurvival(x, q.df[k] as number), q.survival[k], `sf(${x}, ${q.df[k]})`));
  });

  it('logAgreement(field, satellite) matches the numpy lines of Morley et al. (2018) and scipy pearsonr on log10 values', () => {
    const result = logAgreement(reference.agreement.reference, reference.agreement.estimate);
    for (const key of ['medianSymmetricAccuracy', 'symmetricSignedBias', 'log10Bias', 'rSquaredLog10'] as const)
      close(result[key], reference.logAgreement[key], key);
    expect(result.n).toBe(reference.agreement.reference.length);
  });

  it('studentTTwoSided(t, ν) matches scipy 2·t.sf, whole and fractional ν', () => {
    const q = reference.studentT;
    q.t.forEach((t, k) => close(studentTTwoSided(t, q.df[k] as number), q.twoSided[k], `2·sf(${t}, ${q.df[k]})`));
  });

  it('weightedMedian(values, weights) matches the numpy lines', () => {
    for (const { values: v, weights, median } of reference.weightedMedian) close(weightedMedian(v, weights), median, 'weighted median');
  });

  it('benjaminiHochberg(p) matches scipy false_discovery_control', () => {
    for (const { p, adjusted } of reference.benjaminiHochberg) {
      const result = benjaminiHochberg(p);
      result.adjusted.forEach((value, k) => close(value, adjusted[k], `adjusted p ${k}`));
    }
  });

  it('quantile, percentileRank and sampleStandardDeviation match numpy and scipy', () => {
    const q = reference.quantile;
    q.probabilities.forEach((p, k) => close(quantile(q.sample, p), q.values[k], `quantile ${p}`));
    const r = reference.percentileRank;
    r.scores.forEach((score, k) => close(percentileRank(r.sample, score), r.values[k], `percentile rank of ${score}`));
    close(sampleStandardDeviation(reference.standardDeviation.sample), reference.standardDeviation.value, 'sd');
  });

  it('agreement(field, satellite) matches numpy and scipy linregress', () => {
    const a = reference.agreement;
    const result = agreement(a.reference, a.estimate);
    for (const key of ['bias', 'meanAbsoluteError', 'rootMeanSquareError', 'slope', 'intercept', 'rSquared'] as const)
      close(result[key], a[key] as number, key);
  });

  it('normalSurvival and normalQuantile match scipy.stats.norm', () => {
    const n = reference.normal;
    n.z.forEach((z, k) => close(normalSurvival(z), n.survival[k], `sf(${z})`));
    n.p.forEach((p, k) => close(normalQuantile(p), n.quantile[k], `ppf(${p})`));
  });
});

describe("Carlson's divisions", () => {
  it('carlsonClass names the index by Carlson & Simpson (1996) divisions, lower bound inclusive (boundaries from memory of that table)', async () => {
    const { carlsonClass, trophicStateIndex } = await import('../../src/stats/index.ts');
    expect([39.99, 40, 49.99, 50, 69.99, 70, 95].map(carlsonClass)).toEqual([
      'oligotrophic',
      'mesotrophic',
      'mesotrophic',
      'eutrophic',
      'eutrophic',
      'hypereutrophic',
      'hypereutrophic',
    ]);
    // Doubling chlorophyll adds 10·0.68·ln 2/ln 2 = 6.8 index points, by the formula itself.
    expect(trophicStateIndex(8) - trophicStateIndex(4)).toBeCloseTo(6.8, 12);
    // Carlson (1977), Table 2 (chlorophyll-a at whole TSI decades; the values written from memory of
    // that table, to two significant digits): 0.94 µg/L at 30, 2.6 at 40, 20 at 60, 56 at 70.
    for (const [chlorophyll, tsi] of [
      [0.94, 30],
      [2.6, 40],
      [20, 60],
      [56, 70],
    ] as const)
      expect(Math.abs(trophicStateIndex(chlorophyll) - tsi), `${chlorophyll} µg/L`).toBeLessThan(0.15);
  });
});

describe('logAgreement by hand', () => {
  it('Q = 2, ½ and 1: the typical error is a factor of 2 either way (100 %), and the signed bias is 0', async () => {
    const { logAgreement } = await import('../../src/stats/index.ts');
    // ln Q = ln 2, −ln 2, 0: median |ln Q| = ln 2 → ζ = 100·(2 − 1) = 100 %; median ln Q = 0 → SSPB = 0 (the definitions of Morley et al. 2018).
    const result = logAgreement([1, 1, 1, 0, 5], [2, 0.5, 1, 3, -1]);
    expect(result.n).toBe(3); // the pairs with a value that is not positive are skipped
    expect(result.medianSymmetricAccuracy).toBeCloseTo(100, 12);
    expect(result.symmetricSignedBias).toBeCloseTo(0, 12);
    expect(result.log10Bias).toBeCloseTo(0, 12);
  });
});
