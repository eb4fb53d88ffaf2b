/**
 * Key messages: 3–6 short statements for decision-makers, each made by a documented rule from the
 * model's figures, each carrying the figure it rests on and the page that shows it. A message is
 * left out, and a caveat says why, when coverage is below the threshold or the evidence does not
 * support it. Strength words for tests come from evidence.ts.
 *
 * Rules, in order:
 * 1. region: the regional status band and percent of usual (needs a stated status);
 * 1c. storage: with survey curves covering at least storage.minCurveShare of the region, its
 *    stored volume (two significant digits), share of capacity and percent of usual;
 * 1b. deficit: when the region has been below usual (the lower edge of the band holding 100 %)
 *    for at least DEFICIT_MONTHS months in a row, how long, since when, and the missing area
 *    summed month by month (hectare-months): a drought stated as such, apart from any trend;
 * 2. sub-region: the sub-region furthest below usual (needs two or more stated sub-regions and
 *    one below 100 % of usual);
 * 3. size class: the class whose dry share exceeds its baseline dry share the most (when > 0);
 * 4. trend count: water bodies whose steady decline holds after the Benjamini-Hochberg adjustment
 *    and is not explained by a single shift in level, and in the same message the bodies whose
 *    change is such a shift (a drought step is not a long-term trend);
 * 5. region: when Pettitt's test finds a single shift in level (its p within the false discovery
 *    rate), the shift's month and the evidence of a trend before it; otherwise the regional trend
 *    with its evidence words (only with at least moderate evidence);
 * 6. chlorophyll-a: bodies above the WHO 10 µg/L level (when any);
 * 7. change from a year ago (when rules 2–6 left room; at most six messages in all).
 */
import { formatCount, formatMessage, loadMessages, type MessageKey, bandKey } from '../text/index.ts';
import { formatCalendarMonth, formatMonth, formatNumber, formatPercent } from '../text/format.ts';
import { evidenceFor, type EvidenceKey } from '../model/evidence.ts';
import type { Quality } from '../model/quality.ts';
import type { SurfaceWater } from '../model/surfaceWater.ts';
import type { TrendSummary } from '../model/trends.ts';
import type { MethodId } from '../model/methods.ts';
import { bandFor } from '../model/status.ts';
import type { StorageFigures } from '../model/storage.ts';
import type { BulletinConfig } from '../ingest/index.ts';

/** Months in a row below usual from which the deficit is a key message (a season: fewer are in the status words already). */
export const DEFICIT_MONTHS = 3;

export interface KeyMessage {
  id: string;
  text: string;
  /** The figure the message rests on, as printed and as a number. */
  figure: { value: number; unit: string; method: MethodId };
  /** Page (relative to the issue) and anchor that show the figure. */
  link: string;
  evidence?: EvidenceKey;
}

export interface KeyMessageInputs {
  locale: string;
  /** What the region's water bodies are called ("reservoirs"; wording.waterBodies, src/wording/region.ts). */
  waterBodies: string;
  bulletinMonth: number;
  firstYear: number;
  surface: SurfaceWater;
  bodyTrends: TrendSummary;
  regionTrend: TrendSummary['entries'][number] | null;
  quality: Quality | null;
  /** Storage from the survey curves (rule 1c); null without curves. */
  storage: StorageFigures | null;
  /** The configured status bands (rule 1 names another band its range reaches). */
  statusBands: BulletinConfig['statusBands'];
}

