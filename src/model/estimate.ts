/**
 * Fixed-set estimation of the water bodies not seen in a month, so that every group figure
 * (region, sub-region, size class, grid cell) covers the same bodies every month and does not move
 * with the clouds.
 *
 * Method ('fixed-set' in METHODS): the ratio-to-normal idea of infilling gappy station records
 * (the "normal ratio method" of Paulhus & Kohler 1952, Monthly Weather Review 80: 129–131, cited
 * from memory), applied to each body's filling (water surface area in percent of its reference
 * area). A body's usual filling for a calendar month is the median of its own values of that
 * month over the baseline years (at least `baseline.minYears` of them). An unseen body-month is its
 * usual times a ratio, the first of:
 *
 * 1. Carried: its own ratio to usual at its last value, at most `coverage.maxCarriedMonths` months
 *    earlier (surface area is persistent from month to month). Spread: the 10th–90th percentile
 *    of the changes of that ratio over as many months in the body's own observed record (at least
 *    MIN_CHANGE_PAIRS of them).
 * 2. Neighbours: the median ratio to usual of the seen bodies of its sub-region and size class (at
 *    least MIN_NEIGHBOURS of them), else of its sub-region. Spread: the 10th–90th percentile of
 *    those ratios.
 * 3. Carried long: its own last ratio from up to MAX_LONG_CARRY months back, when its sub-region
 *    has too few seen bodies (a whole sub-region under cloud); the carry-month spread grown as the
 *    square root of the months, and stretched to the region's seen ratios.
 * 4. Region: the median ratio of the region's seen bodies, with their spread.
 *
 * A body with no usual for the month (too short a record, or dry as usual: under
 * MIN_USUAL_PERCENT) takes the median filling of the same neighbours, with their spread.
 *
 * A group's range puts every estimated body at once at the low and at the high end of its spread:
 * the unseen bodies usually err the same way (one weather), so the range is wide rather than
 * narrow. Estimates never go below zero and are never shown for a single body: a body's own page
 * says only what was seen.
 */
import type { BulletinInputs } from '../ingest/index.ts';
import { quantileSorted } from '../stats/index.ts';
import { selectRanks } from '../stats/selectRanks.ts';
import { MISSING, OBSERVED, type BodySeries } from './bodySeries.ts';

/** Fewest seen bodies whose ratios stand for an unseen one (common practice; this project's choice). */
export const MIN_NEIGHBOURS = 3;
/** Fewest month-to-month changes in a body's own record from which its carried spread is taken. */
export const MIN_CHANGE_PAIRS = 10;
/** A usual filling under this many percent of the reference area gives no ratio (the body is usually dry that month). */
export const MIN_USUAL_PERCENT = 1;
/** Months back a body's own last value is looked for when its sub-region has no seen neighbours. */
export const MAX_LONG_CARRY = 12;
/** Low and high ends of a spread: the 10th and 90th percentiles. */
const LOW = 0.1;
const HIGH = 0.9;

export const ESTIMATE_SOURCES = ['carried', 'neighbours', 'carried-long', 'region', 'neighbour-filling'] as const;
export type EstimateSource = (typeof ESTIMATE_SOURCES)[number];

/** What the estimates rest on, made once per issue; estimateAt reads it for any body-month. */
export interface EstimationBasis {
  maxCarry: number;
  /** Usual filling per body and calendar month (body × 12 + calendar month − 1); NaN without one. */
  usual: Float64Array;
  /** 10th and 90th percentiles of a body's own ratio changes over j months (body × maxCarry + j − 1); NaN when too few. */
  changeLow: Float64Array;
  changeHigh: Float64Array;
  /** Per body: its (sub-region, size class) cell and its sub-region, as indices; −1 when unknown. */
  cellOf: Int32Array;
  subRegionOf: Int32Array;
  cells: number;
  subRegions: number;
  /**
   * Per month slot: median, low and high of the seen bodies' ratios to usual (and, separately, of their
   * filling) for every cell, then every sub-region, then the region: slot × levels × 3 values; NaN
   * where fewer than MIN_NEIGHBOURS were seen.
   */
  ratios: Float64Array;
  fillings: Float64Array;
}

