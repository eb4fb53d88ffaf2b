/**
 * Page views: the model's figures formatted for people (Intl numbers, plain words for states), as
 * tables and short lists that the templates only place. No figure is computed here.
 */
import { slugOf } from '../text/slug.ts';
import { parseMonth } from '../common/months.ts';
import type { GroupSurface, Status } from '../model/index.ts';
import type { BulletinModel } from '../wording/index.ts';
import { evidenceFor } from '../model/evidence.ts';
import type { TrendEntry } from '../model/trends.ts';
import { bandKey, translator, type MessageKey } from '../text/index.ts';
import { formatMonth, formatNumber, formatPercent, formatPosition } from '../text/format.ts';

/** A water body's own status has its own words for the reasons it has none (not a group's). */
const BODY_WORDS = { lowCoverage: 'view.body.lowCoverage', shortBaseline: 'view.cell.short-baseline' } as const satisfies Record<
  string,
  MessageKey
>;

export interface TableView {
  id: string;
  caption: string;
  columns: string[];
  /** The first cell of each row is its header cell. */
  rows: string[][];
  note?: string;
  /** A table the page leads with: shown open however long (others over TABLE_FOLD_ROWS rows fold). */
  lead?: true;
}

/** The page formatters of one locale: a missing or undefined figure always prints as "–". */
function formatters(locale: string) {
  const missing = (value: number | null | undefined): value is null | undefined =>
    value === null || value === undefined || !Number.isFinite(value);
  const t = translator(locale);
  const withRange = (
    format: (value: number) => string,
    value: number | null | undefined,
    low: number | null | undefined,
    high: number | null | undefined,
  ) => {
    if (missing(value)) return '–';
    const shown = format(value);
    if (missing(low) || missing(high)) return shown;
    const [from, to] = [format(low), format(high)];
    return from === to ? shown : t('view.withRange', { value: shown, low: from, high: to });
  };
  return {
    t,
    /**
     * A status in words: its band, or why none is stated. `words` names other wording for the
     * reasons (a body's own page says "not seen well enough this month" rather than a group's words).
     */
    statusWords: (status: Status | undefined, words: { lowCoverage?: MessageKey; shortBaseline?: MessageKey } = {}) =>
      status?.kind === 'stated'
        ? t(bandKey(status.bandKey))
        : status?.kind === 'low-coverage'
          ? t(words.lowCoverage ?? 'view.notStated.lowCoverage')
          : status?.kind === 'too-few-bodies'
            ? t('map.notEnough')
            : t(words.shortBaseline ?? 'view.notStated.shortBaseline'),
    pct: (value: number | null | undefined, digits = 0) => (missing(value) ? '–' : formatPercent(locale, value, digits)),
    /** A share (0–1) as a percent: the model holds shares, formatting prints them. */
    share: (value: number | null | undefined, digits = 0) => (missing(value) ? '–' : formatPercent(locale, 100 * value, digits)),
    /**
     * A percent with its range from the estimated bodies (fixed set), when estimates move it: the
     * range is left out when it rounds to the value itself.
     */
    ranged: (value: number | null | undefined, low: number | null | undefined, high: number | null | undefined, digits = 0) =>
      withRange((x) => formatPercent(locale, x, digits), value, low, high),
    /** The same for a plain number (volumes). */
    rangedNumber: (value: number | null | undefined, low: number | null | undefined, high: number | null | undefined, digits = 1) =>
      withRange((x) => formatNumber(locale, x, digits), value, low, high),
    num: (value: number | null | undefined, digits = 1) => (missing(value) ? '–' : formatNumber(locale, value, digits)),
    signed: (value: number | null | undefined, digits = 1) =>
      missing(value) ? '–' : `${value > 0 ? '+' : value < 0 ? '−' : ''}${formatNumber(locale, Math.abs(value), digits)}`,
    p: (value: number | null | undefined) =>
      missing(value) ? '–' : value < 0.001 ? `< ${formatNumber(locale, 0.001, 3)}` : formatNumber(locale, value, 3),
  };
}

type Formatters = ReturnType<typeof formatters>;

/** How long a group has been below usual, in words. */
function deficitWords(deficit: GroupSurface['deficit'], f: Formatters, locale: string): string {
  if (deficit.months === 0 || deficit.since === null) return f.t('view.deficit.none');
  return f.t(deficit.openStart ? 'view.deficit.open' : 'view.deficit.value', {
    months: deficit.months,
    since: formatMonth(locale, deficit.since),
  });
}

