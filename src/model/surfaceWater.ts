/**
 * Surface water for the region, each sub-region and each size class: the monthly group series
 * (see aggregate), the bulletin month's status against the baseline (see status), and for size
 * classes the loss from maximum filling (100 % − filling: the share of the reference area that is
 * dry) now and in the baseline median.
 */
import type { MethodId } from './methods.ts';
import type { BulletinInputs } from '../ingest/index.ts';
import { climatology } from '../stats/index.ts';
import { aggregate, statusMonths, type GroupMonth } from './aggregate.ts';
import type { BodySeries } from './bodySeries.ts';
import { envelopeOf, statusOf, type GroupStatus } from './status.ts';
import { estimationBasisOf } from './estimate.ts';
import { deficitOf, type Deficit } from './deficit.ts';
import { sizeClassLabel } from '../text/index.ts';

export interface GroupSurface {
  id: string;
  name: string;
  bodies: number;
  referenceHa: number;
  series: GroupMonth[];
  status: GroupStatus;
  /** Months in a row below usual up to the bulletin month, and the shortfall over them (deficit.ts). */
  deficit: Deficit;
}

export interface SizeClassSurface extends GroupSurface {
  fromHa: number;
  /** Upper bound (exclusive); null for the open top class. */
  toHa: number | null;
  /** 100 − filling in the bulletin month; null when no figure is stated. */
  lossPercent: number | null;
  /** 100 − baseline median filling; null without a baseline. */
  baselineLossPercent: number | null;
}

/** Surface water as figures, the same in every language: size classes without their names (wordSurface adds them). */
export type SurfaceFigures = Omit<SurfaceWater, 'sizeClasses'> & { sizeClasses: Array<Omit<SizeClassSurface, 'name'>> };

export interface SurfaceWater {
  /** Ids in METHODS of the methods behind these figures. */
  methods: MethodId[];
  region: GroupSurface;
  subRegions: GroupSurface[];
  sizeClasses: SizeClassSurface[];
  /** The bulletin's calendar month in every year of the record (for the year-by-year chart). */
  sameMonthEachYear: Array<{ year: number; fillingPercent: number | null; inBaseline: boolean }>;
  /** Regional filling minus the baseline median of its calendar month, percentage points, per month with both. */
  regionAnomalies: Array<{ month: number; points: number }>;
  /** Regional baseline per calendar month (1–12): median and 10th–90th percentile envelope; null without enough years. */
  /** low–high is the 10th–90th percentiles or, from fewer than 10 baseline years, the range (envelopeOf). */
  regionEnvelope: Array<{
    calendarMonth: number;
    median: number | null;
    low: number | null;
    high: number | null;
    kind: 'percentiles' | 'range';
  }>;
}

const referenceAreas = new WeakMap<BulletinInputs, Float64Array>();

/** Reference area of every body, in inventory order (made once per inputs). */
export function referenceAreasOf(inputs: BulletinInputs): Float64Array {
  let areas = referenceAreas.get(inputs);
  if (!areas) {
    areas = Float64Array.from(inputs.bodies, (body) => body.referenceHa);
    referenceAreas.set(inputs, areas);
  }
  return areas;
}

/** The status alone of a group (grid cells): only the months it reads are aggregated. */
export function groupStatus(inputs: BulletinInputs, series: BodySeries, members: number[]): GroupStatus {
  const monthly = aggregate(
    series,
    members,
    referenceAreasOf(inputs),
    inputs.config.coverage.minRegionCoverage,
    statusMonths(inputs.bulletinMonth),
    estimationBasisOf(inputs, series),
  );
  return statusOf(monthly, inputs.bulletinMonth, inputs.config);
}

