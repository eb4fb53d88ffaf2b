/**
 * Rainfall for context: per sub-region and month as given, with the baseline median of each
 * calendar month, and the bulletin month as percent of that median.
 */
import type { BulletinInputs } from '../ingest/index.ts';
import { climatology } from '../stats/index.ts';

export interface RainfallSummary {
  subRegions: Array<{
    id: string;
    name: string;
    monthly: Array<{ month: number; rainfallMm: number }>;
    baselineMedianMm: Array<number | null>;
    bulletinMonthMm: number | null;
    percentOfBaseline: number | null;
  }>;
}

export function rainfall(inputs: BulletinInputs): RainfallSummary | null {
  if (inputs.rainfall.length === 0) return null;
  return {
    subRegions: inputs.subRegions.map((subRegion) => {
      const rows = inputs.rainfall.filter((row) => row.subRegionId === subRegion.id).sort((a, b) => a.month - b.month);
      const climate = climatology(
        rows.map((row) => row.month),
        rows.map((row) => row.rainfallMm),
        inputs.config.baseline,
      );
      const now = rows.find((row) => row.month === inputs.bulletinMonth)?.rainfallMm ?? null;
      const median = climate[inputs.bulletinMonth % 12]?.median;
      return {
        id: subRegion.id,
        name: subRegion.name,
        monthly: rows.map(({ month, rainfallMm }) => ({ month, rainfallMm })),
        baselineMedianMm: climate.map((entry) => (entry.enough ? entry.median : null)),
        bulletinMonthMm: now,
        percentOfBaseline: now !== null && median !== undefined && Number.isFinite(median) && median > 0 ? (100 * now) / median : null,
      };
    }),
  };
}
