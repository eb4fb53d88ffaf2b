/**
 * The current deficit of a group, apart from any trend: how many months in a row, up to the
 * bulletin month, its filling has been below usual, since when, and the shortfall summed over
 * those months. "Below usual" is the bulletin's own wording: below the lower edge of the status
 * band that holds 100 % of the baseline median (the example's "near usual" starts at 90 %), each
 * month against the baseline median of its own calendar month.
 */
import type { BulletinConfig } from '../ingest/index.ts';
import { climatology } from '../stats/index.ts';
import type { GroupMonth } from './aggregate.ts';

export interface Deficit {
  /** Months in a row below usual, ending at the bulletin month; 0 when the bulletin month is not below usual. */
  months: number;
  /** First month of the run (month index); null when months is 0. */
  since: number | null;
  /** Σ over the run of (baseline median − filling): percentage points of the reference area × months. */
  shortfallPointMonths: number;
  /** The same as area: hectare-months (each month's shortfall in hectares of the group's reference area, summed). */
  shortfallHaMonths: number;
  /** Percent of the baseline median below which a month counts. */
  belowPercent: number;
  /** The run ends, going back, at a month with no figure (or no baseline) rather than at a usual month: it may be longer. */
  openStart: boolean;
}

/** The lower edge of the band that holds 100 % of the baseline median (100 when that band has no lower edge). */
export function usualFrom(bands: BulletinConfig['statusBands']): number {
  let from: number | null = null;
  for (const band of bands) if (band.fromPercent === null || band.fromPercent <= 100) from = band.fromPercent;
  return from ?? 100;
}

export function deficitOf(series: GroupMonth[], bulletinMonth: number, referenceHa: number, config: BulletinConfig): Deficit {
  const belowPercent = usualFrom(config.statusBands);
  const baseline = climatology(
    series.map((row) => row.month),
    series.map((row) => row.fillingPercent),
    config.baseline,
  );
  const byMonth = new Map(series.map((row) => [row.month, row]));
  let months = 0;
  let since: number | null = null;
  let points = 0;
  let openStart = false;
  for (let month = bulletinMonth; ; month--) {
    const row = byMonth.get(month);
    const median = baseline[month % 12]?.median;
    if (!row || row.fillingPercent === null || median === undefined || !(median > 0)) {
      openStart = months > 0;
      break;
    }
    if ((100 * row.fillingPercent) / median >= belowPercent) break;
    months++;
    since = month;
    points += median - row.fillingPercent;
  }
  return { months, since, shortfallPointMonths: points, shortfallHaMonths: (points / 100) * referenceHa, belowPercent, openStart };
}
