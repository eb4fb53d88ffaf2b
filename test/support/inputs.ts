/** Small in-memory inputs for model tests. */
import type { AreaTable, WaterBody } from '../../src/ingest/index.ts';

export const body = (id: string, referenceHa: number, subRegionId = 'S', extra: Partial<WaterBody> = {}): WaterBody => ({
  id,
  name: id,
  subRegionId,
  lon: 0,
  lat: 0,
  referenceHa,
  kind: 'lake',
  ownPage: false,
  line: 0,
  ...extra,
});

/** Rows [body id, month index, water ha, observed share] as an AreaTable. */
export function areaTable(bodies: WaterBody[], rows: Array<[string, number, number, number]>): AreaTable {
  const position = new Map(bodies.map((entry, k) => [entry.id, k]));
  return {
    length: rows.length,
    body: Int32Array.from(rows, ([id]) => position.get(id) as number),
    month: Int32Array.from(rows, ([, month]) => month),
    waterHa: Float64Array.from(rows, ([, , water]) => water),
    observedShare: Float64Array.from(rows, ([, , , share]) => share),
    scenes: new Float64Array(rows.length),
  };
}