/** One body-month's estimate (reused by estimateAt to spare an object per call). */
export interface Estimate {
  value: number;
  low: number;
  high: number;
  source: EstimateSource;
}

function usualOf(basis: EstimationBasis, body: number, month: number): number {
  const value = basis.usual[body * 12 + (month % 12)] as number;
  return value >= MIN_USUAL_PERCENT ? value : Number.NaN;
}

/** Size class of every body from the surface class boundaries (open bottom, open top). */
function sizeClassOf(referenceHa: number, boundaries: number[]): number {
  let k = 0;
  while (k < boundaries.length && referenceHa >= (boundaries[k] as number)) k++;
  return k;
}

const bases = new WeakMap<BodySeries, EstimationBasis>();

/** The basis of an issue's body series, made once per series (a memo of estimationBasis). */
export function estimationBasisOf(inputs: BulletinInputs, series: BodySeries): EstimationBasis {
  let basis = bases.get(series);
  if (!basis) {
    basis = estimationBasis(inputs, series);
    bases.set(series, basis);
  }
  return basis;
}

export function estimationBasis(inputs: BulletinInputs, series: BodySeries): EstimationBasis {
  const { bodies, config } = inputs;
  const n = bodies.length;
  const maxCarry = config.coverage.maxCarriedMonths;
  const { firstYear, lastYear, minYears } = config.baseline;
  const subRegionIndex = new Map(inputs.subRegions.map((subRegion, k) => [subRegion.id, k]));
  const boundaries = config.sizeClasses.surface;
  const classes = boundaries.length + 1;
  const subRegions = inputs.subRegions.length;
  const cells = subRegions * classes;
  const cellOf = new Int32Array(n).fill(-1);
  const subRegionOf = new Int32Array(n).fill(-1);
  for (let body = 0; body < n; body++) {
    const own = bodies[body] as BulletinInputs['bodies'][number];
    const s = subRegionIndex.get(own.subRegionId);
    if (s === undefined) continue;
    subRegionOf[body] = s;
    cellOf[body] = s * classes + sizeClassOf(own.referenceHa, boundaries);
  }

  // Usual filling: the median of the body's values (observed or filled) of each calendar month over the baseline years.
  // Typed scratch buffers sorted in place (a numeric typed-array sort, no comparator): at 100,000
  // bodies × 120 months the lists of numbers this replaced took 19 s, most of a national model stage.
  const usual = new Float64Array(n * 12).fill(Number.NaN);
  const perMonth = Math.ceil(series.months / 12) + 1;
  const byMonth = new Float64Array(12 * perMonth);
  const inMonth = new Int32Array(12);
  for (let body = 0; body < n; body++) {
    const states = series.state[body] as Uint8Array;
    const filling = series.filling[body] as Float64Array;
    inMonth.fill(0);
    for (let slot = 0; slot < series.months; slot++) {
      if (states[slot] === MISSING) continue;
      const month = series.firstMonth + slot;
      const year = Math.floor(month / 12);
      if (year < firstYear || year > lastYear) continue;
      const m = month % 12;
      byMonth[m * perMonth + (inMonth[m] as number)] = filling[slot] as number;
      inMonth[m] = (inMonth[m] as number) + 1;
    }
    for (let m = 0; m < 12; m++) {
      const count = inMonth[m] as number;
      if (count < minYears) continue;
      usual[body * 12 + m] = quantileSorted(byMonth.subarray(m * perMonth, m * perMonth + count).sort(), 0.5);
    }
  }

  const basis: EstimationBasis = {
    maxCarry,
    usual,
    changeLow: new Float64Array(n * maxCarry).fill(Number.NaN),
    changeHigh: new Float64Array(n * maxCarry).fill(Number.NaN),
    cellOf,
    subRegionOf,
    cells,
    subRegions,
    ratios: new Float64Array(0),
    fillings: new Float64Array(0),
  };

  // Each body's own spread of ratio changes over 1 … maxCarry months, from observed months only
  // (interpolated months would understate it).
  const ratio = new Float64Array(series.months);
  const changeBuffer = new Float64Array(series.months);
  for (let body = 0; body < n; body++) {
    const states = series.state[body] as Uint8Array;
    const filling = series.filling[body] as Float64Array;
    for (let slot = 0; slot < series.months; slot++) {
      const u = usualOf(basis, body, series.firstMonth + slot);
      ratio[slot] = states[slot] === OBSERVED ? (filling[slot] as number) / u : Number.NaN;
    }
    for (let j = 1; j <= maxCarry; j++) {
      let count = 0;
      for (let slot = j; slot < series.months; slot++) {
        const change = (ratio[slot] as number) - (ratio[slot - j] as number);
        if (Number.isFinite(change)) changeBuffer[count++] = change;
      }
      if (count < MIN_CHANGE_PAIRS) continue;
      const changes = changeBuffer.subarray(0, count).sort();
      basis.changeLow[body * maxCarry + j - 1] = quantileSorted(changes, LOW);
      basis.changeHigh[body * maxCarry + j - 1] = quantileSorted(changes, HIGH);
    }
  }

  // The neighbours' ratios and fillings, month by month, per cell, per sub-region and for the region.
  const levels = cells + subRegions + 1;
  basis.ratios = new Float64Array(series.months * levels * 3).fill(Number.NaN);
  basis.fillings = new Float64Array(series.months * levels * 3).fill(Number.NaN);
  // One buffer per level, as long as the level has bodies, refilled every month.
  const sizes = new Int32Array(levels);
  for (let body = 0; body < n; body++) {
    sizes[levels - 1] = (sizes[levels - 1] as number) + 1;
    if ((cellOf[body] as number) >= 0) sizes[cellOf[body] as number] = (sizes[cellOf[body] as number] as number) + 1;
    if ((subRegionOf[body] as number) >= 0)
      sizes[cells + (subRegionOf[body] as number)] = (sizes[cells + (subRegionOf[body] as number)] as number) + 1;
  }
  const ratioLists = Array.from(sizes, (size) => new Float64Array(size));
  const fillingLists = Array.from(sizes, (size) => new Float64Array(size));
  const ratioCounts = new Int32Array(levels);
  const fillingCounts = new Int32Array(levels);
  const add = (level: number, value: number, u: number) => {
    (fillingLists[level] as Float64Array)[fillingCounts[level] as number] = value;
    fillingCounts[level] = (fillingCounts[level] as number) + 1;
    if (!Number.isFinite(u)) return;
    (ratioLists[level] as Float64Array)[ratioCounts[level] as number] = value / u;
    ratioCounts[level] = (ratioCounts[level] as number) + 1;
  };
  for (let slot = 0; slot < series.months; slot++) {
    ratioCounts.fill(0);
    fillingCounts.fill(0);
    const month = series.firstMonth + slot;
    for (let body = 0; body < n; body++) {
      if ((series.state[body] as Uint8Array)[slot] === MISSING) continue;
      const value = (series.filling[body] as Float64Array)[slot] as number;
      const u = usualOf(basis, body, month);
      const cell = cellOf[body] as number;
      const subRegion = subRegionOf[body] as number;
      add(levels - 1, value, u);
      if (cell >= 0) add(cell, value, u);
      if (subRegion >= 0) add(cells + subRegion, value, u);
    }
    for (let level = 0; level < levels; level++) {
      summarize((ratioLists[level] as Float64Array).subarray(0, ratioCounts[level]), basis.ratios, (slot * levels + level) * 3);
      summarize((fillingLists[level] as Float64Array).subarray(0, fillingCounts[level]), basis.fillings, (slot * levels + level) * 3);
    }
  }
  return basis;
}