export function keyMessages(input: KeyMessageInputs): { messages: KeyMessage[]; caveats: string[] } {
  const messages: KeyMessage[] = [];
  const caveats: string[] = [];
  const catalogue = loadMessages(input.locale);
  const t = (key: MessageKey, params?: Record<string, string | number>) => formatMessage(catalogue, key, params);
  const tCount = (key: MessageKey, count: number, params: Record<string, string | number>) =>
    formatCount(catalogue, input.locale, key, count, params);
  const pct = (value: number) => formatPercent(input.locale, value);
  const month = formatMonth(input.locale, input.bulletinMonth);
  const calendarMonth = formatCalendarMonth(input.locale, (input.bulletinMonth % 12) + 1);
  const region = input.surface.region.status;

  if (region.kind === 'stated') {
    messages.push({
      id: 'region',
      text: [
        t('key.region', {
          month,
          waterBodies: input.waterBodies,
          percentOfBaseline: pct(region.percentOfBaseline),
          calendarMonth,
          band: t(bandKey(region.bandKey)),
        }),
        ...rangeSentences(region, input.statusBands, pct, t),
      ].join(' '),
      figure: { value: region.percentOfBaseline, unit: '% of baseline median', method: 'status' },
      link: 'surface-water/#status',
    });
  } else if (region.kind === 'low-coverage') {
    caveats.push(
      t('caveat.keyCoverage', { month, coverage: pct(100 * region.coverageShare), threshold: pct(100 * region.thresholdShare) }),
    );
  } else {
    caveats.push(t('caveat.keyBaseline', { month, years: region.usableYears, needed: region.neededYears, calendarMonth }));
  }

  const deficit = input.surface.region.deficit;
  if (region.kind === 'stated' && deficit.months >= DEFICIT_MONTHS && deficit.since !== null) {
    messages.push({
      id: 'deficit',
      text: tCount('key.deficit', deficit.months, {
        months: deficit.months,
        since: formatMonth(input.locale, deficit.since),
        // Two significant digits: the baseline behind the shortfall supports no more.
        haMonths: formatNumber(input.locale, Number(deficit.shortfallHaMonths.toPrecision(2)), 0),
      }),
      figure: { value: deficit.months, unit: 'months in a row below usual', method: 'deficit' },
      link: 'surface-water/#status',
    });
  }

  // 1c. storage: the region's stored volume against capacity and usual, when the curves cover enough of it.
  const stored = input.storage?.region;
  if (stored && stored.status?.kind === 'stated' && stored.volumeHm3 !== null) {
    messages.push({
      id: 'storage',
      text: t('key.storage', {
        // Two significant digits: a survey curve and a month of cloud support no more.
        volume: formatNumber(input.locale, Number(stored.volumeHm3.toPrecision(2)), 0),
        month,
        percentOfCapacity: pct(stored.status.fillingPercent),
        percentOfBaseline: pct(stored.status.percentOfBaseline),
        calendarMonth,
        curveShare: pct(100 * stored.curveShare),
      }),
      figure: { value: stored.volumeHm3, unit: 'hm³ stored', method: 'storage' },
      link: 'surface-water/#storage',
    });
  }

  const stated = input.surface.subRegions.filter((entry) => entry.status.kind === 'stated');
  const lowest = [...stated].sort((a, b) => percentOf(a.status) - percentOf(b.status))[0];
  if (region.kind === 'stated' && stated.length >= 2 && lowest && percentOf(lowest.status) < 100) {
    messages.push({
      id: 'sub-region',
      text: t('key.subRegion', { name: lowest.name, percentOfBaseline: pct(percentOf(lowest.status)) }),
      figure: { value: percentOf(lowest.status), unit: '% of baseline median', method: 'status' },
      link: 'surface-water/#sub-regions',
    });
  }

  const classes = input.surface.sizeClasses.filter(
    (entry) => entry.lossPercent !== null && entry.baselineLossPercent !== null && entry.status.kind === 'stated',
  );
  const worst = [...classes].sort(
    (a, b) =>
      (b.lossPercent as number) - (b.baselineLossPercent as number) - ((a.lossPercent as number) - (a.baselineLossPercent as number)),
  )[0];
  if (region.kind === 'stated' && worst && (worst.lossPercent as number) > (worst.baselineLossPercent as number)) {
    messages.push({
      id: 'size-class',
      text: t('key.sizeClass', {
        label: worst.name,
        loss: pct(worst.lossPercent as number),
        baselineLoss: pct(worst.baselineLossPercent as number),
        calendarMonth,
      }),
      figure: { value: worst.lossPercent as number, unit: '% of reference area dry', method: 'size-class-loss' },
      link: 'surface-water/#size-classes',
    });
  }

  const trends = input.bodyTrends;
  if (trends.tested > 0) {
    const params = { declining: trends.declining, shifted: trends.shiftedDown, tested: trends.tested, firstYear: input.firstYear };
    const text =
      trends.shiftedDown > 0
        ? trends.declining > 0
          ? tCount('key.trendAndShift', trends.declining, params)
          : t('key.trendNoneShift', params)
        : trends.declining > 0
          ? tCount('key.trendCount', trends.declining, params)
          : t('key.trendNone', params);
    messages.push({
      id: 'trend-count',
      text,
      figure: { value: trends.declining, unit: `water bodies of ${trends.tested} tested`, method: 'trend-bodies' },
      link: 'trends/#bodies',
    });
  }

  const regionEntry = input.regionTrend;
  const regionTrend = regionEntry?.test ?? null;
  const regionShift = regionTrend?.shift ?? null;
  const shifted = regionEntry?.direction === 'shift-down' || regionEntry?.direction === 'shift-up';
  if (regionShift && shifted) {
    const before = regionShift.beforeP === null ? 'little' : evidenceFor(regionShift.beforeP);
    messages.push({
      id: 'region-shift',
      text: t('key.regionShift', { month: formatMonth(input.locale, regionShift.month), evidence: t(`evidence.${before}`) }),
      figure: { value: regionShift.step, unit: 'percentage points of reference area, median step at the shift', method: 'trend-region' },
      link: 'trends/#region',
      evidence: before,
    });
  } else if (regionTrend && Number.isFinite(regionTrend.p)) {
    const evidence = evidenceFor(regionTrend.p);
    if (evidence === 'very-strong' || evidence === 'strong' || evidence === 'moderate') {
      const slope = `${regionTrend.slopePerYear > 0 ? '+' : '−'}${formatNumber(input.locale, Math.abs(regionTrend.slopePerYear), 1)}`;
      messages.push({
        id: 'region-trend',
        text: t('key.regionTrend', { evidence: t(`evidence.${evidence}`), slope, firstYear: input.firstYear }),
        figure: { value: regionTrend.slopePerYear, unit: 'percentage points of reference area a year', method: 'trend-region' },
        link: 'trends/#region',
        evidence,
      });
    }
  }

  const who = input.quality?.who;
  const above10 = who?.levels.find((level) => level.level === 10);
  if (who && above10 && above10.bodiesAbove > 0) {
    messages.push({
      id: 'chlorophyll',
      text: tCount('key.chlorophyll', above10.bodiesAbove, { month, above: above10.bodiesAbove, bodies: who.bodiesWithValue }),
      figure: { value: above10.bodiesAbove, unit: `water bodies of ${who.bodiesWithValue} with a value`, method: 'who-levels' },
      link: 'water-quality/#who',
    });
  }

  if (region.kind === 'stated' && region.changeFromLastYear !== null && messages.length < 6) {
    const change = region.changeFromLastYear;
    messages.push({
      id: 'last-year',
      text: t('key.lastYear', {
        points: formatNumber(input.locale, Math.abs(change), 1),
        direction: t(change < 0 ? 'direction.less' : 'direction.more'),
        lastYearMonth: formatMonth(input.locale, input.bulletinMonth - 12),
      }),
      figure: { value: change, unit: 'percentage points of reference area', method: 'status' },
      link: 'surface-water/#status',
    });
  }
  // At most six: the least telling go first (size class, then sub-region); the region, storage and health messages stay.
  for (const id of ['size-class', 'sub-region', 'trend-count']) {
    if (messages.length <= 6) break;
    const at = messages.findIndex((message) => message.id === id);
    if (at >= 0) messages.splice(at, 1);
  }
  return { messages: messages.slice(0, 6), caveats };
}

/**
 * Rule 1's range: when the estimated bodies move the regional figure (its range does not round to
 * one value), say so with the range, and name any other band the range reaches.
 */
function rangeSentences(
  region: Extract<SurfaceWater['region']['status'], { kind: 'stated' }>,
  bands: BulletinConfig['statusBands'],
  pct: (value: number) => string,
  t: (key: MessageKey, params?: Record<string, string | number>) => string,
): string[] {
  const { percentOfBaselineLow: low, percentOfBaselineHigh: high } = region.range;
  if (low === null || high === null || pct(low) === pct(high)) return [];
  const sentences = [t('key.regionRange', { estimated: pct(100 * region.estimatedShare), low: pct(low), high: pct(high) })];
  const others = [bandFor(low, bands), bandFor(high, bands)].filter((key, k, all) => key !== region.bandKey && all.indexOf(key) === k);
  for (const key of others) sentences.push(t('key.regionBandUnsure', { band: t(bandKey(key)) }));
  return sentences;
}

const percentOf = (status: SurfaceWater['region']['status']) =>
  status.kind === 'stated' ? status.percentOfBaseline : Number.POSITIVE_INFINITY;
