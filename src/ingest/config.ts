/**
 * The bulletin configuration (`bulletin.json` in a bulletin folder). The zod schema is the single
 * source of truth: the TypeScript type is inferred from it, and validation turns every schema issue
 * into a Problem with the line of the key in the file and, for an unknown key, the nearest known one.
 */
import { say } from '../common/problemMessages.ts';
import { readFileSync } from 'node:fs';
import { z } from 'zod';
import { ProblemList } from './problems.ts';
import { isolateBidi } from '../text/bidi.ts';

/** The languages with a catalogue in content/locales/. */
import { LOCALE_CODES } from '../text/locales.ts';
import { paletteShortfalls, statusColours } from '../common/statusColours.ts';
import { contrastRatio } from '../common/colourVision.ts';

/**
 * What an accent colour is read against (templates/assets/site.css): the page (--paper) and the
 * header (--tint). The current menu item is white text (--accent-ink) on the accent: the page's pair.
 */
export const ACCENT_BACKGROUNDS = { page: '#ffffff', header: '#eaf4f4' } as const;

/** The configurable languages (src/text/locales.ts). */
export const LOCALES = LOCALE_CODES;

/** The years a bulletin month may fall in: the satellite era, and no further ahead than a plan reaches. */
export const MONTH_YEARS = { first: 1972, last: 2100 } as const;
const month = z
  .string()
  .regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'a month as YYYY-MM')
  .refine(
    (text) => Number(text.slice(0, 4)) >= MONTH_YEARS.first && Number(text.slice(0, 4)) <= MONTH_YEARS.last,
    `a month from ${MONTH_YEARS.first} to ${MONTH_YEARS.last}`,
  );
/** A real calendar day (2026-02-30 is refused, not read as 2 March). */
export const isCalendarDate = (text: string) => {
  const [year, monthOfYear, day] = text.split('-').map(Number) as [number, number, number];
  const date = new Date(Date.UTC(year, monthOfYear - 1, day));
  return date.getUTCFullYear() === year && date.getUTCMonth() === monthOfYear - 1 && date.getUTCDate() === day;
};
const date = z
  .string()
  .regex(/^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/, 'a date as YYYY-MM-DD')
  .refine(isCalendarDate, 'a day that exists in the calendar');
/**
 * The published site's address: http or https, no user name, password, query or fragment. A missing
 * trailing slash is added, so that the address's own path is kept in every canonical URL.
 */
const baseUrl = z
  .string()
  .max(2000)
  .refine((text) => {
    try {
      const url = new URL(text);
      return (
        (url.protocol === 'https:' || url.protocol === 'http:') &&
        url.username === '' &&
        url.password === '' &&
        url.search === '' &&
        url.hash === ''
      );
    } catch {
      return false;
    }
  }, 'an http or https address without user name, query or fragment, such as https://bulletin.example.org/')
  .transform((text) => {
    const url = new URL(text);
    if (!url.pathname.endsWith('/')) url.pathname = `${url.pathname}/`;
    return url.href;
  });
/** Free text of the configuration: one line, of a length a page can show. */
const label = (max: number) =>
  z
    .string()
    .min(1)
    .max(max)
    .refine((text) => !/[\u0000-\u001f\u007f]/.test(text), 'text without control characters')
    .transform(isolateBidi);
/** Rising class boundaries in hectares: [100, 10000] makes three classes. */
const boundaries = z
  .array(z.number().positive())
  .min(1)
  .refine((list) => list.every((value, k) => k === 0 || value > (list[k - 1] as number)), 'boundaries must rise');

