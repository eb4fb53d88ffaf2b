/**
 * Stage 4, wording: turns an issue's figures (src/model/) and one locale into the bulletin model:
 * the figures, by reference, with every sentence, name, date and number of that language beside
 * them: key messages, notices, method texts, warnings, size-class and season names. The model is
 * written out as JSON beside the site, one per language; charts and pages read it.
 */
import { statusColours } from '../common/statusColours.ts';
import type { BulletinInputs, InputFile, Problem } from '../ingest/index.ts';
import { calendarMonthOf, monthLabel } from '../common/months.ts';
import { translator, withWording } from '../text/index.ts';
import { formatCalendarMonth, formatDate, formatMonth, formatPercent } from '../text/format.ts';
import { issueFigures, type IssueFigures, type PreparedModel } from '../model/index.ts';
import { methodTexts, type MethodId } from '../model/methods.ts';
import { wordQuality, type Quality } from '../model/quality.ts';
import { wordSurface, type SurfaceWater } from '../model/surfaceWater.ts';
import { usualFrom } from '../model/deficit.ts';
import { keyMessages, type KeyMessage } from './keyMessages.ts';
import { warningText, type ShownWarning } from './warnings.ts';
import { cautionTexts, waterBodiesKey, waterBodiesWord } from './region.ts';

export type { KeyMessage } from './keyMessages.ts';
export type { Status, GroupMonth, SurfaceWater, GroupSurface, SizeClassSurface } from '../model/index.ts';

export interface Notice {
  kind: 'notice' | 'caveat' | 'caution';
  text: string;
}

/** A month an earlier issue printed with another value than this issue gives (wording/revisions.ts). */
export interface PrintedEarlier {
  /** Whose figure: the region, a sub-region or a size class (by id; a size class also by its bounds), with its name. */
  figure: { kind: 'region' | 'sub-region' | 'size-class'; id: string; name: string };
  /** The month the figure is for, `YYYY-MM`. */
  month: string;
  /** Share of the reference area covered by water, in percent, as the earlier issue printed it. */
  printedPercent: number;
  /** The same figure in this issue. */
  nowPercent: number;
  /** The earlier issue (the issue of that month): its month's name and its last revision. */
  issueMonthName: string;
  revision: number;
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
    /** Correction notes in the model's language where the configuration gives one; `lang` says which. */
    corrections: Array<{ date: string; dateName: string; text: string; lang: string }>;
    baseline: { firstYear: number; lastYear: number; minYears: number };
    minObservedShare: number;
    minRegionCoverage: number;
    maxFilledGap: number;
    /** quality.minValidPixels. */
    minValidPixels: number;
    firstMonth: string;
    toolVersion: string;
    /** The configured status band keys, lowest first. */
    statusBands: string[];
    /** One colour per band (configured, or the default palette, common/statusColours.ts). */
    statusColours: string[];
    /** Percent of the baseline median below which a figure is "below usual" (the lower edge of the band holding 100 %). */
    usualFromPercent: number;
    /** site.bodiesPerListPage. */
    bodiesPerListPage: number;
    /** site.accentColour, or null for the tool's own. */
    accentColour: string | null;
  };
  bodies: IssueFigures['bodies'];
  surfaceWater: SurfaceWater;
  bodyStatus: IssueFigures['bodyStatus'];
  monitored: IssueFigures['monitored'];
  grid: IssueFigures['grid'];
  trends: IssueFigures['trends'];
  quality: Quality | null;
  rainfall: IssueFigures['rainfall'];
  boundaries: IssueFigures['boundaries'];
  validation: IssueFigures['validation'];
  storage: IssueFigures['storage'];
  seenShare: IssueFigures['seenShare'];
  keyMessages: KeyMessage[];
  /** The sentence the overview leads with: the first key message, or the caveat that replaces it. */
  headline: string;
  notices: Notice[];
  /** The health cautions in this language, naming the configured authorities (wording in bulletin.json). */
  cautions: { algae: string; lowWater: string };
  methods: Record<MethodId, string>;
  /** The input check's warnings, worded in the model's language where the catalogue can. */
  warnings: ShownWarning[];
  inputs: InputFile[];
  /** Months an earlier issue printed with another value (wording/revisions.ts); set by the build once every issue is worded. */
  revised: PrintedEarlier[];
}

/** Warnings about the inputs' columns: on the data page only with tables.columnWarningsOnDataPage. */
const COLUMN_WARNINGS: ReadonlySet<string> = new Set(['column-unknown']);

export interface WordingOptions {
  /** Site path of the issue; by default /issues/YYYY-MM/. Earlier revisions live below it. */
  issuePath?: string;
  /** Language of the words; by default the first configured locale. */
  locale?: string;
}

export interface ModelOptions extends WordingOptions {
  /** The body series and their trend tests when computed beforehand (prepareModel, on worker threads). */
  prepared?: PreparedModel;
}

/** Figures and words in one step: issueFigures, then wordModel (one language). */
export function buildModel(inputs: BulletinInputs, warnings: Problem[], toolVersion: string, options: ModelOptions = {}): BulletinModel {
  return wordModel(inputs, issueFigures(inputs, options.prepared), warnings, toolVersion, options);
}

/**
 * The bulletin model of one language from the issue's figures (shared by reference, not copied),
 * in the tool's words with the issue folder's own wording over them (inputs.wording).
 */
export function wordModel(
  inputs: BulletinInputs,
  figures: IssueFigures,
  warnings: Problem[],
  toolVersion: string,
  options: WordingOptions = {},
): BulletinModel {
  return withWording(inputs.wording, () => wordModelInScope(inputs, figures, warnings, toolVersion, options));
}

