import type { TrendReason } from './mannKendall.ts';
import { scratch } from './scratch.ts';
import { normalSurvival } from './normalSurvival.ts';
import { selectRanks } from './selectRanks.ts';

export interface SeasonResult {
  /** Calendar month 1–12. */
  season: number;
  n: number;
  s: number;
  varianceS: number;
}

export interface SeasonalKendallResult {
  seasons: SeasonResult[];
  n: number;
  s: number;
  /** Σ Var(S_g): seasons taken as independent (Hirsch, Slack & Smith 1982). */
  varianceS: number;
  z: number;
  p: number;
  /** The Hirsch & Slack (1984) variant, allowing for covariance between seasons. */
  covariance:
    | { applied: true; varianceS: number; z: number; p: number }
    | { applied: false; reason: 'too-few-years'; fewestYears: number; neededYears: number };
  /** Seasonal Sen slope: median of all within-season slopes, per year. */
  slope: number;
  reason: TrendReason;
}

export interface SeasonalKendallOptions {
  /**
   * Fewest values every season needs before the covariance variant is used. Default 10: the
   * record length from which Hirsch & Slack (1984) report that their test keeps its nominal size
   * (recalled from the paper, not re-derived here).
   */
  minYearsForCovariance?: number;
}

/**
 * Seasonal Kendall test (Hirsch, Slack & Smith 1982) on a monthly series: `months` are month
 * indices (year × 12 + month − 1), so each calendar month is a season. Within each season the
 * Mann-Kendall S and Var(S) (ties corrected) are computed over the years; S = Σ S_g,
 * Var(S) = Σ Var(S_g), Z = (S − sgn S)/√Var(S), p two-sided. Missing values are skipped.
 *
 * The covariance variant (Hirsch & Slack 1984, after Dietz & Killeen 1981) adds, for every pair of
 * seasons g ≠ h over the n years of the record, σ_gh = [K_gh + 4 Σⱼ R_jg R_jh − n(n+1)²]/3 with
 * K_gh = Σᵢ<ⱼ sgn((X_jg − X_ig)(X_jh − X_ih)) and R_jg = [n + 1 + Σᵢ sgn(X_jg − X_ig)]/2, where a
 * missing value makes its sgn terms 0. It is used only when every season has at least
 * `minYearsForCovariance` values; otherwise the result says why.
 *
 * The seasonal Sen slope (Hirsch, Slack & Smith 1982) is the median of (x_j − x_i)/(year_j − year_i)
 * over all pairs within the same season. Cost O(n²) per season for a record of n years, O(144·n²)
 * for the covariance.
 */
export function seasonalKendall(
  months: ArrayLike<number>,
  values: ArrayLike<number | null | undefined>,
  options: SeasonalKendallOptions = {},
): SeasonalKendallResult {
  const neededYears = options.minYearsForCovariance ?? 10;
  if (months.length !== values.length) throw new RangeError('seasonalKendall requires months and values of the same length');
  const grid = yearGrid(months, values);
  const seasons: SeasonResult[] = [];
  let s = 0;
  let varianceS = 0;
  let n = 0;
  const slopes = scratch('seasonal-slopes', (12 * grid.years * (grid.years - 1)) / 2);
  let slopeCount = 0;
  const equal = scratch('seasonal-equal', grid.years);
  for (let season = 0; season < 12; season++) {
    const column = grid.columns[season] as Float64Array;
    // Within one season, the Mann-Kendall S and the tie term over its years from the same pair
    // loop as the slopes (a season has a few dozen years at most, so pairs beat a merge sort):
    // with cᵢ the other years equal to year i, a group of t equal values gives each member
    // c = t − 1, so Σ t(t − 1)(2t + 5) over groups = Σᵢ cᵢ(2cᵢ + 7) over values.
    let count = 0;
    let seasonS = 0;
    equal.fill(0, 0, grid.years);
    for (let i = 0; i < grid.years; i++) {
      const xi = column[i] as number;
      if (xi !== xi) continue; // NaN: missing
      count++;
      for (let j = i + 1; j < grid.years; j++) {
        const xj = column[j] as number;
        if (xj !== xj) continue;
        slopes[slopeCount++] = (xj - xi) / (j - i);
        seasonS += +(xj > xi) - +(xj < xi);
        if (xj === xi) {
          equal[i] = (equal[i] as number) + 1;
          equal[j] = (equal[j] as number) + 1;
        }
      }
    }
    let varianceTerm = 0;
    for (let i = 0; i < grid.years; i++) varianceTerm += (equal[i] as number) * (2 * (equal[i] as number) + 7);
    const seasonVariance = (count * (count - 1) * (2 * count + 5) - varianceTerm) / 18;
    seasons.push({ season: season + 1, n: count, s: seasonS, varianceS: seasonVariance });
    s += seasonS;
    varianceS += seasonVariance;
    n += count;
  }
  const slope = medianOf(slopes, slopeCount);
  const fewestYears = Math.min(...seasons.map((season) => season.n));
  const covariance: SeasonalKendallResult['covariance'] =
    fewestYears >= neededYears && varianceS > 0
      ? withCovariance(grid, s, varianceS)
      : { applied: false, reason: 'too-few-years', fewestYears, neededYears };
  if (varianceS <= 0) {
    return {
      seasons,
      n,
      s,
      varianceS,
      z: n < 3 ? Number.NaN : 0,
      p: n < 3 ? Number.NaN : 1,
      covariance,
      slope,
      reason: n < 3 ? 'too-few-values' : 'no-variance',
    };
  }
  const z = (s - Math.sign(s)) / Math.sqrt(varianceS);
  return { seasons, n, s, varianceS, z, p: Math.min(1, 2 * normalSurvival(Math.abs(z))), covariance, slope, reason: null };
}

