/**
 * Storage from water surface area (method 'storage'): each reservoir with an area–elevation–volume
 * curve (inputs.storageCurves) turns its monthly water area into a water level and a stored
 * volume. The level is where the curve's area, interpolated in elevation, equals the observed area
 * (the lowest such level where the area stays flat); the volume is the curve's volume at that
 * level. Both curves are interpolated by PCHIP (Fritsch & Carlson 1980), or straight lines with
 * `storage.interpolation: "linear"`. An area outside the curve is taken at its nearest end (the
 * input check warns), never extrapolated.
 *
 * Group storage (the region, each sub-region) is the group figure of the volumes as percent of
 * capacity, weighted by capacity, over the bodies that have a curve: the same fixed-set estimation,
 * coverage rule, baseline and status bands as surface area (aggregate, statusOf). Bodies without a
 * curve are not guessed: a group's storage is stated only when its bodies with a curve make up at
 * least `storage.minCurveShare` of its reference area, and the share is printed beside it.
 */
import type { BulletinInputs, StorageCurve, StorageFit } from '../ingest/index.ts';
import { Linear, Pchip } from '../stats/pchip.ts';
import { aggregate, type GroupMonth } from './aggregate.ts';
import { MISSING, type BodySeries } from './bodySeries.ts';
import { estimationBasisOf } from './estimate.ts';
import type { MethodId } from './methods.ts';
import { statusOf, type GroupStatus } from './status.ts';

/** What turns a water area into storage: a survey curve (StorageReader) or a fitted power law (FitReader). */
export interface VolumeReader {
  readonly capacityHm3: number;
  readonly minAreaHa: number;
  readonly maxAreaHa: number;
  readonly source: 'curve' | 'fit';
  read(areaHa: number): { levelM: number | null; volumeHm3: number; clamped: boolean };
}

/**
 * A fitted power law V = a·A^b (hm³ from ha), read inside its fitted area range and clamped to it;
 * capacity is its volume at the top of the range. No elevation, so no level.
 */
export class FitReader implements VolumeReader {
  readonly capacityHm3: number;
  readonly minAreaHa: number;
  readonly maxAreaHa: number;
  readonly source = 'fit' as const;

  constructor(private readonly fit: Pick<StorageFit, 'coefficient' | 'exponent' | 'minAreaHa' | 'maxAreaHa'>) {
    this.minAreaHa = fit.minAreaHa;
    this.maxAreaHa = fit.maxAreaHa;
    this.capacityHm3 = fit.coefficient * fit.maxAreaHa ** fit.exponent;
  }

  read(areaHa: number): { levelM: null; volumeHm3: number; clamped: boolean } {
    const clamped = areaHa < this.minAreaHa || areaHa > this.maxAreaHa;
    const area = Math.min(this.maxAreaHa, Math.max(this.minAreaHa, areaHa));
    return { levelM: null, volumeHm3: this.fit.coefficient * area ** this.fit.exponent, clamped };
  }
}

/** One body's curve, ready to read both ways. */
export class StorageReader implements VolumeReader {
  readonly source = 'curve' as const;
  private readonly area: Pchip | Linear;
  private readonly volume: Pchip | Linear;
  readonly capacityHm3: number;
  readonly minAreaHa: number;
  readonly maxAreaHa: number;

  constructor(curve: Pick<StorageCurve, 'elevationM' | 'areaHa' | 'volumeHm3'>, interpolation: 'pchip' | 'linear' = 'pchip') {
    const Interpolant = interpolation === 'pchip' ? Pchip : Linear;
    this.area = new Interpolant(curve.elevationM, curve.areaHa);
    this.volume = new Interpolant(curve.elevationM, curve.volumeHm3);
    this.capacityHm3 = curve.volumeHm3[curve.volumeHm3.length - 1] as number;
    this.minAreaHa = curve.areaHa[0] as number;
    this.maxAreaHa = curve.areaHa[curve.areaHa.length - 1] as number;
  }

  /** Level (m) and volume (hm³) at a water area (ha); `clamped` when the area lay outside the curve. */
  read(areaHa: number): { levelM: number; volumeHm3: number; clamped: boolean } {
    const clamped = areaHa < this.minAreaHa || areaHa > this.maxAreaHa;
    const levelM = this.area.inverse(Math.min(this.maxAreaHa, Math.max(this.minAreaHa, areaHa)));
    return { levelM, volumeHm3: this.volume.at(levelM), clamped };
  }

  /** The water area (ha) at a level (m): the way back, for round trips. */
  areaAt(levelM: number): number {
    return this.area.at(levelM);
  }
}

export interface BodyStorage {
  body: number;
  id: string;
  capacityHm3: number;
  /** A survey curve, or a fitted power law (an estimate, with no level). */
  source: 'curve' | 'fit';
  /** In the bulletin month (seen, or filled from a short gap); null when the body has no value then (and always for a fit). */
  levelM: number | null;
  volumeHm3: number | null;
  percentOfCapacity: number | null;
  /** The month's water area lay outside the curve and was taken at its nearest end. */
  clamped: boolean;
}

export interface StorageGroup {
  id: string;
  name: string;
  bodies: number;
  bodiesWithCurve: number;
  /** Share (0–1) of the group's reference area whose bodies have a curve. */
  curveShare: number;
  capacityHm3: number;
  /** Storage in percent of capacity, month by month (GroupMonth of the bodies with a curve, weighted by capacity). */
  series: GroupMonth[];
  /** Against the baseline as for surface area; null when the curves cover too little of the group (storage.minCurveShare). */
  status: GroupStatus | null;
  /** Stored volume in the bulletin month and its range from the estimates, hm³; null when no figure is stated. */
  volumeHm3: number | null;
  volumeRangeHm3: { low: number; high: number } | null;
}

