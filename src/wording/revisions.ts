/**
 * Figures this issue gives differently from what an earlier issue printed: for each earlier issue
 * of the same language (its last revision), the area covered by water it printed for its own month,
 * for the region, each sub-region and each size class, against the value this issue gives the same
 * group that month now. A sub-region is the same group by its id; a size class by its id and its
 * bounds (a class whose bounds were reconfigured is another group, not a revision). Kept in the model (`revised`), so
 * the data page, the charts' tables and the model JSON all say "revised from X" from one list;
 * nothing published changes silently. Values that print the same to one decimal (the precision
 * the pages print) are not revisions.
 */
import { parseMonth } from '../common/months.ts';
import type { GroupSurface } from '../model/surfaceWater.ts';
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
    const month = parseMonth(other.meta.month) as number;
    const sameClass = (a: { id: string; fromHa: number; toHa: number | null }, b: typeof a) =>
      a.id === b.id && a.fromHa === b.fromHa && a.toHa === b.toHa;
    const pairs: Array<readonly [PrintedEarlier['figure']['kind'], GroupSurface, GroupSurface | undefined]> = [
      ['region', other.surfaceWater.region, model.surfaceWater.region],
      ...other.surfaceWater.subRegions.map(
        (then) => ['sub-region', then, model.surfaceWater.subRegions.find((now) => now.id === then.id)] as const,
      ),
      ...other.surfaceWater.sizeClasses.map(
        (then) => ['size-class', then, model.surfaceWater.sizeClasses.find((now) => sameClass(now, then))] as const,
      ),
    ];
    for (const [kind, thenGroup, nowGroup] of pairs) {
      const then = thenGroup.status;
      if (then.kind === 'low-coverage' || !nowGroup) continue;
      const now = nowGroup.series.find((row) => row.month === month)?.fillingPercent ?? null;
      if (now === null || printed(now) === printed(then.fillingPercent)) continue;
      revised.push({
        figure: { kind, id: nowGroup.id, name: nowGroup.name },
        month: other.meta.month,
        printedPercent: then.fillingPercent,
        nowPercent: now,
        issueMonthName: other.meta.monthName,
        revision: other.meta.revision,
      });
    }
  }
  return revised;
}