export function group(inputs: BulletinInputs, series: BodySeries, id: string, name: string, members: number[]): GroupSurface {
  const referenceHa = referenceAreasOf(inputs);
  const monthly = aggregate(
    series,
    members,
    referenceHa,
    inputs.config.coverage.minRegionCoverage,
    undefined,
    estimationBasisOf(inputs, series),
  );
  const total = members.reduce((sum, body) => sum + (referenceHa[body] as number), 0);
  return {
    id,
    name,
    bodies: members.length,
    referenceHa: total,
    series: monthly,
    status: statusOf(monthly, inputs.bulletinMonth, inputs.config),
    deficit: deficitOf(monthly, inputs.bulletinMonth, total, inputs.config),
  };
}

/** Size classes from rising boundaries: [b₀, b₁) … with an open top class; bodies below b₀ too when b₀ > 0. */
export function sizeClassBounds(boundaries: number[], openBottom: boolean): Array<{ fromHa: number; toHa: number | null }> {
  const edges = openBottom ? [0, ...boundaries] : boundaries;
  return edges.map((fromHa, k) => ({ fromHa, toHa: edges[k + 1] ?? null }));
}

/** The wording stage's part: the figures with the size-class names of one language. */
export function wordSurface(figures: SurfaceFigures, locale: string): SurfaceWater {
  return {
    ...figures,
    sizeClasses: figures.sizeClasses.map(({ id, ...entry }) => ({
      id,
      name: sizeClassLabel(locale, entry.fromHa, entry.toHa, true),
      ...entry,
    })),
  };
}

export function surfaceWater(inputs: BulletinInputs, series: BodySeries): SurfaceFigures {
  const all = inputs.bodies.map((_, k) => k);
  const region = group(inputs, series, 'region', inputs.config.region.name, all);
  const subRegions = inputs.subRegions.map((subRegion) =>
    group(
      inputs,
      series,
      subRegion.id,
      subRegion.name,
      all.filter((k) => inputs.bodies[k]?.subRegionId === subRegion.id),
    ),
  );
  const sizeClasses = sizeClassBounds(inputs.config.sizeClasses.surface, true).map(({ fromHa, toHa }) => {
    const members = all.filter((k) => {
      const ha = inputs.bodies[k]?.referenceHa ?? 0;
      return ha >= fromHa && (toHa === null || ha < toHa);
    });
    const { name: _name, ...base } = group(inputs, series, `size-${fromHa}`, '', members);
    const status = base.status;
    return {
      ...base,
      fromHa,
      toHa,
      lossPercent: status.kind === 'low-coverage' ? null : 100 - status.fillingPercent,
      baselineLossPercent: status.kind === 'stated' ? 100 - status.baseline.median : null,
    };
  });
  const { firstYear, lastYear } = inputs.config.baseline;
  const sameMonthEachYear = region.series
    .filter((entry) => entry.month % 12 === inputs.bulletinMonth % 12)
    .map((entry) => ({
      year: Math.floor(entry.month / 12),
      fillingPercent: entry.fillingPercent,
      inBaseline: Math.floor(entry.month / 12) >= firstYear && Math.floor(entry.month / 12) <= lastYear,
    }));
  const regionEnvelope = climatology(
    region.series.map((row) => row.month),
    region.series.map((row) => row.fillingPercent),
    inputs.config.baseline,
  ).map((entry) => {
    const envelope = envelopeOf(entry);
    return {
      calendarMonth: entry.calendarMonth,
      median: entry.enough ? entry.median : null,
      low: entry.enough ? envelope.low : null,
      high: entry.enough ? envelope.high : null,
      kind: envelope.kind,
    };
  });
  const regionAnomalies = region.series.flatMap((row) => {
    const baseline = regionEnvelope[row.month % 12]?.median ?? null;
    return row.fillingPercent === null || baseline === null ? [] : [{ month: row.month, points: row.fillingPercent - baseline }];
  });
  return {
    methods: ['gap-filling', 'fixed-set', 'filling-ratio', 'status', 'deficit', 'size-class-loss'],
    region,
    subRegions,
    sizeClasses,
    sameMonthEachYear,
    regionAnomalies,
    regionEnvelope,
  };
}