/** The tables of every page of an issue, by page; templates pick them by name. */
export function views(model: BulletinModel) {
  const f = formatters(model.meta.locale);
  const regionStatus = model.surfaceWater.region.status;
  const regionStated = regionStatus.kind === 'stated' ? regionStatus : null;
  const { t, pct, share, ranged, statusWords } = f;
  const locale = model.meta.locale;
  return {
    monitored: monitoredRows(model, f),
    surface: surfaceTables(model, f),
    storage: storageTable(model),
    trendTables: trendTables(model, f),
    quality: qualityTables(model, f),
    validationTables: validationTables(model, f),
    trendSummary: model.trends.bodies,
    bodyName: Object.fromEntries(model.bodies.map((body) => [body.id, body.name])),
    figures: {
      percentOfBaseline: ranged(
        regionStated?.percentOfBaseline,
        regionStated?.range.percentOfBaselineLow,
        regionStated?.range.percentOfBaselineHigh,
      ),
      band: statusWords(regionStatus),
      coverage: share(regionStatus.coverageShare),
      seen: share(model.seenShare, 1),
      declines: t('view.countOf', { count: model.trends.bodies.declining, total: model.trends.bodies.tested }),
      shifted: t('view.countOf', { count: model.trends.bodies.shiftedDown, total: model.trends.bodies.tested }),
      deficit: deficitWords(model.surfaceWater.region.deficit, f, locale),
      unstated: t('view.unstated.value', {
        count: model.bodyStatus.filter((own) => own.kind !== 'stated').length,
        total: model.bodyStatus.length,
        lowCoverage: model.bodyStatus.filter((own) => own.kind === 'low-coverage').length,
        shortBaseline: model.bodyStatus.filter((own) => own.kind === 'short-baseline').length,
      }),
      minObservedShare: pct(100 * model.meta.minObservedShare),
      firstMonthName: formatMonth(locale, parseMonth(model.meta.firstMonth) as number),
      falseDiscoveryRate: formatNumber(locale, model.trends.bodies.falseDiscoveryRate, 2),
      /** Some warning has no sentence in this language and keeps the input check's English. */
      warningsInEnglish: model.warnings.some((warning) => warning.lang !== locale),
      minRegionCoverage: pct(100 * model.meta.minRegionCoverage),
    },
  };
}