export interface StorageFigures {
  methods: MethodId[];
  interpolation: 'pchip' | 'linear';
  minCurveShare: number;
  bodies: BodyStorage[];
  region: StorageGroup;
  subRegions: StorageGroup[];
}

/** Storage as percent of capacity per body and month, from the surface-area series (MISSING where area is). */
function storageSeries(inputs: BulletinInputs, series: BodySeries, readers: Map<number, VolumeReader>): BodySeries {
  const filling = inputs.bodies.map(() => new Float64Array(series.months).fill(Number.NaN));
  const state = inputs.bodies.map(() => new Uint8Array(series.months));
  for (const [body, reader] of readers) {
    const areaStates = series.state[body] as Uint8Array;
    const areaPercent = series.filling[body] as Float64Array;
    const referenceHa = (inputs.bodies[body] as { referenceHa: number }).referenceHa;
    const values = filling[body] as Float64Array;
    const states = state[body] as Uint8Array;
    for (let slot = 0; slot < series.months; slot++) {
      if (areaStates[slot] === MISSING) continue;
      const { volumeHm3 } = reader.read(((areaPercent[slot] as number) * referenceHa) / 100);
      values[slot] = reader.capacityHm3 > 0 ? (100 * volumeHm3) / reader.capacityHm3 : 0;
      states[slot] = areaStates[slot] as number;
    }
  }
  return { firstMonth: series.firstMonth, months: series.months, filling, state };
}

export function storage(inputs: BulletinInputs, series: BodySeries): StorageFigures | null {
  if (inputs.storage.length === 0 && inputs.storageFits.length === 0) return null;
  const { config, bulletinMonth } = inputs;
  const interpolation = config.storage.interpolation;
  const readers = new Map<number, VolumeReader>([
    ...inputs.storage.map((curve) => [curve.body, new StorageReader(curve, interpolation)] as const),
    ...inputs.storageFits.map((fit) => [fit.body, new FitReader(fit)] as const),
  ]);
  const slot = bulletinMonth - series.firstMonth;
  const bodies: BodyStorage[] = [...readers.keys()]
    .sort((a, b) => a - b)
    .map((index) => {
      const reader = readers.get(index) as VolumeReader;
      const body = inputs.bodies[index] as BulletinInputs['bodies'][number];
      const seen = slot >= 0 && (series.state[index] as Uint8Array)[slot] !== MISSING;
      const base = { body: index, id: body.id, capacityHm3: reader.capacityHm3, source: reader.source };
      if (!seen) return { ...base, levelM: null, volumeHm3: null, percentOfCapacity: null, clamped: false };
      const read = reader.read((((series.filling[index] as Float64Array)[slot] as number) * body.referenceHa) / 100);
      return {
        ...base,
        levelM: read.levelM,
        volumeHm3: read.volumeHm3,
        percentOfCapacity: reader.capacityHm3 > 0 ? (100 * read.volumeHm3) / reader.capacityHm3 : null,
        clamped: read.clamped,
      };
    });
  const stored = storageSeries(inputs, series, readers);
  const capacity = new Float64Array(inputs.bodies.length);
  for (const [body, reader] of readers) capacity[body] = reader.capacityHm3;
  const basis = estimationBasisOf(inputs, stored);
  const group = (id: string, name: string, members: number[]): StorageGroup => {
    const curved = members.filter((body) => readers.has(body));
    const reference = members.reduce((sum, body) => sum + (inputs.bodies[body]?.referenceHa ?? 0), 0);
    const curvedReference = curved.reduce((sum, body) => sum + (inputs.bodies[body]?.referenceHa ?? 0), 0);
    const curveShare = reference > 0 ? curvedReference / reference : 0;
    const capacityHm3 = curved.reduce((sum, body) => sum + (capacity[body] as number), 0);
    const monthly = aggregate(stored, curved, capacity, config.coverage.minRegionCoverage, undefined, basis);
    const enough = curved.length > 0 && curveShare >= config.storage.minCurveShare;
    const status = enough ? statusOf(monthly, bulletinMonth, config) : null;
    const current = monthly.find((row) => row.month === bulletinMonth);
    const stated = enough && current && current.fillingPercent !== null ? current : null;
    return {
      id,
      name,
      bodies: members.length,
      bodiesWithCurve: curved.length,
      curveShare,
      capacityHm3,
      series: monthly,
      status,
      volumeHm3: stated ? ((stated.fillingPercent as number) * capacityHm3) / 100 : null,
      volumeRangeHm3: stated
        ? { low: ((stated.lowPercent as number) * capacityHm3) / 100, high: ((stated.highPercent as number) * capacityHm3) / 100 }
        : null,
    };
  };
  const all = inputs.bodies.map((_, k) => k);
  return {
    methods: ['storage', 'fixed-set', 'status'],
    interpolation,
    minCurveShare: config.storage.minCurveShare,
    bodies,
    region: group('region', config.region.name, all),
    subRegions: inputs.subRegions.map((subRegion) =>
      group(
        subRegion.id,
        subRegion.name,
        all.filter((k) => inputs.bodies[k]?.subRegionId === subRegion.id),
      ),
    ),
  };
}