/**
 * Median, 10th and 90th percentiles (type 7, as quantileSorted) by selection rather than sorting:
 * the six ranks either side of the three positions (selectRanks). `values` is reordered.
 */
function summarize(values: Float64Array, into: Float64Array, at: number): void {
  const n = values.length;
  if (n < MIN_NEIGHBOURS) return;
  const positions = [0.5, LOW, HIGH].map((p) => (n - 1) * p);
  const ranks = [...new Set(positions.flatMap((h) => [Math.floor(h), Math.min(n - 1, Math.floor(h) + 1)]))].sort((a, b) => a - b);
  const selected = selectRanks(values, n, ranks);
  const valueAt = (rank: number) => selected[ranks.indexOf(rank)] as number;
  positions.forEach((h, k) => {
    const below = Math.floor(h);
    const low = valueAt(below);
    into[at + k] = below + 1 >= n ? low : low + (h - below) * (valueAt(below + 1) - low);
  });
}

/**
 * The estimate of an unseen body in a month slot, written into `into`; false when none can be made
 * (no usual, no value of its own within MAX_LONG_CARRY months and fewer than MIN_NEIGHBOURS seen
 * bodies at every level).
 */
export function estimateAt(basis: EstimationBasis, series: BodySeries, body: number, slot: number, into: Estimate): boolean {
  const month = series.firstMonth + slot;
  const u = usualOf(basis, body, month);
  const states = series.state[body] as Uint8Array;
  // The body's own last value and its ratio to usual then.
  let age = 0;
  let ratio = Number.NaN;
  if (Number.isFinite(u)) {
    for (let j = 1; j <= MAX_LONG_CARRY && slot - j >= 0; j++) {
      if (states[slot - j] === MISSING) continue;
      age = j;
      ratio = ((series.filling[body] as Float64Array)[slot - j] as number) / usualOf(basis, body, month - j);
      break;
    }
  }
  const carry = basis.maxCarry;
  if (Number.isFinite(ratio) && age <= carry) {
    const low = basis.changeLow[body * carry + age - 1] as number;
    const high = basis.changeHigh[body * carry + age - 1] as number;
    if (Number.isFinite(low)) return put(into, u * ratio, u * (ratio + low), u * (ratio + high), 'carried');
  }
  const levels = basis.cells + basis.subRegions + 1;
  const cell = basis.cellOf[body] as number;
  const subRegion = basis.subRegionOf[body] as number;
  const table = Number.isFinite(u) ? basis.ratios : basis.fillings;
  const scale = Number.isFinite(u) ? u : 1;
  const near = cell < 0 ? [] : [cell, basis.cells + subRegion];
  for (const level of near) {
    const at = (slot * levels + level) * 3;
    if (!Number.isFinite(table[at] as number)) continue;
    const [median, low, high] = [table[at] as number, table[at + 1] as number, table[at + 2] as number];
    return put(into, scale * median, scale * low, scale * high, Number.isFinite(u) ? 'neighbours' : 'neighbour-filling');
  }
  const at = (slot * levels + levels - 1) * 3;
  const regional = Number.isFinite(table[at] as number);
  const spreadLow = carry > 0 ? (basis.changeLow[body * carry + carry - 1] as number) : Number.NaN;
  if (Number.isFinite(ratio) && Number.isFinite(spreadLow)) {
    // Its own ratio kept on, the spread of its carry-month changes grown as √(age / carry) (a random
    // walk's), and the range stretched to the rest of the region's: the body may have gone on as its
    // own record went or moved as the seen bodies did.
    const grow = Math.sqrt(age / carry);
    let low = ratio + spreadLow * grow;
    let high = ratio + (basis.changeHigh[body * carry + carry - 1] as number) * grow;
    if (regional) {
      low = Math.min(low, table[at + 1] as number);
      high = Math.max(high, table[at + 2] as number);
    }
    return put(into, u * ratio, u * low, u * high, 'carried-long');
  }
  if (!regional) return false;
  return put(
    into,
    scale * (table[at] as number),
    scale * (table[at + 1] as number),
    scale * (table[at + 2] as number),
    Number.isFinite(u) ? 'region' : 'neighbour-filling',
  );
}

function put(into: Estimate, value: number, low: number, high: number, source: EstimateSource): true {
  into.value = Math.max(0, value);
  into.low = Math.max(0, Math.min(low, value));
  into.high = Math.max(0, Math.max(high, value));
  into.source = source;
  return true;
}