/** The surface-water page: the region's status, the sub-regions, the size classes and the grid. */
function surfaceTables(model: BulletinModel, f: Formatters) {
  const locale = model.meta.locale;
  const { t, pct, share, ranged, signed, statusWords } = f;
  const cellsOf = (kind: Status['kind']) => model.grid.cells.filter((cell) => cell.status.kind === kind).length;
  // One decimal at most: a baseline of 10 to 30 years supports no more. Below 10 years there is none (STANDARDIZED_MIN_YEARS).
  // `value` undefined: no figure at all ('–'); null: a figure, but too few baseline years for this one.
  const standardizedText = (value: number | null | undefined) =>
    value === undefined ? '–' : value === null ? t('view.standardizedNone') : signed(value, 1);
  // The rank among the baseline years, in words that hold at any baseline length.
  const rankWords = (rank: { lower: number; higher: number; of: number }) =>
    rank.lower === 0
      ? t('view.rank.lowest', { of: rank.of, calendarMonth: model.meta.calendarMonthName })
      : rank.higher === 0
        ? t('view.rank.highest', { of: rank.of, calendarMonth: model.meta.calendarMonthName })
        : t('view.rank.between', { lower: rank.lower, of: rank.of, calendarMonth: model.meta.calendarMonthName });
  const statusRow = (name: string, group: GroupSurface) => {
    const s = group.status;
    const stated = s.kind === 'stated' ? s : null;
    return [
      name,
      String(group.bodies),
      pct(s.kind === 'low-coverage' ? null : s.fillingPercent),
      pct(stated?.baseline.median),
      ranged(stated?.percentOfBaseline, stated?.range.percentOfBaselineLow, stated?.range.percentOfBaselineHigh),
      standardizedText(stated?.standardized),
      stated ? rankWords(stated.rank) : '–',
      statusWords(s),
      share(s.coverageShare),
    ];
  };
  const statusColumns = [
    t('view.area'),
    t('ui.bodies'),
    t('view.water'),
    t('view.baselineMedian'),
    t('ui.percentOfUsual'),
    t('view.standardized'),
    t('view.rank'),
    t('ui.status'),
    t('view.seen'),
  ];

  const sw = model.surfaceWater;
  const regionStatus = sw.region.status;
  const regionStated = regionStatus.kind === 'stated' ? regionStatus : null;
  const [status, subRegions, sizeClasses, grid]: [TableView, TableView, TableView, TableView] = [
    {
      id: 'status',
      lead: true,
      caption: t('view.status.caption', {
        month: model.meta.monthName,
        calendarMonth: model.meta.calendarMonthName,
        baselineFirst: model.meta.baseline.firstYear,
        baselineLast: model.meta.baseline.lastYear,
      }),
      columns: [t('ui.figure'), t('ui.value')],
      rows: [
        [
          t('view.water'),
          regionStatus.kind === 'low-coverage'
            ? '–'
            : ranged(regionStatus.fillingPercent, regionStatus.range.low, regionStatus.range.high, 1),
        ],
        [t('view.baselineMedian'), pct(regionStated?.baseline.median, 1)],
        [
          t(regionStated?.baseline.envelope.kind === 'range' ? 'view.baselineRange' : 'view.baselineEnvelope'),
          regionStated ? `${pct(regionStated.baseline.envelope.low, 1)} – ${pct(regionStated.baseline.envelope.high, 1)}` : '–',
        ],
        [t('view.difference'), signed(regionStated?.anomalyPoints)],
        [
          t('view.percentOfMedian'),
          ranged(regionStated?.percentOfBaseline, regionStated?.range.percentOfBaselineLow, regionStated?.range.percentOfBaselineHigh),
        ],
        [t('view.standardized'), standardizedText(regionStated?.standardized)],
        [t('view.rankBaseline'), regionStated ? rankWords(regionStated.rank) : '–'],
        [t('ui.status'), statusWords(regionStatus)],
        [
          t('view.changeFrom', { month: formatMonth(locale, (parseMonth(model.meta.month) as number) - 12) }),
          signed(regionStated?.changeFromLastYear),
        ],
        [
          t('view.changeFrom', { month: formatMonth(locale, (parseMonth(model.meta.month) as number) - 1) }),
          signed(regionStated?.changeFromPreviousMonth),
        ],
        [t('view.seen'), share(regionStatus.coverageShare)],
        [t('view.filled'), share(regionStated?.filledShare)],
        [t('view.estimated'), share(regionStatus.kind === 'low-coverage' ? null : regionStatus.estimatedShare)],
      ],
    },
    {
      id: 'sub-regions',
      caption: t('view.subRegions.caption', { month: model.meta.monthName }),
      columns: statusColumns,
      rows: sw.subRegions.map((group) => statusRow(group.name, group)),
    },
    {
      id: 'size-classes',
      caption: t('view.sizeClasses.caption', { month: model.meta.monthName }),
      columns: [
        t('view.sizeClass'),
        t('ui.bodies'),
        t('view.dryShare'),
        t('view.dryShareUsual', { calendarMonth: model.meta.calendarMonthName }),
        t('ui.status'),
      ],
      rows: sw.sizeClasses.map((entry) => [
        entry.name,
        String(entry.bodies),
        // The dry share's range is the filling's, turned round (100 − high … 100 − low).
        entry.status.kind === 'low-coverage' ? '–' : ranged(entry.lossPercent, 100 - entry.status.range.high, 100 - entry.status.range.low),
        pct(entry.baselineLossPercent),
        statusWords(entry.status),
      ]),
    },
    {
      id: 'grid',
      caption: t('view.grid.caption', { degrees: formatNumber(locale, model.grid.cellDegrees, 2), month: model.meta.monthName }),
      columns: [t('view.grid.cell'), t('ui.bodies'), t('view.water'), t('view.baselineMean'), t('ui.percentOfUsual'), t('ui.status')],
      // Only the cells with a figure: the others are counted in the note (and listed in the map's own data table).
      rows: model.grid.cells.flatMap(({ south, west, bodies, status: cell }) =>
        cell.kind === 'stated'
          ? [
              [
                formatPosition(locale, south, west, 2),
                String(bodies),
                pct(cell.fillingPercent),
                pct(cell.baseline.mean),
                pct(cell.percentOfBaseline),
                t(bandKey(cell.bandKey)),
              ],
            ]
          : [],
      ),
      note: t('view.grid.noteCounts', {
        minBodies: model.grid.minBodies,
        stated: cellsOf('stated'),
        total: model.grid.cells.length,
        tooFew: cellsOf('too-few-bodies'),
        lowCoverage: cellsOf('low-coverage'),
        shortBaseline: cellsOf('short-baseline'),
      }),
    },
  ];
  return { status, subRegions, sizeClasses, grid };
}

