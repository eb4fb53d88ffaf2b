/**
 * Figures this issue gives differently from what an earlier issue printed: for each earlier issue
 * of the same language (its last revision), the regional area covered by water it printed for its
 * own month, against the value this issue gives that month now. Kept in the model (`revised`), so
 * the data page, the charts' tables and the model JSON all say "revised from X" from one list;
 * nothing published changes silently. Values that print the same to one decimal (the precision
 * the pages print) are not revisions.
 */
import { parseMonth } from '../common/months.ts';
import type { BulletinModel, PrintedEarlier } from './index.ts';

const printed = (value: number) => Math.round(value * 10);

export function printedEarlier(model: BulletinModel, earlier: readonly BulletinModel[]): PrintedEarlier[] {
  const latest = new Map<string, BulletinModel>();
  for (const other of earlier) {
    if (other.meta.locale !== model.meta.locale || other.meta.month >= model.meta.month) continue;
    const seen = latest.get(other.meta.month);
    if (!seen || other.meta.revision > seen.meta.revision) latest.set(other.meta.month, other);
  }
  const revised: PrintedEarlier[] = [];
  for (const other of [...latest.values()].sort((a, b) => a.meta.month.localeCompare(b.meta.month))) {
    const then = other.surfaceWater.region.status;
    if (then.kind === 'low-coverage') continue;
    const month = parseMonth(other.meta.month) as number;
    const now = model.surfaceWater.region.series.find((row) => row.month === month)?.fillingPercent ?? null;
    if (now === null || printed(now) === printed(then.fillingPercent)) continue;
    revised.push({
      month: other.meta.month,
      printedPercent: then.fillingPercent,
      nowPercent: now,
      issueMonthName: other.meta.monthName,
      revision: other.meta.revision,
    });
  }
  return revised;
}
