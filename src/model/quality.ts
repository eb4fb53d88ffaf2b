/**
 * Water quality (chlorophyll-a and turbidity) from the per-body monthly medians of valid pixels.
 *
 * - Region medians per month, two ways: the plain median of the body medians (every body counts
 *   once) and the median weighted by reference area (large bodies count more).
 * - Distributions: body medians per month in bins, on a log scale for chlorophyll-a (four bins a
 *   decade) and a linear one for turbidity.
 * - Quantiles (10th, 25th, 50th, 75th, 90th, type 7) of the bulletin month's body medians by
 *   quality size class.
 * - Carlson (1977) trophic state index per body and counts per OECD (1982) trophic class.
 * - The share of bodies above the WHO (2003) recreational guidance levels for chlorophyll-a.
 * - Trends per body (as for surface water) and, where the configuration names seasons, the trend
 *   of each size class's seasonal median year by year.
 */
import type { MethodId } from './methods.ts';
import type { BulletinConfig, BulletinInputs, QualityParameter } from '../ingest/index.ts';
import { QUALITY_PARAMETERS } from '../ingest/index.ts';
import {
  benjaminiHochberg,
  finiteOrNull,
  mannKendall,
  median,
  quantile,
  sensSlope,
  TROPHIC_BOUNDS,
  trophicClass,
  trophicStateIndex,
  carlsonClass,
  type CarlsonClass,
  weightedMedian,
  type TrophicClass,
} from '../stats/index.ts';
import { referenceAreasOf, sizeClassBounds } from './surfaceWater.ts';
import { manyTrendTests, summarize, trendTest, type TrendFamily, type TrendTest } from './trends.ts';
import type { WorkerPool } from '../parallel/pool.ts';
import { sizeClassLabel } from '../text/index.ts';

/**
 * WHO (2003), Guidelines for Safe Recreational Water Environments, Vol. 1, ch. 8: chlorophyll-a of
 * 10 µg/L with cyanobacterial dominance marks a relatively low probability of adverse health
 * effects, 50 µg/L a moderate one.
 */
export const WHO_LEVELS = [10, 50] as const;

/** Months of the year a body needs for its annual mean and OECD class (8 of 12: cloud and ice leave gaps; this project's choice). */
export const TROPHIC_MIN_MONTHS = 8;

export interface ParameterMonths {
  firstMonth: number;
  months: number;
  /** Body median per body and month; NaN = no value. */
  values: Float64Array[];
  /** Bodies whose bulletin-month median was left out for too few valid pixels. */
  fewPixels: number;
}

export interface QualityParameterSummary {
  parameter: QualityParameter;
  unit: string;
  /** Region medians per month: plain and area-weighted; null where no body had a value. */
  monthly: Array<{ month: number; bodies: number; median: number | null; weightedMedian: number | null }>;
  distribution: { edges: number[]; months: Array<{ month: number; counts: number[] }> };
  bySizeClass: Array<{
    label: string;
    fromHa: number;
    toHa: number | null;
    bodies: number;
    p10: number | null;
    p25: number | null;
    p50: number | null;
    p75: number | null;
    p90: number | null;
  }>;
  bodiesThisMonth: number;
  /** Bodies left without a value this month for too few valid pixels (quality.minValidPixels). */
  fewPixelsThisMonth: number;
  /** Sen's line through the plain region medians: value = intercept + slope × decimal year. */
  medianTrend: { slopePerYear: number; intercept: number; lower: number; upper: number } | null;
  /** Per body, adjusted across the bodies (the same rule as surface water's trends). */
  trends: TrendFamily<{ id: string; test: TrendTest | null }>;
  seasonal: Array<{
    season: string;
    seasonName: string;
    sizeClass: string;
    fromHa: number;
    toHa: number | null;
    years: number;
    slopePerYear: number | null;
    p: number | null;
    /** Adjusted across this parameter's seasonal classes (Benjamini-Hochberg). */
    pAdjusted: number | null;
  }>;
}