/** The trends page: the region, the sub-regions, the steepest declines and rises. */
function trendTables(model: BulletinModel, f: Formatters): TableView[] {
  const locale = model.meta.locale;
  const { t, signed, p } = f;
  const trendRow = (entry: TrendEntry): string[] => [
    entry.name,
    entry.test ? t(`view.test.${entry.test.method}`) : t('view.notTested'),
    signed(entry.test?.slopePerYear, 2),
    p(entry.test?.p),
    p(entry.pAdjusted),
    // A one-step change says when: the change point of each body and sub-region.
    (entry.direction === 'shift-down' || entry.direction === 'shift-up') && entry.test?.shift
      ? t('view.direction.shiftAt', {
          direction: t(`view.direction.${entry.direction}`),
          month: formatMonth(locale, entry.test.shift.month),
        })
      : t(`view.direction.${entry.direction}`),
  ];
  const trendColumns = [t('ui.body'), t('view.test'), t('view.trendPoints'), 'p', t('view.adjustedP'), t('view.afterAdjustment')];
  const tested = model.trends.bodies.entries.filter((entry) => entry.test);
  const declines = tested
    .filter((entry) => (entry.test?.slopePerYear ?? 0) < 0)
    .sort((a, b) => (a.test?.slopePerYear ?? 0) - (b.test?.slopePerYear ?? 0))
    .slice(0, 10);
  const rises = tested
    .filter((entry) => (entry.test?.slopePerYear ?? 0) > 0)
    .sort((a, b) => (b.test?.slopePerYear ?? 0) - (a.test?.slopePerYear ?? 0))
    .slice(0, 10);
  const regionTrend = model.trends.region.entries[0];
  const change = model.trends.changePoint;
  return [
    {
      id: 'region',
      caption: t('view.trends.region'),
      columns: trendColumns,
      rows: regionTrend ? [trendRow(regionTrend)] : [],
      note:
        change.month !== null
          ? t('view.trends.changePoint', {
              month: formatMonth(locale, change.month),
              points: signed((change.meanAfter ?? 0) - (change.meanBefore ?? 0)),
              p: p(change.p),
            })
          : t('view.trends.noChangePoint'),
    },
    {
      id: 'sub-region-trends',
      caption: t('ui.surface.subRegions'),
      columns: trendColumns,
      rows: model.trends.subRegions.entries.map(trendRow),
    },
    { id: 'declines', caption: t('view.trends.declines'), columns: trendColumns, rows: declines.map(trendRow) },
    { id: 'rises', caption: t('view.trends.rises'), columns: trendColumns, rows: rises.map(trendRow) },
  ];
}

/**
 * The water-quality page: each parameter's size classes by parameter, then the trophic classes,
 * the WHO levels and the seasonal trends; null without quality data.
 */
