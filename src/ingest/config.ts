/**
 * The bulletin configuration (`bulletin.json` in a bulletin folder). The zod schema is the single
 * source of truth: the TypeScript type is inferred from it, and validation turns every schema issue
 * into a Problem with a JSON path.
 */
import { readFileSync } from 'node:fs';
import { z } from 'zod';
import { ProblemList } from './problems.ts';

const month = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'a month as YYYY-MM');
const date = z.string().regex(/^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/, 'a date as YYYY-MM-DD');

const statusBand = z.strictObject({
  /** Short key used in data files and CSS classes. */
  key: z.string().regex(/^[a-z][a-z-]*$/),
  /** Lower bound, percent of the baseline median, inclusive; the lowest band has none. */
  fromPercent: z.number().nullable(),
});

export const configSchema = z.strictObject({
  title: z.string().min(1),
  publisher: z.string().min(1),
  region: z.strictObject({ name: z.string().min(1) }),
  issue: z.strictObject({
    month,
    revision: z.number().int().min(1).default(1),
    published: date,
    draft: z.boolean().default(false),
  }),
  baseline: z.strictObject({
    firstYear: z.number().int(),
    lastYear: z.number().int(),
    /** Fewest baseline years a calendar month needs before a climatology is stated. */
    minYears: z.number().int().min(2).default(3),
  }),
  coverage: z.strictObject({
    /** A body-month seen through clouds over less than this share counts as missing. */
    minObservedShare: z.number().min(0).max(1).default(0.6),
    /** Below this share of the region's reference area observed, no regional figure is stated. */
    minRegionCoverage: z.number().min(0).max(1).default(0.5),
  }),
  statusBands: z.array(statusBand).min(2),
  site: z.strictObject({ baseUrl: z.url() }),
  locales: z.array(z.enum(['en'])).min(1).default(['en']),
  inputs: z.strictObject({
    inventory: z.string(),
    surfaceArea: z.string(),
    quality: z.string().optional(),
    rainfall: z.string().optional(),
    field: z.string().optional(),
    boundaries: z.string(),
  }),
});

export type BulletinConfig = z.infer<typeof configSchema>;

/** Reads and validates a configuration file; returns null when it cannot be used. */
export function readConfig(path: string, label: string, problems: ProblemList): BulletinConfig | null {
  let raw: unknown;
  try {
    raw = JSON.parse(readFileSync(path, 'utf8'));
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    problems.error({ code: 'config-unreadable', file: label, line: 0, column: '', value: '', expected: 'a JSON file', message: `cannot read the configuration: ${message}` });
    return null;
  }
  const parsed = configSchema.safeParse(raw);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      problems.error({
        code: 'config-invalid',
        file: label,
        line: 0,
        column: issue.path.join('.'),
        value: '',
        expected: '',
        message: issue.message,
      });
    }
    return null;
  }
  const config = parsed.data;
  if (config.baseline.firstYear > config.baseline.lastYear) {
    problems.error({ code: 'config-baseline-order', file: label, line: 0, column: 'baseline', value: `${config.baseline.firstYear}-${config.baseline.lastYear}`, expected: 'firstYear no later than lastYear', message: 'the baseline period ends before it starts' });
  }
  const bands = config.statusBands;
  if (bands[0]?.fromPercent !== null || bands.slice(1).some((band, k) => band.fromPercent === null || band.fromPercent <= (bands[k]?.fromPercent ?? -Infinity))) {
    problems.error({ code: 'config-status-bands', file: label, line: 0, column: 'statusBands', value: '', expected: 'the first band with fromPercent null, then strictly rising bounds', message: 'status bands must cover all values in rising order' });
  }
  return config;
}