/** A parameter's figures alone: the size-class labels and season names are the wording stage's (wordQuality). */
export type QualityParameterFigures = Omit<QualityParameterSummary, 'bySizeClass' | 'seasonal'> & {
  bySizeClass: Array<Omit<QualityParameterSummary['bySizeClass'][number], 'label'>>;
  seasonal: Array<Omit<QualityParameterSummary['seasonal'][number], 'seasonName' | 'sizeClass'>>;
};

/** Water quality as figures, the same in every language. */
export type QualityFigures = Omit<Quality, 'parameters'> & { parameters: QualityParameterFigures[] };

export interface Quality {
  methods: MethodId[];
  parameters: QualityParameterSummary[];
  /**
   * Trophic state two ways, never mixed. Carlson's (1977) index of the bulletin month's median,
   * with Carlson's own divisions. The OECD (1982) class of the annual mean of the last complete
   * calendar year (`year`), for bodies with at least TROPHIC_MIN_MONTHS months of it: the OECD
   * boundaries are for annual means, not for one month.
   */
  trophic: {
    year: number;
    minMonths: number;
    bodies: Array<{
      id: string;
      /** Bulletin-month median, its Carlson index and Carlson class; null without a value this month. */
      chlorophyll: number | null;
      index: number | null;
      carlsonClass: CarlsonClass | null;
      /** Mean of the monthly medians over `year`, the months it rests on, and its OECD class (null below minMonths). */
      annualMean: number | null;
      annualMonths: number;
      trophicClass: TrophicClass | null;
    }>;
    counts: Array<{ trophicClass: TrophicClass; upperBound: number | null; bodies: number }>;
  };
  who: { bodiesWithValue: number; levels: Array<{ level: number; bodiesAbove: number; sharePercent: number | null }> };
}

export function parameterMonths(inputs: BulletinInputs, parameter: QualityParameter): ParameterMonths {
  const table = inputs.quality;
  const code = QUALITY_PARAMETERS.indexOf(parameter);
  let firstMonth = inputs.bulletinMonth;
  if (table)
    for (let k = 0; k < table.length; k++) if (table.parameter[k] === code) firstMonth = Math.min(firstMonth, table.month[k] as number);
  const months = inputs.bulletinMonth - firstMonth + 1;
  const values = inputs.bodies.map(() => new Float64Array(months).fill(Number.NaN));
  const minPixels = inputs.config.quality.minValidPixels;
  let fewPixels = 0;
  if (table)
    for (let k = 0; k < table.length; k++) {
      if (table.parameter[k] !== code) continue;
      // A median from too few valid pixels is no value (an unknown count, NaN, is taken as enough).
      if ((table.validPixels[k] as number) < minPixels) {
        if (table.month[k] === inputs.bulletinMonth) fewPixels++;
        continue;
      }
      (values[table.body[k] as number] as Float64Array)[(table.month[k] as number) - firstMonth] = table.median[k] as number;
    }
  return { firstMonth, months, values, fewPixels };
}

const round = (value: number) => Math.round(value * 1e6) / 1e6;

function edgesFor(parameter: QualityParameter): number[] {
  // Chlorophyll-a: 0.1 to 1000 µg/L, four bins a decade. Turbidity: 0 to 100 FNU in steps of 5.
  return parameter === 'chlorophyll_a'
    ? Array.from({ length: 17 }, (_, k) => round(10 ** (k / 4 - 1)))
    : Array.from({ length: 21 }, (_, k) => 5 * k);
}

/** Bin index of a value, or −1 below the first edge; values at or above the last edge go in the last bin. */
function binOf(value: number, edges: number[]): number {
  if (value < (edges[0] as number)) return -1;
  for (let k = 1; k < edges.length; k++) if (value < (edges[k] as number)) return k - 1;
  return edges.length - 2;
}