function qualityTables(
  model: BulletinModel,
  f: Formatters,
): { byParameter: Record<string, TableView>; others: TableView[]; turbidityUnitNote: string } | null {
  const { t, pct, num, signed, p } = f;
  const quality = model.quality;
  const qualityTables: TableView[] = [];
  if (!quality) return null;
  {
    for (const parameter of quality.parameters) {
      const name = t(`parameter.${parameter.parameter}`);
      const last = parameter.monthly[parameter.monthly.length - 1];
      qualityTables.push({
        id: `${parameter.parameter}-classes`,
        caption: t('view.quality.caption', { name, unit: parameter.unit, month: model.meta.monthName }),
        columns: [t('view.sizeClass'), t('ui.bodies'), t('view.p10'), t('view.p25'), t('view.p50'), t('view.p75'), t('view.p90')],
        rows: parameter.bySizeClass.map((entry) => [
          entry.label,
          String(entry.bodies),
          num(entry.p10),
          num(entry.p25),
          num(entry.p50),
          num(entry.p75),
          num(entry.p90),
        ]),
        note: t('view.quality.note', {
          median: num(last?.median ?? null),
          weighted: num(last?.weightedMedian ?? null),
          unit: parameter.unit,
          rising: parameter.trends.rising,
          tested: parameter.trends.tested,
          falling: parameter.trends.declining,
          fewPixels: parameter.fewPixelsThisMonth,
          minPixels: model.meta.minValidPixels,
        }),
      });
    }
    qualityTables.push({
      id: 'trophic',
      caption: t('view.trophic.caption', { year: quality.trophic.year, minMonths: quality.trophic.minMonths }),
      columns: [t('view.trophic.class'), t('view.trophic.upTo'), t('ui.bodies')],
      rows: quality.trophic.counts.map((entry) => [
        t(`trophic.${entry.trophicClass}`),
        entry.upperBound === null ? t('view.trophic.above', { value: num(25, 0) }) : `${num(entry.upperBound, 1)} µg/L`,
        String(entry.bodies),
      ]),
    });
    qualityTables.push({
      id: 'who',
      caption: t('view.who.caption', { month: model.meta.monthName }),
      columns: [t('view.who.level'), t('view.who.above'), t('view.who.share')],
      rows: quality.who.levels.map((level) => [
        `${level.level} µg/L`,
        t('view.countOf', { count: level.bodiesAbove, total: quality.who.bodiesWithValue }),
        pct(level.sharePercent),
      ]),
    });
    const seasonal = quality.parameters.flatMap((parameter) =>
      parameter.seasonal.map((entry) => ({ ...entry, parameter: t(`parameter.${parameter.parameter}`), unit: parameter.unit })),
    );
    if (seasonal.length > 0) {
      qualityTables.push({
        id: 'seasonal-trends',
        caption: t('view.seasonal.caption'),
        columns: [t('view.seasonal.row'), t('view.years'), t('view.trendYear'), 'p', t('view.adjustedP'), t('view.evidence')],
        rows: seasonal.map((entry) => [
          t('view.seasonal.rowValue', { parameter: entry.parameter, season: entry.seasonName, sizeClass: entry.sizeClass }),
          String(entry.years),
          entry.slopePerYear === null ? '–' : `${signed(entry.slopePerYear, 2)} ${entry.unit}`,
          p(entry.p),
          p(entry.pAdjusted),
          // The words follow the adjusted p: the family is every seasonal class of the parameter.
          entry.pAdjusted === null ? '–' : t(`evidence.${evidenceFor(entry.pAdjusted)}`),
        ]),
        note: t('view.seasonal.note'),
      });
    }
  }
  const byParameter = Object.fromEntries(quality.parameters.map((parameter, k) => [parameter.parameter, qualityTables[k] as TableView]));
  // NTU and FNU are not interchangeable: the page says which one the figures are in.
  const turbidity = quality.parameters.find((parameter) => parameter.parameter === 'turbidity');
  const turbidityUnitNote = turbidity ? t('view.quality.turbidityUnit', { unit: turbidity.unit }) : '';
  return { byParameter, others: qualityTables.slice(quality.parameters.length), turbidityUnitNote };
}

/** The field checks of the water-quality page. */
function validationTables(model: BulletinModel, f: Formatters): TableView[] {
  const { t, num, signed, pct } = f;
  return model.validation.length === 0
    ? []
    : [
        {
          id: 'validation',
          caption: t('view.validation.caption'),
          columns: [
            t('view.validation.parameter'),
            t('view.validation.pairs'),
            t('view.validation.bias'),
            t('view.validation.mae'),
            'RMSE',
            'R²',
            t('view.validation.line'),
            t('view.validation.mdsa'),
            t('view.validation.sspb'),
            t('view.validation.r2log'),
          ],
          rows: model.validation.map((entry) => [
            `${t(`parameter.${entry.parameter}`)} (${entry.unit})`,
            String(entry.agreement.n),
            signed(entry.agreement.bias, 2),
            num(entry.agreement.meanAbsoluteError, 2),
            num(entry.agreement.rootMeanSquareError, 2),
            num(entry.agreement.rSquared, 2),
            `a = ${num(entry.agreement.intercept, 2)}, b = ${num(entry.agreement.slope, 2)}`,
            pct(entry.logAgreement.medianSymmetricAccuracy),
            `${(entry.logAgreement.symmetricSignedBias ?? 0) > 0 ? '+' : ''}${pct(entry.logAgreement.symmetricSignedBias)}`,
            num(entry.logAgreement.rSquaredLog10, 2),
          ]),
          note: t('view.validation.note', { days: model.validation[0]?.windowDays ?? 0 }),
        },
      ];
}