function wordModelInScope(
  inputs: BulletinInputs,
  figures: IssueFigures,
  warnings: Problem[],
  toolVersion: string,
  options: WordingOptions,
): BulletinModel {
  const { config, bulletinMonth } = inputs;
  const locale = options.locale ?? config.locales[0] ?? 'en';
  const t = translator(locale);
  const pct = (value: number) => formatPercent(locale, value);

  const surface = wordSurface(figures.surface, locale);
  const waterQuality = wordQuality(figures.quality, config, locale);
  const cautions = cautionTexts(config.wording, locale, t);
  const key = keyMessages({
    waterBodies: t(waterBodiesKey(waterBodiesWord(config.wording.waterBodies, inputs.bodies))),
    locale,
    bulletinMonth,
    firstYear: Math.floor(figures.firstMonth / 12),
    surface,
    bodyTrends: figures.trends.bodies,
    regionTrend: figures.trends.region.entries[0] ?? null,
    quality: waterQuality,
    statusBands: config.statusBands,
    storage: figures.storage,
  });

  const monthName = formatMonth(locale, bulletinMonth);
  const calendarMonthName = formatCalendarMonth(locale, calendarMonthOf(bulletinMonth));
  const baselineParams = { baselineFirst: config.baseline.firstYear, baselineLast: config.baseline.lastYear };
  const notices: Notice[] = key.caveats.map((text) => ({ kind: 'notice' as const, text }));
  // The bulletin month is provisional: late scenes and reprocessing can change it; later issues list any change.
  notices.push({ kind: 'notice', text: t('notice.provisional', { month: monthName }) });
  if (figures.pages.flagged > figures.pages.shown)
    notices.push({ kind: 'notice', text: t('notice.pageCap', { flagged: figures.pages.flagged, shown: figures.pages.shown }) });
  const region = surface.region.status;
  if (region.kind === 'stated' && region.filledShare >= 0.01)
    notices.push({ kind: 'caveat', text: t('caveat.filled', { filled: pct(100 * region.filledShare) }) });
  if (region.kind !== 'low-coverage' && region.estimatedShare >= 0.01)
    notices.push({ kind: 'caveat', text: t('caveat.estimated', { month: monthName, estimated: pct(100 * region.estimatedShare) }) });
  if (figures.storage) notices.push({ kind: 'caveat', text: t('caveat.storage') });
  notices.push({ kind: 'caveat', text: t('caveat.baseline', baselineParams) });
  const baselineYears = config.baseline.lastYear - config.baseline.firstYear + 1;
  if (baselineYears < 10) notices.push({ kind: 'caveat', text: t('caveat.shortBaseline', { years: baselineYears, ...baselineParams }) });
  notices.push({ kind: 'caveat', text: t('caveat.optical', { minShare: pct(100 * config.coverage.minObservedShare) }) });
  if (waterQuality) notices.push({ kind: 'caveat', text: t('caveat.estimate') });
  if (region.kind === 'stated' && region.percentOfBaseline < 90) notices.push({ kind: 'caution', text: cautions.lowWater });
  if (waterQuality) notices.push({ kind: 'caution', text: cautions.algae });

  return {
    meta: {
      title: config.title,
      publisher: config.publisher,
      region: config.region.name,
      locale,
      month: monthLabel(bulletinMonth),
      monthName,
      calendarMonthName,
      revision: config.issue.revision,
      published: config.issue.published,
      publishedName: formatDate(locale, config.issue.published),
      draft: config.issue.draft,
      baseUrl: config.site.baseUrl,
      issuePath: options.issuePath ?? `/issues/${monthLabel(bulletinMonth)}/`,
      corrections: config.issue.corrections.map(({ date, text, translations }) => {
        const translated = translations?.[locale as keyof typeof translations];
        return {
          date,
          dateName: formatDate(locale, date),
          text: translated ?? text,
          lang: translated === undefined ? (config.locales[0] ?? locale) : locale,
        };
      }),
      baseline: config.baseline,
      minObservedShare: config.coverage.minObservedShare,
      minRegionCoverage: config.coverage.minRegionCoverage,
      maxFilledGap: config.coverage.maxFilledGap,
      minValidPixels: config.quality.minValidPixels,
      firstMonth: monthLabel(figures.firstMonth),
      toolVersion,
      statusBands: config.statusBands.map((band) => band.key),
      statusColours: statusColours(config.statusBands),
      usualFromPercent: usualFrom(config.statusBands),
      bodiesPerListPage: config.site.bodiesPerListPage,
      accentColour: config.site.accentColour?.toLowerCase() ?? null,
    },
    // The order of the JSON fields as it has always been, figures and words interleaved.
    bodies: figures.bodies,
    surfaceWater: surface,
    bodyStatus: figures.bodyStatus,
    monitored: figures.monitored,
    grid: figures.grid,
    trends: figures.trends,
    quality: waterQuality,
    rainfall: figures.rainfall,
    boundaries: figures.boundaries,
    validation: figures.validation,
    storage: figures.storage,
    seenShare: figures.seenShare,
    keyMessages: key.messages,
    headline: key.messages[0]?.text ?? key.caveats[0] ?? '',
    notices,
    cautions,
    methods: methodTexts(locale),
    warnings: warnings
      .filter((problem) => config.tables.columnWarningsOnDataPage || !COLUMN_WARNINGS.has(problem.code))
      .map((problem) => warningText(problem, locale)),
    inputs: inputs.files,
    revised: [],
  };
}