function parameterSummary(
  inputs: BulletinInputs,
  parameter: QualityParameter,
  data: ParameterMonths,
  prepared: Array<TrendTest | null> | undefined,
): QualityParameterFigures {
  const { bodies, config, bulletinMonth } = inputs;
  const reference = referenceAreasOf(inputs);
  // Month-major copy of the body values: each month's values are then one contiguous view.
  const count = data.values.length;
  const byMonth = new Float64Array(data.months * count);
  data.values.forEach((series, body) => {
    for (let slot = 0; slot < data.months; slot++) byMonth[slot * count + body] = series[slot] as number;
  });
  const monthValues = (slot: number) => byMonth.subarray(slot * count, (slot + 1) * count);
  const monthly = Array.from({ length: data.months }, (_, slot) => {
    const values = monthValues(slot);
    let bodiesWithValue = 0;
    for (let k = 0; k < count; k++) bodiesWithValue += Number.isFinite(values[k]) ? 1 : 0;
    return {
      month: data.firstMonth + slot,
      bodies: bodiesWithValue,
      median: finiteOrNull(median(values)),
      weightedMedian: finiteOrNull(weightedMedian(values, reference)),
    };
  });
  const edges = edgesFor(parameter);
  const distribution = {
    edges,
    months: monthly.slice(-24).map(({ month }) => {
      const counts = new Array<number>(edges.length - 1).fill(0);
      const values = monthValues(month - data.firstMonth);
      for (let k = 0; k < count; k++) {
        const value = values[k] as number;
        const bin = Number.isFinite(value) ? binOf(value, edges) : -1;
        if (bin >= 0) counts[bin] = (counts[bin] as number) + 1;
      }
      return { month, counts };
    }),
  };
  const now = data.values.map((series) => series[bulletinMonth - data.firstMonth] as number);
  const bySizeClass = sizeClassBounds(config.sizeClasses.quality, false).map(({ fromHa, toHa }) => {
    const values = now.filter(
      (value, k) => Number.isFinite(value) && (reference[k] as number) >= fromHa && (toHa === null || (reference[k] as number) < toHa),
    );
    const q = (p: number) => (values.length > 0 ? quantile(values, p) : null);
    return { fromHa, toHa, bodies: values.length, p10: q(0.1), p25: q(0.25), p50: q(0.5), p75: q(0.75), p90: q(0.9) };
  });

  const months = Int32Array.from({ length: data.months }, (_, k) => data.firstMonth + k);
  const tests = prepared ?? data.values.map((series) => trendTest(months, series, config));
  const trends = summarize(
    bodies.map((body, k) => ({ id: body.id, test: tests[k] ?? null })),
    config.trends.falseDiscoveryRate,
  );

  return {
    parameter,
    // Turbidity keeps the unit of the table (NTU or FNU: not interchangeable, so never converted).
    unit: parameter === 'chlorophyll_a' ? 'µg/L' : (inputs.quality?.turbidityUnit ?? 'FNU'),
    monthly,
    distribution,
    bySizeClass,
    bodiesThisMonth: now.filter(Number.isFinite).length,
    fewPixelsThisMonth: data.fewPixels,
    medianTrend: medianTrend(monthly),
    trends,
    seasonal: seasonalClassTrends(inputs, data, config),
  };
}

function medianTrend(monthly: Array<{ month: number; median: number | null }>): QualityParameterSummary['medianTrend'] {
  const rows = monthly.filter((row) => row.median !== null);
  if (rows.length < 3) return null;
  const result = sensSlope(
    rows.map((row) => row.month / 12),
    rows.map((row) => row.median as number),
  );
  return Number.isFinite(result.slope)
    ? { slopePerYear: result.slope, intercept: result.intercept, lower: result.lower, upper: result.upper }
    : null;
}

/**
 * For each configured season and quality size class: the median over the class's bodies of their
 * seasonal mean, season-year by season-year, tested with Mann-Kendall and Sen's slope per year
 * (season-years with no value are left out). A season listed across the new year (months
 * [11, 12, 1, 2, 3]) is one season: its season-year Y runs from November of Y to March of Y + 1,
 * never November and December of Y with January to March of Y. The p values of one parameter's
 * seasonal classes are adjusted together (Benjamini-Hochberg at trends.falseDiscoveryRate): that
 * family is named on the page.
 */