/** The monitored water bodies of the surface-water page. */
function monitoredRows(model: BulletinModel, f: Formatters) {
  const { t, pct, signed, statusWords } = f;
  return model.monitored.map((entry) => {
    const status = model.bodyStatus[entry.body];
    const last = [...entry.filling].reverse().find((value) => value !== null) ?? null;
    return {
      id: entry.id,
      name: entry.name,
      last: pct(last),
      status: statusWords(status, BODY_WORDS),
      trend:
        entry.slopePerYear === null
          ? t('view.notTested')
          : t('view.monitored.trend', { slope: signed(entry.slopePerYear, 2), direction: t(`view.direction.${entry.direction}`) }),
    };
  });
}

export interface BodyListPage<T> {
  number: number;
  /** Site path of the page, with trailing slash. */
  href: string;
  first: number;
  last: number;
  bodies: T[];
}

/** Pages of at most `size` items: the first at `base`, the others at base + page-N/. */
export function paginate<T>(items: T[], base: string, size: number): Array<BodyListPage<T>> {
  const pages: Array<BodyListPage<T>> = [];
  for (let from = 0; from < items.length; from += size) {
    const number = pages.length + 1;
    pages.push({
      number,
      href: number === 1 ? base : `${base}page-${number}/`,
      first: from + 1,
      last: Math.min(items.length, from + size),
      bodies: items.slice(from, from + size),
    });
  }
  return pages;
}

/** One sub-region's page: its status, trend, water bodies and rainfall, formatted. */
export function subRegionView(model: BulletinModel, id: string) {
  const locale = model.meta.locale;
  const f = formatters(locale);
  const { t, pct, share, ranged, statusWords } = f;
  const group = model.surfaceWater.subRegions.find((entry) => entry.id === id);
  const trend = model.trends.subRegions.entries.find((entry) => entry.id === id);
  const rain = model.rainfall?.subRegions.find((entry) => entry.id === id);
  const status = group?.status;
  const bodies = model.bodies
    .map((body, k) => ({ body, k }))
    .filter(({ body }) => body.subRegionId === id)
    .map(({ body, k }) => {
      const own = model.bodyStatus[k];
      return {
        id: body.id,
        name: body.name,
        kind: body.kind,
        area: formatNumber(locale, body.referenceHa, 1),
        status: statusWords(own, BODY_WORDS),
        percent: pct(own?.kind === 'stated' ? own.percentOfBaseline : null),
        href: body.ownPage ? `${model.meta.issuePath}water-bodies/${slugOf(body.id)}/` : null,
      };
    });
  const slug = slugOf(id);
  // Up to site.bodiesPerListPage bodies are listed on the sub-region's page and the index; more get numbered pages.
  const perPage = model.meta.bodiesPerListPage;
  const listPages = bodies.length > perPage ? paginate(bodies, `${model.meta.issuePath}sub-regions/${slug}/water-bodies/`, perPage) : [];
  return {
    id,
    slug,
    name: group?.name ?? id,
    bodies: listPages.length > 0 ? [] : bodies,
    bodyCount: bodies.length,
    listPages,
    summary: [
      [t('ui.bodies'), String(group?.bodies ?? 0)],
      [t('view.referenceArea'), `${formatNumber(locale, group?.referenceHa ?? 0, 0)} ha`],
      [t('view.water'), pct(status && status.kind !== 'low-coverage' ? status.fillingPercent : null)],
      [
        t('ui.percentOfUsual'),
        status?.kind === 'stated'
          ? ranged(status.percentOfBaseline, status.range.percentOfBaselineLow, status.range.percentOfBaselineHigh)
          : '–',
      ],
      [t('ui.status'), statusWords(status)],
      [t('ui.overview.deficit'), group ? deficitWords(group.deficit, f, locale) : '–'],
      [t('view.seen'), share(status?.coverageShare)],
      [t('view.estimated'), share(status && status.kind !== 'low-coverage' ? status.estimatedShare : null)],
      [t('view.trendSinceFirst'), trend?.test ? formatNumber(locale, trend.test.slopePerYear, 2) : t('view.notTested')],
      [t('view.trendAdjusted'), trend ? t(`view.direction.${trend.direction}`) : t('view.notTested')],
      [
        t('view.rainfallIn', { month: model.meta.monthName }),
        rain?.bulletinMonthMm === null || rain?.bulletinMonthMm === undefined
          ? '–'
          : t('view.rainfall', { mm: formatNumber(locale, rain.bulletinMonthMm, 0), percent: pct(rain.percentOfBaseline) }),
      ],
    ],
  };
}

