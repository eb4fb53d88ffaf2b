/**
 * Coarse-grid anomaly map: water bodies are grouped into square cells of `grid.cellDegrees`
 * (default 0.25°) by their point location; each cell's filling is aggregated like any group, and
 * its bulletin month compared with the baseline mean and sample standard deviation of the same
 * calendar month. Cells with fewer than `grid.minBodies` bodies, too little coverage or too short a
 * baseline are marked and carry no anomaly.
 */
import type { BulletinInputs } from '../ingest/index.ts';
import type { BodySeries } from './bodySeries.ts';
import type { Status } from './status.ts';
import { groupStatus } from './surfaceWater.ts';

export interface GridCell {
  /** South-west corner. */
  west: number;
  south: number;
  size: number;
  bodies: number;
  /** The cell's status, the same shape as every other group's; `too-few-bodies` below `grid.minBodies`. */
  status: Status;
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
    cells: sorted.map(({ column, row, members }) => ({
      west: round(column * cellDegrees),
      south: round(row * cellDegrees),
      size: cellDegrees,
      bodies: members.length,
      status:
        members.length < minBodies
          ? { kind: 'too-few-bodies' as const, bodies: members.length, minBodies }
          : groupStatus(inputs, series, members),
    })),
  };
}

/** Cell corners on a clean decimal grid (0.25 × −117 is −29.25 exactly, but not every size is). */
const round = (value: number) => Math.round(value * 1e9) / 1e9;