function seasonalClassTrends(inputs: BulletinInputs, data: ParameterMonths, config: BulletinConfig): QualityParameterFigures['seasonal'] {
  const out: QualityParameterFigures['seasonal'] = [];
  const reference = Array.from(referenceAreasOf(inputs));
  const firstYear = Math.floor(data.firstMonth / 12);
  const lastYear = Math.floor(inputs.bulletinMonth / 12);
  const classes = sizeClassBounds(config.sizeClasses.quality, false).map(({ fromHa, toHa }) => ({
    fromHa,
    toHa,
    members: reference.map((ha, k) => (ha >= fromHa && (toHa === null || ha < toHa) ? k : -1)).filter((k) => k >= 0),
  }));
  for (const season of config.quality.seasons) {
    const yearOffsets = seasonYearOffsets(season.months);
    for (const { fromHa, toHa, members } of classes) {
      const years: number[] = [];
      const values: number[] = [];
      const means = new Float64Array(members.length);
      for (let year = firstYear; year <= lastYear; year++) {
        // Only whole season-years: the season's last month must be on or before the bulletin month.
        const lastOffset = yearOffsets[yearOffsets.length - 1] as number;
        if ((year + lastOffset) * 12 + (season.months[season.months.length - 1] as number) - 1 > inputs.bulletinMonth) continue;
        // Each member's mean over the season's months with a value (summed in the season's month order).
        members.forEach((body, m) => {
          const series = data.values[body] as Float64Array;
          let sum = 0;
          let seen = 0;
          for (const [position, month] of season.months.entries()) {
            const value = series[(year + (yearOffsets[position] as number)) * 12 + month - 1 - data.firstMonth];
            if (value !== undefined && Number.isFinite(value)) {
              sum += value;
              seen++;
            }
          }
          means[m] = seen > 0 ? sum / seen : Number.NaN;
        });
        const value = median(means);
        if (Number.isFinite(value)) {
          years.push(year);
          values.push(value);
        }
      }
      const test = mannKendall(values);
      out.push({
        season: season.key,
        fromHa,
        toHa,
        years: years.length,
        slopePerYear: years.length >= 3 ? finiteOrNull(sensSlope(years, values).slope) : null,
        p: finiteOrNull(test.p),
        pAdjusted: null,
      });
    }
  }
  const adjusted = benjaminiHochberg(
    out.map((entry) => entry.p),
    config.trends.falseDiscoveryRate,
  );
  return out.map((entry, k) => ({ ...entry, pAdjusted: finiteOrNull(adjusted.adjusted[k] as number) }));
}

/**
 * For each month of a season, in the order listed, the years to add to the season-year to reach
 * its calendar year: 0 until the list wraps past December, 1 after (so [11, 12, 1, 2, 3] gives
 * [0, 0, 1, 1, 1]).
 */
export function seasonYearOffsets(months: number[]): number[] {
  let offset = 0;
  return months.map((month, k) => {
    if (k > 0 && month < (months[k - 1] as number)) offset++;
    return offset;
  });
}

/** Per parameter, its monthly body values and their trend tests, when computed beforehand (see prepareQuality). */
export type PreparedQuality = Array<{ parameter: QualityParameter; data: ParameterMonths; tests: Array<TrendTest | null> }>;

/** The body values of each parameter and their trend tests, on the worker pool for a large inventory. */
export async function prepareQuality(
  inputs: BulletinInputs,
  pool: WorkerPool,
  onBatch?: (series: number) => void,
): Promise<PreparedQuality | null> {
  if (!inputs.quality || inputs.quality.length === 0) return null;
  return Promise.all(
    QUALITY_PARAMETERS.map(async (parameter) => {
      const data = parameterMonths(inputs, parameter);
      const rows = (from: number, to: number) => {
        const matrix = new Float64Array((to - from) * data.months);
        for (let body = from; body < to; body++) matrix.set(data.values[body] as Float64Array, (body - from) * data.months);
        return matrix;
      };
      return {
        parameter,
        data,
        tests: await manyTrendTests(data.firstMonth, data.months, data.values.length, rows, inputs.config.trends, pool, onBatch),
      };
    }),
  );
}