/** A reservoir's level and stored volume in the bulletin month, when it has a survey curve. */
function storageRows(model: BulletinModel, index: number, locale: string): string[][] {
  const own = model.storage?.bodies.find((entry) => entry.body === index);
  if (!own) return [];
  const { t, pct, num } = formatters(locale);
  const mark = (text: string) => (own.clamped && text !== '–' ? t('view.storage.clamped', { value: text }) : text);
  return [
    [t('view.storage.level'), own.source === 'fit' ? t('view.storage.noLevel') : mark(num(own.levelM, 2))],
    [t('view.storage.volume'), mark(num(own.volumeHm3, 2))],
    [t('view.storage.capacity'), num(own.capacityHm3, 2)],
    [t('view.storage.percentOfCapacity'), mark(pct(own.percentOfCapacity))],
  ];
}

/** The surface-water page's storage table (region and sub-regions); null without survey curves. */
export function storageTable(model: BulletinModel): TableView | null {
  const storage = model.storage;
  if (!storage) return null;
  const locale = model.meta.locale;
  const { t, share, num, ranged, rangedNumber, statusWords } = formatters(locale);
  const row = (group: NonNullable<BulletinModel['storage']>['region']) => {
    const status = group.status;
    const stated = status?.kind === 'stated' ? status : null;
    return [
      group.name,
      t('view.countOf', { count: group.bodiesWithCurve, total: group.bodies }),
      // One decimal: a share just under the minimum must not print as the minimum itself.
      share(group.curveShare, 1),
      num(group.capacityHm3, 1),
      rangedNumber(group.volumeHm3, group.volumeRangeHm3?.low, group.volumeRangeHm3?.high),
      status && status.kind !== 'low-coverage' ? ranged(status.fillingPercent, status.range.low, status.range.high) : '–',
      ranged(stated?.percentOfBaseline, stated?.range.percentOfBaselineLow, stated?.range.percentOfBaselineHigh),
      status ? statusWords(status) : t('view.storage.tooFewCurves'),
      share(status?.coverageShare),
    ];
  };
  return {
    id: 'storage',
    caption: t('view.storage.caption', { month: model.meta.monthName }),
    columns: [
      t('view.area'),
      t('view.storage.curves'),
      t('view.storage.curveShare'),
      t('view.storage.capacity'),
      t('view.storage.volume'),
      t('view.storage.percentOfCapacity'),
      t('ui.percentOfUsual'),
      t('ui.status'),
      t('view.seen'),
    ],
    rows: [row(storage.region), ...storage.subRegions.map(row)],
    note: t('view.storage.note', { minShare: share(storage.minCurveShare) }),
  };
}

/** One monitored water body's page, formatted. */
export function bodyView(model: BulletinModel, index: number) {
  const locale = model.meta.locale;
  const { t, pct, statusWords } = formatters(locale);
  const body = model.bodies[index] as BulletinModel['bodies'][number];
  const own = model.bodyStatus[index];
  const monitored = model.monitored.find((entry) => entry.body === index);
  const trophic = model.quality?.trophic.bodies.find((entry) => entry.id === body.id);
  const subRegion = model.boundaries.find((entry) => entry.id === body.subRegionId);
  return {
    id: body.id,
    slug: slugOf(body.id),
    name: body.name,
    subRegion: { name: subRegion?.name ?? body.subRegionId, href: `${model.meta.issuePath}sub-regions/${slugOf(body.subRegionId)}/` },
    summary: [
      [t('ui.kind'), body.kind],
      [t('view.referenceArea'), `${formatNumber(locale, body.referenceHa, 1)} ha`],
      [t('view.location'), formatPosition(locale, body.lat, body.lon, 3)],
      [t('ui.percentOfUsual'), pct(own?.kind === 'stated' ? own.percentOfBaseline : null)],
      [t('ui.status'), statusWords(own, { ...BODY_WORDS, lowCoverage: 'view.body.lowCoverageMonth' })],
      ...storageRows(model, index, locale),
      [
        t('view.trendSinceFirst'),
        monitored?.slopePerYear === null || monitored?.slopePerYear === undefined
          ? t('view.notTested')
          : formatNumber(locale, monitored.slopePerYear, 2),
      ],
      [t('view.trendAdjusted'), t(`view.direction.${monitored?.direction ?? 'untested'}`)],
      [
        t('view.chlorophyllNow'),
        trophic?.chlorophyll !== null && trophic?.chlorophyll !== undefined && trophic.carlsonClass
          ? t('view.chlorophyllValue', {
              value: formatNumber(locale, trophic.chlorophyll, 1),
              index: formatNumber(locale, trophic.index ?? Number.NaN, 0),
              carlsonClass: t(`carlson.${trophic.carlsonClass}`),
            })
          : t('view.noEstimate'),
      ],
      [
        t('view.oecdYear', { year: model.quality?.trophic.year ?? '–' }),
        trophic?.trophicClass && trophic.annualMean !== null
          ? t('view.oecdValue', {
              trophicClass: t(`trophic.${trophic.trophicClass}`),
              mean: formatNumber(locale, trophic.annualMean, 1),
              months: trophic.annualMonths,
            })
          : t('view.oecdNone', { minMonths: model.quality?.trophic.minMonths ?? 0 }),
      ],
    ],
  };
}