const statusBand = z.strictObject({
  key: z
    .string()
    .regex(/^[a-z][a-z-]*$/)
    .max(40)
    .describe(
      "short key in lower case, used in data files, CSS classes and the wording catalogue: `band.<key>` gives its words in each language, in the tool's catalogue or the folder's own `content/locales/<locale>.json`",
    ),
  fromPercent: z.number().nullable().describe('lower bound, percent of the baseline median, inclusive; `null` for the lowest band'),
  colour: z
    .string()
    .regex(/^#[0-9a-fA-F]{6}$/)
    .optional()
    .describe(
      'the band\'s colour on maps and charts, `#rrggbb`; the check warns when two bands, or a band and the page or "not stated", are hard to tell apart, also with simulated red–green colour blindness',
    ),
});

export const configSchema = z.strictObject({
  title: label(200).describe('title of the bulletin, on every page'),
  publisher: label(200).describe('the agency that publishes it'),
  region: z.strictObject({ name: label(200).describe('name of the region the bulletin covers') }),
  issue: z.strictObject({
    month: month.describe('the bulletin month, `YYYY-MM`'),
    revision: z.number().int().min(1).default(1).describe('revision of this issue: 2 and up for a corrected re-publication'),
    published: date.describe("publication date printed on every page, `YYYY-MM-DD` (never the build's clock)"),
    draft: z
      .boolean()
      .default(false)
      .describe('a draft carries a banner and is kept out of search engines; a published issue may not keep the placeholder foreword'),
    // `text` in the issue's first language; `translations` the same note in the others ({"fr": "…"}).
    corrections: z
      .array(
        z.strictObject({
          date: date.describe('day the correction was made, `YYYY-MM-DD`'),
          text: z.string().min(1).describe("the correction note in the issue's first language"),
          translations: z
            .partialRecord(z.enum(LOCALES), z.string().min(1))
            .optional()
            .describe('the same note in the other languages, by locale (`{"fr": "…"}`)'),
        }),
      )
      .default([])
      .describe(
        'corrections made in this revision, shown at the top of every page of the issue: `{date, text, translations}`, `text` in the first language and `translations` the same note in the others (`{"fr": "…"}`)',
      ),
  }),
  baseline: z.strictObject({
    firstYear: z.number().int().describe('first year of the baseline the bulletin compares with'),
    lastYear: z.number().int().describe('last year of the baseline'),
    minYears: z
      .number()
      .int()
      .min(2)
      .default(3)
      .describe('fewest baseline years a calendar month needs before a figure is stated against it'),
  }),
  coverage: z.strictObject({
    minObservedShare: z
      .number()
      .min(0)
      .max(1)
      .default(0.6)
      .describe('a body-month seen through clouds over less than this share counts as missing'),
    minRegionCoverage: z
      .number()
      .min(0)
      .max(1)
      .default(0.5)
      .describe("below this share of a group's reference area seen, no figure is stated for the group"),
    maxFilledGap: z
      .number()
      .int()
      .min(0)
      .max(12)
      .default(2)
      .describe('gaps of up to this many months are filled by linear interpolation, and flagged'),
    maxCarriedMonths: z
      .number()
      .int()
      .min(0)
      .max(12)
      .default(3)
      .describe(
        "an unseen body's own ratio to usual is carried forward from its last value at most this many months old (fixed-set estimation); older, its seen neighbours' ratio is used",
      ),
  }),
  sizeClasses: z
    .strictObject({
      surface: boundaries.default([100, 10_000]).describe('rising class boundaries for surface water, in hectares'),
      quality: boundaries
        .default([1, 5, 10, 100])
        .describe('rising class boundaries for water quality, in hectares; bodies under the first are left out'),
    })
    .default({ surface: [100, 10_000], quality: [1, 5, 10, 100] }),
  grid: z
    .strictObject({
      cellDegrees: z.number().positive().max(10).default(0.25).describe('side of the square map cells, in degrees'),
      minBodies: z.number().int().min(1).default(2).describe('fewest water bodies a cell needs before its figure is shown'),
    })
    .default({ cellDegrees: 0.25, minBodies: 2 }),
  trends: z
    .strictObject({
      falseDiscoveryRate: z
        .number()
        .gt(0)
        .lt(1)
        .default(0.05)
        .describe(
          'false discovery rate of the Benjamini-Hochberg adjustment across each family of tests (bodies, sub-regions, seasonal classes)',
        ),
      seasonalityP: z
        .number()
        .gt(0)
        .lt(1)
        .default(0.05)
        .describe('Kruskal-Wallis p below which a monthly series is treated as seasonal (it then gets the seasonal Sen slope)'),
      minMonths: z.number().int().min(12).default(36).describe('fewest observed months a series needs for a trend test'),
    })
    .default({ falseDiscoveryRate: 0.05, seasonalityP: 0.05, minMonths: 36 }),
  validation: z
    .strictObject({
      qualityWindowDays: z
        .number()
        .int()
        .min(0)
        .max(31)
        .default(10)
        .describe('days either side of a satellite month within which a field sample is matched to it when its own month has no value'),
    })
    .default({ qualityWindowDays: 10 }),
  storage: z
    .strictObject({
      interpolation: z
        .enum(['pchip', 'linear'])
        .default('pchip')
        .describe(
          'how a storage curve is read between its rows: monotone piecewise-cubic (PCHIP, Fritsch & Carlson 1980) or straight lines',
        ),
      minCurveShare: z
        .number()
        .min(0)
        .max(1)
        .default(0.5)
        .describe("share of a group's reference area whose bodies need a storage curve before the group's storage is stated"),
    })
    .default({ interpolation: 'pchip', minCurveShare: 0.5 }),
  quality: z
    .strictObject({
      minValidPixels: z
        .number()
        .min(0)
        .default(100)
        .describe(
          "fewest valid pixels behind a body's monthly median for it to be used; 100 is about 1 ha at 10 m (this project's default, not a published threshold)",
        ),
      // `names` gives the season's name in each language ("dry" / "sèche"); without one, the key is shown.
      seasons: z
        .array(
          z.strictObject({
            key: z
              .string()
              .regex(/^[a-z][a-z-]*$/)
              .describe('short key in lower case, shown when a language has no name for the season'),
            months: z
              .array(z.number().int().min(1).max(12))
              .min(1)
              .describe('calendar months of the season, 1–12, in order (a season across the new year counts once)'),
            names: z
              .partialRecord(z.enum(LOCALES), z.string().min(1))
              .optional()
              .describe('name of the season in each language, by locale (`{"en": "dry", "fr": "sèche"}`)'),
          }),
        )
        .default([])
        .describe(
          'named seasons for the seasonal water-quality trends: `{key, months, names}`, `months` the calendar months 1–12 in order (a season across the new year counts once), `names` its name per language',
        ),
    })
    .default({ minValidPixels: 100, seasons: [] }),
  statusBands: z.array(statusBand).min(2).describe('bands of percent of the baseline median, lowest first: `{key, fromPercent}`'),
  csv: z
    .strictObject({
      decimal: z
        .enum(['.', ',', 'auto'])
        .default('auto')
        .describe('decimal mark of the tables; `auto` reads a comma too, with one warning per file'),
    })
    .default({ decimal: 'auto' }),
  tables: z
    .strictObject({
      ignoreColumns: z
        .array(z.string().min(1).max(200))
        .max(200)
        .default([])
        .describe('columns an export carries that no table uses, skipped in every table (CSV or Parquet) without a warning'),
      columnWarningsOnDataPage: z
        .boolean()
        .default(false)
        .describe(
          'list warnings about unknown input columns on the data page too; by default they go to `check` and the build log only, since readers cannot act on them',
        ),
    })
    .default({ ignoreColumns: [], columnWarningsOnDataPage: false }),
  wording: z
    .strictObject({
      waterBodies: z
        .enum(['auto', 'lakes', 'reservoirs', 'lakes-and-reservoirs', 'water-bodies'])
        .default('auto')
        .describe(
          'what the key messages call the region\'s water bodies; `auto` reads the inventory\'s `kind` column: all `reservoir` gives "reservoirs", all `lake` "lakes", only those two "lakes and reservoirs", any other kind "water bodies"',
        ),
      healthAuthority: label(200)
        .optional()
        .describe('name of the local health authority, given in the algae and low-water cautions (the same name in every language)'),
      waterAuthority: label(200)
        .optional()
        .describe('name of the local water authority or supplier, given in the low-water caution (the same name in every language)'),
    })
    .default({ waterBodies: 'auto' }),
  site: z.strictObject({
    baseUrl: baseUrl.describe(
      'where the site will be published: http or https, no user name, query or fragment (a trailing slash is added)',
    ),
    maxBodyPages: z
      .number()
      .int()
      .min(0)
      .default(500)
      .describe(
        'most water bodies with a page of their own; the largest flagged bodies come first, and a note says how many were left out',
      ),
    bodiesPerListPage: z
      .number()
      .int()
      .min(1)
      .default(500)
      .describe('most water bodies listed on one page; a longer list gets numbered pages'),
    logo: z
      .strictObject({
        path: z
          .string()
          .min(1)
          .describe(
            'path of the logo in the bulletin folder: a PNG, or an SVG without scripts, event handlers or links to other files; at most 1 MiB',
          ),
        alt: label(200).describe("the logo's text alternative, such as the agency's name"),
      })
      .optional()
      .describe("the agency's logo, shown in the header of every page beside the title and copied into the site's assets/"),
    accentColour: z
      .string()
      .regex(/^#[0-9a-fA-F]{6}$/)
      .optional()
      .describe(
        "the agency's accent colour, `#rrggbb`, for links, the site title and the current menu item (the tool's teal by default); refused below WCAG 2.2 AA contrast (4.5:1) against the page, the header and the white text on it",
      ),
  }),
  locales: z
    .array(z.enum(LOCALES))
    .min(1)
    .refine((list) => new Set(list).size === list.length, 'each locale once')
    .default(['en'])
    .describe('languages of the issue, each once: the first at the site root, every other under `/<locale>/`'),
  inputs: z.strictObject({
    inventory: z.string().min(1).describe('path of the water-body inventory (CSV or Parquet)'),
    surfaceArea: z.string().min(1).describe('path of the surface-area table'),
    quality: z.string().min(1).optional().describe('path of the water-quality table'),
    distribution: z.string().min(1).optional().describe('path of the table of quality value distributions'),
    rainfall: z.string().min(1).optional().describe('path of the rainfall table'),
    field: z.string().min(1).optional().describe('path of the field measurements'),
    storageCurves: z
      .string()
      .min(1)
      .optional()
      .describe('path of the area–elevation–volume curves of the reservoirs (storage figures are shown only with it)'),
    storageFits: z
      .string()
      .min(1)
      .optional()
      .describe('path of fitted area–volume power laws V = a·A^b for reservoirs without a curve (an estimate: volume, no level)'),
    boundaries: z.string().min(1).describe('path of the sub-region boundaries (GeoJSON)'),
  }),
});

export type BulletinConfig = z.infer<typeof configSchema>;

/** Levenshtein distance, for "did you mean". O(a·b). */
function distance(a: string, b: string): number {
  const row = Array.from({ length: b.length + 1 }, (_, k) => k);
  for (let i = 1; i <= a.length; i++) {
    let diagonal = row[0] as number;
    row[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const above = row[j] as number;
      row[j] = Math.min(above + 1, (row[j - 1] as number) + 1, diagonal + (a[i - 1] === b[j - 1] ? 0 : 1));
      diagonal = above;
    }
  }
  return row[b.length] as number;
}

/** The object schema at a path of the configuration, to list the keys it knows. */
function knownKeys(path: PropertyKey[]): string[] {
  let schema: unknown = configSchema;
  for (const key of path) {
    let inner = schema as { shape?: Record<string, unknown>; def?: { innerType?: unknown; element?: unknown } };
    while (!inner.shape && inner.def?.innerType) inner = inner.def.innerType as typeof inner;
    if (typeof key === 'number' && inner.def?.element) schema = inner.def.element;
    else schema = inner.shape?.[String(key)];
    if (!schema) return [];
  }
  let last = schema as { shape?: Record<string, unknown>; def?: { innerType?: unknown } };
  while (!last.shape && last.def?.innerType) last = last.def.innerType as typeof last;
  return Object.keys(last.shape ?? {});
}

export function didYouMean(key: string, known: string[]): string {
  let best = '';
  let bestDistance = Infinity;
  for (const candidate of known) {
    const d = distance(key.toLowerCase(), candidate.toLowerCase());
    if (d < bestDistance) {
      best = candidate;
      bestDistance = d;
    }
  }
  return bestDistance <= Math.max(2, Math.floor(key.length / 3)) ? best : '';
}

/**
 * 1-based line of a path in the JSON text (object keys and array indices), found by scanning the
 * text's structure, so a key is found at its own place even when the same name appears earlier
 * as another key or a value. The deepest part of the path that exists gives the line; 0 when not
 * even its first part does (or for the empty path).
 */
export function lineOfPath(text: string, path: PropertyKey[]): number {
  const lines = keyLines(text);
  for (let depth = path.length; depth > 0; depth--) {
    const line = lines.get(path.slice(0, depth).map(String).join('\u0000'));
    if (line !== undefined) return line;
  }
  return 0;
}

/** Every key path of a JSON text (parts joined by NUL) with the line its key or array item starts on. */
function keyLines(text: string): Map<string, number> {
  const found = new Map<string, number>();
  const stack: Array<{ kind: 'object' | 'array'; path: string[]; index: number; key: string | null }> = [];
  let line = 1;
  let expectKey = false;
  const startValue = () => {
    const top = stack[stack.length - 1];
    if (top?.kind === 'array') {
      const path = [...top.path, String(top.index)];
      if (!found.has(path.join('\u0000'))) found.set(path.join('\u0000'), line);
    }
  };
  const pathOfValue = (): string[] => {
    const top = stack[stack.length - 1];
    if (!top) return [];
    return top.kind === 'object' ? [...top.path, top.key ?? ''] : [...top.path, String(top.index)];
  };
  for (let k = 0; k < text.length; k++) {
    const c = text[k] as string;
    if (c === '\n') line++;
    else if (c === '"') {
      let end = k + 1;
      while (end < text.length && text[end] !== '"') end += text[end] === '\\' ? 2 : 1;
      const top = stack[stack.length - 1];
      if (expectKey && top?.kind === 'object') {
        const key = JSON.parse(text.slice(k, end + 1)) as string;
        top.key = key;
        found.set([...top.path, key].join('\u0000'), line);
        expectKey = false;
      } else startValue();
      k = end;
    } else if (c === '{' || c === '[') {
      startValue();
      stack.push({ kind: c === '{' ? 'object' : 'array', path: pathOfValue(), index: 0, key: null });
      expectKey = c === '{';
    } else if (c === '}' || c === ']') stack.pop();
    else if (c === ',') {
      const top = stack[stack.length - 1];
      if (top?.kind === 'array') top.index++;
      else expectKey = true;
    } else if (c !== ' ' && c !== '\t' && c !== '\r' && c !== ':') startValue();
  }
  return found;
}

/** The 1-based line a JSON.parse error points at (its "position N"), or 0 when it names none. */
export function jsonErrorLine(text: string, error: unknown): number {
  const position = /position (\d+)/.exec(error instanceof Error ? error.message : String(error));
  return position ? text.slice(0, Number(position[1])).split('\n').length : 0;
}

/** Reads and validates a configuration file, with its text (for the lines of later checks); null when it cannot be used. */
export function readConfig(path: string, label: string, problems: ProblemList): { config: BulletinConfig; text: string } | null {
  let text: string;
  let raw: unknown;
  try {
    text = readFileSync(path, 'utf8').replace(/^\uFEFF/, '');
  } catch {
    problems.error({
      code: 'config-missing',
      file: label,
      line: 0,
      column: '',
      value: '',
      expected: 'a bulletin.json in the bulletin folder',
      message: say('config-unreadable'),
    });
    return null;
  }
  try {
    raw = JSON.parse(text);
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    problems.error({
      code: 'config-not-json',
      file: label,
      line: jsonErrorLine(text, error),
      column: '',
      value: '',
      expected: 'valid JSON',
      message: say('config-not-json', { detail: message }),
    });
    return null;
  }
  const parsed = configSchema.safeParse(raw);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      if (issue.code === 'unrecognized_keys') {
        for (const key of issue.keys) {
          const suggestion = didYouMean(key, knownKeys(issue.path));
          problems.error({
            code: 'config-unknown-key',
            file: label,
            line: lineOfPath(text, [...issue.path, key]),
            column: [...issue.path, key].join('.'),
            value: key,
            expected: suggestion ? `did you mean "${suggestion}"?` : `one of ${knownKeys(issue.path).join(', ')}`,
            message: say('config-unknown-key'),
          });
        }
        continue;
      }
      problems.error({
        code: 'config-invalid',
        file: label,
        line: lineOfPath(text, issue.path),
        column: issue.path.join('.'),
        value: '',
        expected: '',
        message: say('config-invalid', { detail: issue.message }),
      });
    }
    return null;
  }
  const config = parsed.data;
  if (config.baseline.firstYear > config.baseline.lastYear) {
    problems.error({
      code: 'config-baseline-order',
      file: label,
      line: lineOfPath(text, ['baseline']),
      column: 'baseline',
      value: `${config.baseline.firstYear}-${config.baseline.lastYear}`,
      expected: 'firstYear no later than lastYear',
      message: say('config-baseline-order'),
    });
  }
  const bands = config.statusBands;
  if (
    bands[0]?.fromPercent !== null ||
    bands.slice(1).some((band, k) => band.fromPercent === null || band.fromPercent <= (bands[k]?.fromPercent ?? -Infinity))
  ) {
    problems.error({
      code: 'config-status-bands',
      file: label,
      line: lineOfPath(text, ['statusBands']),
      column: 'statusBands',
      value: '',
      expected: 'the first band with fromPercent null, then strictly rising bounds',
      message: say('config-status-bands'),
    });
  }
  // An accent colour is text on the page and on the header, and the background of white text (templates/assets/site.css).
  const accent = config.site.accentColour;
  if (accent !== undefined) {
    const against = Object.entries(ACCENT_BACKGROUNDS).map(([name, colour]) => ({ name, ratio: contrastRatio(accent, colour) }));
    const worst = against.reduce((low, entry) => (entry.ratio < low.ratio ? entry : low));
    if (worst.ratio < 4.5)
      problems.error({
        code: 'config-accent-contrast',
        file: label,
        line: lineOfPath(text, ['site', 'accentColour']),
        column: 'site.accentColour',
        value: accent,
        expected: `a colour with at least 4.5:1 contrast against ${against.map((entry) => `the ${entry.name} (${entry.ratio.toFixed(2)}:1)`).join(', ')}`,
        message: say('config-accent-contrast', { ratio: worst.ratio.toFixed(2), against: worst.name }),
      });
  }
  // Configured colours must stay apart for every reader (common/statusColours.ts): a warning, since the agency may have its reasons.
  if (bands.some((band) => band.colour !== undefined)) {
    const shortfalls = paletteShortfalls(statusColours(bands));
    if (shortfalls.length > 0)
      problems.warning({
        code: 'status-colours-close',
        file: label,
        line: lineOfPath(text, ['statusBands']),
        column: 'statusBands',
        value: statusColours(bands).join(' '),
        expected: 'status colours at least ΔE 20 apart, also with simulated deuteranopia and protanopia',
        message: say('status-colours-close', {
          pairs: `${shortfalls.slice(0, 3).join('; ')}${shortfalls.length > 3 ? `; and ${shortfalls.length - 3} more` : ''}`,
        }),
        params: { first: shortfalls[0] as string, count: shortfalls.length },
      });
  }
  return { config, text };
}