/** A configured season's name in a language (quality.seasons[].names), or its key where none is given. */
function seasonName(config: BulletinConfig, key: string, locale: string): string {
  const names = config.quality.seasons.find((season) => season.key === key)?.names;
  return names?.[locale as keyof typeof names] ?? key;
}

/** The wording stage's part: the figures with the size-class labels and season names of one language. */
export function wordQuality(figures: QualityFigures | null, config: BulletinConfig, locale: string): Quality | null {
  if (!figures) return null;
  return {
    ...figures,
    parameters: figures.parameters.map((parameter) => ({
      ...parameter,
      bySizeClass: parameter.bySizeClass.map((entry) => ({ label: sizeClassLabel(locale, entry.fromHa, entry.toHa), ...entry })),
      seasonal: parameter.seasonal.map(({ season, ...entry }) => ({
        season,
        seasonName: seasonName(config, season, locale),
        sizeClass: sizeClassLabel(locale, entry.fromHa, entry.toHa),
        ...entry,
      })),
    })),
  };
}

export function quality(inputs: BulletinInputs, prepared?: PreparedQuality | null): QualityFigures | null {
  if (!inputs.quality || inputs.quality.length === 0) return null;
  const byParameter =
    prepared ?? QUALITY_PARAMETERS.map((parameter) => ({ parameter, data: parameterMonths(inputs, parameter), tests: undefined }));
  const chlorophyll = byParameter.find((entry) => entry.parameter === 'chlorophyll_a')?.data;
  const now = chlorophyll ? chlorophyll.values.map((series) => series[inputs.bulletinMonth - chlorophyll.firstMonth] as number) : [];
  // The last complete calendar year: the bulletin's own year only when the bulletin month is December.
  const year = Math.floor(inputs.bulletinMonth / 12) - (inputs.bulletinMonth % 12 === 11 ? 0 : 1);
  const trophicBodies = inputs.bodies.flatMap((body, k) => {
    const value = now[k];
    const current = value !== undefined && Number.isFinite(value) ? value : null;
    let sum = 0;
    let annualMonths = 0;
    if (chlorophyll) {
      const series = chlorophyll.values[k] as Float64Array;
      for (let month = year * 12; month < year * 12 + 12; month++) {
        const monthly = series[month - chlorophyll.firstMonth];
        if (monthly !== undefined && Number.isFinite(monthly)) {
          sum += monthly;
          annualMonths++;
        }
      }
    }
    const annualMean = annualMonths >= TROPHIC_MIN_MONTHS ? sum / annualMonths : null;
    if (current === null && annualMean === null) return [];
    const index = current === null ? null : trophicStateIndex(current);
    return [
      {
        id: body.id,
        chlorophyll: current,
        index,
        carlsonClass: index === null ? null : carlsonClass(index),
        annualMean,
        annualMonths,
        trophicClass: annualMean === null ? null : trophicClass(annualMean),
      },
    ];
  });
  const withValue = now.filter(Number.isFinite);
  return {
    methods: ['quality-medians', 'quality-classes', 'trend-bodies', 'trophic', 'who-levels'],
    parameters: byParameter.map(({ parameter, data, tests }) => parameterSummary(inputs, parameter, data, tests)),
    trophic: {
      year,
      minMonths: TROPHIC_MIN_MONTHS,
      bodies: trophicBodies,
      counts: TROPHIC_BOUNDS.map(([trophicClassName, upper]) => ({
        trophicClass: trophicClassName,
        upperBound: Number.isFinite(upper) ? upper : null,
        bodies: trophicBodies.filter((entry) => entry.trophicClass === trophicClassName).length,
      })),
    },
    who: {
      bodiesWithValue: withValue.length,
      levels: WHO_LEVELS.map((level) => {
        const above = withValue.filter((value) => value > level).length;
        return { level, bodiesAbove: above, sharePercent: withValue.length > 0 ? (100 * above) / withValue.length : null };
      }),
    },
  };
}