export { slugOf } from '../text/slug.ts';

/** The months earlier issues printed with another value (model.revised), as the data page's table; null when none. */
export function revisedFigures(model: BulletinModel): TableView | null {
  const { t, pct } = formatters(model.meta.locale);
  if (model.revised.length === 0) return null;
  return {
    id: 'revised',
    caption: t('view.revised.caption'),
    columns: [t('view.revised.figure'), t('chart.month'), t('view.revised.printedIn'), t('view.revised.printed'), t('view.revised.now')],
    // The region's months first, then each sub-region's and size class's, in the order found.
    rows: [
      ...model.revised.filter((entry) => entry.figure.kind === 'region'),
      ...model.revised.filter((entry) => entry.figure.kind !== 'region'),
    ].map((entry) => [
      entry.figure.kind === 'region' ? model.meta.region : entry.figure.name,
      entry.issueMonthName,
      t('view.revised.issue', { month: entry.issueMonthName, revision: entry.revision }),
      pct(entry.printedPercent, 1),
      pct(entry.nowPercent, 1),
    ]),
    note: t('view.revised.note'),
  };
}

/** Largest water bodies whose change of status the overview lists (besides the region and the sub-regions). */
export const CHANGES_LARGEST_BODIES = 10;

/**
 * What changed since the previous issue of the same language: the status of the region, of each
 * sub-region and of the CHANGES_LARGEST_BODIES largest water bodies, where it differs (the band, or
 * a figure stated in one issue and not the other). Null when there is no previous issue.
 */
export function changesSince(model: BulletinModel, previous: BulletinModel | null) {
  if (!previous) return null;
  const { statusWords } = formatters(model.meta.locale);
  const rows: Array<{ name: string; href: string | null; from: string; to: string }> = [];
  const push = (name: string, href: string | null, from: string, to: string) => {
    if (from !== to) rows.push({ name, href, from, to });
  };
  push(
    model.meta.region,
    `${model.meta.issuePath}surface-water/#status`,
    statusWords(previous.surfaceWater.region.status),
    statusWords(model.surfaceWater.region.status),
  );
  for (const group of model.surfaceWater.subRegions) {
    const before = previous.surfaceWater.subRegions.find((entry) => entry.id === group.id);
    if (before)
      push(group.name, `${model.meta.issuePath}sub-regions/${slugOf(group.id)}/`, statusWords(before.status), statusWords(group.status));
  }
  const largest = model.bodies
    .map((body, k) => ({ body, k }))
    .sort((a, b) => b.body.referenceHa - a.body.referenceHa || a.k - b.k)
    .slice(0, CHANGES_LARGEST_BODIES);
  const previousIndex = new Map(previous.bodies.map((body, k) => [body.id, k]));
  const paged = new Set(model.monitored.map((entry) => entry.id));
  for (const { body, k } of largest) {
    const before = previousIndex.get(body.id);
    if (before === undefined) continue;
    push(
      body.name,
      paged.has(body.id) ? `${model.meta.issuePath}water-bodies/${slugOf(body.id)}/` : null,
      statusWords(previous.bodyStatus[before], BODY_WORDS),
      statusWords(model.bodyStatus[k], BODY_WORDS),
    );
  }
  return { month: previous.meta.monthName, href: previous.meta.issuePath, rows };
}
