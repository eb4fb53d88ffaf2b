/**
 * Coarse-grid anomaly map: water bodies are grouped into square cells of `grid.cellDegrees`
 * (default 0.25°) by their point location; each cell's filling is aggregated like any group, and
 * its bulletin month compared with the baseline mean and sample standard deviation of the same
 * calendar month. Cells with fewer than `grid.minBodies` bodies, too little coverage or too short a
 * baseline are marked and carry no anomaly.
 */
import type { BulletinInputs } from '../ingest/index.ts';
import type { BodySeries } from './bodySeries.ts';
import { groupStatus } from './surfaceWater.ts';

export type CellState = 'stated' | 'too-few-bodies' | 'low-coverage' | 'short-baseline';

export interface GridCell {
  /** South-west corner. */
  west: number;
  south: number;
  size: number;
  bodies: number;
  state: CellState;
  fillingPercent: number | null;
  baselineMean: number | null;
  baselineStandardDeviation: number | null;
  /** (filling − baseline mean) / baseline sd; null unless stated with enough baseline years (STANDARDIZED_MIN_YEARS). */
  standardized: number | null;
  /** Percent of the baseline median and its status band, as for every other group; null unless stated. */
  percentOfBaseline: number | null;
  bandKey: string | null;
  /** Filling minus baseline median, percentage points. */
  anomalyPoints: number | null;
}

export interface Grid {
  method: 'grid';
  cellDegrees: number;
  minBodies: number;
  cells: GridCell[];
}

export function grid(inputs: BulletinInputs, series: BodySeries): Grid {
  const { cellDegrees, minBodies } = inputs.config.grid;
  const cells = new Map<string, { column: number; row: number; members: number[] }>();
  inputs.bodies.forEach((body, k) => {
    const column = Math.floor(body.lon / cellDegrees);
    const row = Math.floor(body.lat / cellDegrees);
    const key = `${column} ${row}`;
    const cell = cells.get(key) ?? { column, row, members: [] };
    cell.members.push(k);
    cells.set(key, cell);
  });
  const sorted = [...cells.values()].sort((a, b) => b.row - a.row || a.column - b.column);
  return {
    method: 'grid',
    cellDegrees,
    minBodies,
    cells: sorted.map(({ column, row, members }) => {
      const base = { west: round(column * cellDegrees), south: round(row * cellDegrees), size: cellDegrees, bodies: members.length };
      const empty = {
        fillingPercent: null,
        baselineMean: null,
        baselineStandardDeviation: null,
        standardized: null,
        percentOfBaseline: null,
        bandKey: null,
        anomalyPoints: null,
      };
      if (members.length < minBodies) return { ...base, state: 'too-few-bodies' as const, ...empty };
      const status = groupStatus(inputs, series, members);
      if (status.kind === 'low-coverage') return { ...base, state: 'low-coverage' as const, ...empty };
      if (status.kind === 'short-baseline')
        return { ...base, state: 'short-baseline' as const, ...empty, fillingPercent: status.fillingPercent };
      return {
        ...base,
        state: 'stated' as const,
        fillingPercent: status.fillingPercent,
        baselineMean: status.baseline.mean,
        baselineStandardDeviation: status.baseline.standardDeviation,
        standardized: status.standardized,
        percentOfBaseline: status.percentOfBaseline,
        bandKey: status.bandKey,
        anomalyPoints: status.anomalyPoints,
      };
    }),
  };
}

/** Cell corners on a clean decimal grid (0.25 × −117 is −29.25 exactly, but not every size is). */
const round = (value: number) => Math.round(value * 1e9) / 1e9;