interface YearGrid {
  years: number;
  /** One column per calendar month, one entry per year from the first to the last; NaN = missing. */
  columns: Float64Array[];
}

function yearGrid(months: ArrayLike<number>, values: ArrayLike<number | null | undefined>): YearGrid {
  let first = Infinity;
  let last = -Infinity;
  for (let k = 0; k < months.length; k++) {
    const value = values[k];
    if (typeof value !== 'number' || !Number.isFinite(value)) continue;
    const year = Math.floor((months[k] as number) / 12);
    first = Math.min(first, year);
    last = Math.max(last, year);
  }
  const years = Number.isFinite(first) ? last - first + 1 : 0;
  // One work buffer cut into twelve columns: no allocation per call (the grid never leaves this module's callers).
  const cells = scratch('seasonal-grid', 12 * years).fill(Number.NaN, 0, 12 * years);
  const columns = Array.from({ length: 12 }, (_, month) => cells.subarray(month * years, (month + 1) * years));
  for (let k = 0; k < months.length; k++) {
    const value = values[k];
    if (typeof value !== 'number' || !Number.isFinite(value)) continue;
    const month = months[k] as number;
    const column = columns[((month % 12) + 12) % 12] as Float64Array;
    const row = Math.floor(month / 12) - first;
    if (!Number.isNaN(column[row] as number)) throw new RangeError('seasonalKendall requires at most one value per month');
    column[row] = value;
  }
  return { years, columns };
}

const sgn = (value: number) => (value > 0 ? 1 : value < 0 ? -1 : 0); // NaN → 0: a missing value

function withCovariance(grid: YearGrid, s: number, seasonVarianceSum: number): { applied: true; varianceS: number; z: number; p: number } {
  const n = grid.years;
  const pairs = (n * (n - 1)) / 2;
  // signs[g·pairs + p] = sgn(x_jg − x_ig) for the p-th pair i < j, 0 where either is missing;
  // ranks[g·n + j] = R_jg. Work buffers: no allocation per call.
  const signs = scratch('seasonal-signs', 12 * pairs);
  const ranks = scratch('seasonal-ranks', 12 * n);
  for (let g = 0; g < 12; g++) {
    const column = grid.columns[g] as Float64Array;
    const rankBase = g * n;
    for (let j = 0; j < n; j++) ranks[rankBase + j] = n + 1;
    let p = g * pairs;
    for (let i = 0; i < n - 1; i++) {
      const xi = column[i] as number;
      for (let j = i + 1; j < n; j++) {
        const sign = sgn((column[j] as number) - xi);
        signs[p++] = sign;
        // R_jg sums sgn(x_jg − x_ig) over every i; the pair (i, j) adds it to j and its opposite to i.
        ranks[rankBase + j] = (ranks[rankBase + j] as number) + sign;
        ranks[rankBase + i] = (ranks[rankBase + i] as number) - sign;
      }
    }
    for (let j = 0; j < n; j++) ranks[rankBase + j] = (ranks[rankBase + j] as number) / 2;
  }
  let covarianceSum = 0;
  for (let g = 0; g < 12; g++) {
    for (let h = g + 1; h < 12; h++) {
      let k = 0;
      for (let p = 0, a = g * pairs, b = h * pairs; p < pairs; p++) k += (signs[a + p] as number) * (signs[b + p] as number);
      let rankProducts = 0;
      for (let j = 0; j < n; j++) rankProducts += (ranks[g * n + j] as number) * (ranks[h * n + j] as number);
      // σ_gh = σ_hg: each unordered pair of seasons counts twice.
      covarianceSum += (2 * (k + 4 * rankProducts - n * (n + 1) * (n + 1))) / 3;
    }
  }
  const varianceS = seasonVarianceSum + covarianceSum;
  const z = varianceS > 0 ? (s - Math.sign(s)) / Math.sqrt(varianceS) : 0;
  return { applied: true, varianceS, z, p: varianceS > 0 ? Math.min(1, 2 * normalSurvival(Math.abs(z))) : 1 };
}

/** Median of the first `count` values of a work buffer (reordered on the way). */
function medianOf(work: Float64Array, count: number): number {
  if (count === 0) return Number.NaN;
  const found = selectRanks(work, count, count % 2 === 1 ? [(count - 1) / 2] : [count / 2 - 1, count / 2]);
  return count % 2 === 1 ? (found[0] as number) : ((found[0] as number) + (found[1] as number)) / 2;
}
