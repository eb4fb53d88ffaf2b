/**
 * Stage 2, model: turns the typed inputs into the bulletin model, every figure the site prints with
 * the words that go with it. The model is written out as JSON beside the site.
 */
import type { BulletinInputs, InputFile, Problem } from '../ingest/index.ts';
import { calendarMonthOf, formatProblem, monthLabel } from '../ingest/index.ts';
import { formatMessage, loadMessages } from '../text/index.ts';
import { formatCalendarMonth, formatDate, formatMonth, formatPercent } from '../text/format.ts';
import { surfaceWater, type SurfaceWater } from './surfaceWater.ts';

export type { Comparison, SurfaceWater, RegionalMonth } from './surfaceWater.ts';

export interface Notice {
  kind: 'notice' | 'caveat' | 'caution';
  text: string;
}

export interface BulletinModel {
  meta: {
    title: string;
    publisher: string;
    region: string;
    locale: string;
    month: string;
    monthName: string;
    calendarMonthName: string;
    revision: number;
    published: string;
    publishedName: string;
    draft: boolean;
    baseUrl: string;
    /** Site path of the issue, with leading and trailing slash. */
    issuePath: string;
    baseline: { firstYear: number; lastYear: number; minYears: number };
    minObservedShare: number;
    minRegionCoverage: number;
    toolVersion: string;
  };
  surfaceWater: SurfaceWater;
  /** The sentence the overview leads with, or the notice that replaces it. */
  headline: string;
  /** Supporting sentences that carry the figures; empty when no figure is stated. */
  details: string[];
  notices: Notice[];
  warnings: Array<Problem & { text: string }>;
  inputs: InputFile[];
}

export function buildModel(inputs: BulletinInputs, warnings: Problem[], toolVersion: string): BulletinModel {
  const { config } = inputs;
  const locale = config.locales[0] ?? 'en';
  const messages = loadMessages(locale);
  const t = (key: string, params?: Record<string, string | number>) => formatMessage(messages, key, params);
  const pct = (value: number, digits = 0) => formatPercent(locale, value, digits);

  const water = surfaceWater(inputs);
  const monthName = formatMonth(locale, inputs.bulletinMonth);
  const calendarMonthName = formatCalendarMonth(locale, calendarMonthOf(inputs.bulletinMonth));
  const baselineParams = { baselineFirst: config.baseline.firstYear, baselineLast: config.baseline.lastYear };

  const notices: Notice[] = [];
  const details: string[] = [];
  let headline: string;
  const comparison = water.bulletin;
  if (comparison.kind === 'stated') {
    headline = t('surface.headline', { month: monthName, percentOfBaseline: pct(comparison.percentOfBaseline), calendarMonth: calendarMonthName, band: t(`band.${comparison.bandKey}`) });
    details.push(t('surface.detail', { filling: pct(comparison.fillingPercent), baselineMedian: pct(comparison.baselineMedianPercent), calendarMonth: calendarMonthName, ...baselineParams }));
    details.push(t('surface.coverage', { coverage: pct(comparison.coveragePercent) }));
  } else if (comparison.kind === 'low-coverage') {
    headline = t('notice.lowCoverage', { month: monthName, coverage: pct(comparison.coveragePercent), threshold: pct(comparison.thresholdPercent) });
    notices.push({ kind: 'notice', text: headline });
  } else {
    headline = t('notice.shortBaseline', { years: comparison.usableYears, needed: comparison.neededYears, calendarMonth: calendarMonthName });
    notices.push({ kind: 'notice', text: headline });
  }
  notices.push({ kind: 'caveat', text: t('caveat.baseline', baselineParams) });
  notices.push({ kind: 'caveat', text: t('caveat.optical', { minShare: pct(100 * config.coverage.minObservedShare) }) });
  notices.push({ kind: 'caution', text: t('caution.water') });

  return {
    meta: {
      title: config.title,
      publisher: config.publisher,
      region: config.region.name,
      locale,
      month: monthLabel(inputs.bulletinMonth),
      monthName,
      calendarMonthName,
      revision: config.issue.revision,
      published: config.issue.published,
      publishedName: formatDate(locale, config.issue.published),
      draft: config.issue.draft,
      baseUrl: config.site.baseUrl,
      issuePath: `/issues/${monthLabel(inputs.bulletinMonth)}/`,
      baseline: config.baseline,
      minObservedShare: config.coverage.minObservedShare,
      minRegionCoverage: config.coverage.minRegionCoverage,
      toolVersion,
    },
    surfaceWater: water,
    headline,
    details,
    notices,
    warnings: warnings.map((problem) => ({ ...problem, text: formatProblem(problem) })),
    inputs: inputs.files,
  };
}
