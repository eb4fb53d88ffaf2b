/**
 * Every sentence a problem with the inputs is reported in: one catalogue, so the words of a problem
 * are looked up by a typed id (a misspelt id is a compile error) and its figures are named
 * parameters (a missing one is a compile error too). These are the command line's words, English;
 * a warning's words on the site, in each language, are the locale catalogues' `warning.<code>`
 * (src/wording/warnings.ts), filled from the same `Problem.params`.
 *
 * A problem's `message` is a ProblemText, which only `say` makes: an inline string is refused by
 * the compiler, so no message can bypass the catalogue.
 */

export const PROBLEM_MESSAGES = {
  // Files and paths (src/ingest/confine.ts, csv.ts).
  'path-invalid': 'the path is empty, too long or holds a NUL byte',
  'path-absolute': 'the path is absolute; inputs are named relative to the bulletin folder',
  'path-outside': 'the path leads out of the bulletin folder',
  'path-link-loop': 'the path is a loop of symbolic links',
  'path-link-outside': 'the path is a symbolic link that leads out of the bulletin folder',
  'path-folder': 'the path is a folder',
  'path-not-regular': 'the path is not a regular file (a pipe, device or socket)',
  'file-missing': 'the file does not exist',
  'file-too-large': 'the file is {size} bytes, above the limit of {limit} for this kind',
  'file-empty': 'the file is empty',
  'file-not-utf8': 'the file is not UTF-8{guess}',
  'file-not-utf8-convert': 'the file is not UTF-8; convert it to UTF-8',
  'file-no-rows': 'the file has no data rows',
  'file-header-only': 'the file has a header but no data rows',
  'partition-link': 'a symbolic link in a folder of partitions is not followed',
  'partition-none': 'the folder holds no .parquet file',
  'parquet-unreadable': 'cannot read the Parquet file: {detail}',
  'field-count': 'the row has the wrong number of fields',
  'column-missing': 'a required column is missing',
  'column-duplicate': 'a column name appears twice',
  'column-unknown': 'an unknown column is ignored',
  // Cells (src/ingest/cells.ts).
  'value-empty': 'the value is empty',
  'value-not-number': 'the value is not a number',
  'value-not-finite': 'the value is not a finite number',
  'value-out-of-range': 'the value is out of range',
  'value-not-flag': 'the value is not yes or no',
  'decimal-comma': 'a decimal comma was read as a decimal point',
  'month-invalid': 'the month cannot be read',
  'month-not-first-day': 'a day other than the first: a monthly table takes one row per month, dated YYYY-MM or YYYY-MM-01',
  'date-invalid': 'the date cannot be read',
  // Tables (src/ingest/tables.ts, plainScan.ts).
  'month-too-early': 'the month is too early for satellite data',
  'month-after-bulletin': '{count} row(s) after the bulletin month are ignored (the first on this line)',
  'reference-area-zero': 'a water body needs a reference area above 0',
  'id-too-long': 'the id is too long',
  'name-too-long': 'the name is too long',
  'id-path-collision': 'two ids would share one page address',
  'unknown-body': 'the water body is not in the inventory',
  'area-above-reference': 'the water area is far above the reference area: check the units or the inventory',
  'duplicate-row': 'the same water body and month already appear on line {line}',
  'duplicate-row-parameter': 'the same water body, month and parameter already appear on line {line}',
  'duplicate-subregion-month': 'the same sub-region and month already appear on line {line}',
  'parameter-unknown': 'the parameter is not one the bulletin knows',
  'unit-mismatch': 'the unit does not match {name}',
  'unit-mixed':
    'the table mixes NTU and FNU turbidity, which are not interchangeable: give every row in one unit (the one the retrieval was calibrated in)',
  'quantiles-out-of-order': 'the quantiles are not in rising order',
  'subregion-without-boundary': 'the sub-region has no boundary',
  'curve-unknown-body': 'the curve names a water body the inventory does not list',
  'fit-unknown-body': 'the fit names a water body the inventory does not list',
  'curve-duplicate-elevation': 'the elevation already appears on line {line} for {id}',
  'curve-falls': 'the {quantity} falls as the elevation rises for {id}',
  'curve-too-short': 'a curve needs two or more elevations',
  'curve-missing-for-body': 'the water body has no curve (or its curve has a problem above)',
  'fit-range-empty': "the fit's area range is empty",
  'fit-and-curve': 'the body already has a storage curve',
  'fit-twice': 'the body already has a fit on line {line}',
  'bin-empty': 'the bin has no width',
  'duplicate-id': 'the id already appears on line {line}',
  // The folder as a whole (src/ingest/index.ts).
  'content-placeholder': 'the foreword is still the placeholder that limnopress init wrote; write the foreword, or keep the issue a draft',
  'content-untranslated': 'no {locale} translation: the {locale} pages show this text in the first language',
  'area-outside-curve':
    '{count} month(s) of observed water area lie outside the curve; storage is computed at the nearest end of the curve, never extrapolated',
  'turbidity-units-differ':
    '{count} field turbidity sample(s) are in another unit than the satellite turbidity (NTU and FNU are not interchangeable) and are left out of the comparison',
  'body-without-data': 'the water body has no surface-area data',
  'bulletin-month-without-data': 'the surface-area table has no row for the bulletin month',
  'baseline-outside-data': 'the baseline period reaches beyond the surface-area data',
  'baseline-includes-bulletin-year': 'the baseline includes the bulletin year, so {month} is partly compared with itself',
  // Configuration (src/ingest/config.ts, logo.ts).
  'config-unreadable': 'the configuration file cannot be read',
  'config-not-json': 'the configuration is not valid JSON: {detail}',
  'config-unknown-key': 'the configuration has an unknown key',
  'config-invalid': '{detail}',
  'config-baseline-order': 'the baseline period ends before it starts',
  'config-status-bands': 'status bands must cover all values in rising order',
  'config-accent-contrast':
    'the accent colour is too light or too dark to read: {ratio}:1 against the {against}, below WCAG 2.2 AA (4.5:1)',
  'status-colours-close': 'status colours hard to tell apart: {pairs}',
  'logo-not-image': 'the logo is neither a PNG nor an SVG',
  'logo-svg-active': 'the SVG logo holds {what} (line {line}); remove it, or export the logo as PNG',
  // Boundaries (src/ingest/geojson.ts).
  'geojson-unreadable': 'cannot read the GeoJSON: {detail}',
  'geojson-not-collection': 'the file is not a GeoJSON FeatureCollection',
  'geojson-feature': 'a feature is not an object',
  'geojson-properties': 'a feature lacks its sub-region id or name',
  'geojson-too-long': 'the sub-region id or name is too long',
  'geojson-id-collision': 'two sub-region ids would share one page address',
  'geojson-geometry': 'the feature has no polygon geometry',
  'geojson-no-rings': 'a polygon has no rings',
  'geojson-too-large': 'the boundaries hold too many positions; simplify them',
  'geojson-position': 'a position is not a valid longitude and latitude',
  'geojson-ring-open': 'a polygon ring is not closed',
  // Editorial wording (src/ingest/wording.ts).
  'wording-not-json': 'the wording is not valid JSON: {detail}',
  'wording-not-object': 'the wording file is not a JSON object',
  'wording-unknown-key': 'the wording has a key the tool does not use',
  'wording-not-text': 'the words for this key are not one line of text',
  'wording-extra-placeholder': 'the words use a placeholder the tool does not fill for this key',
  'wording-drops-placeholder': 'the words leave out a figure or name the tool fills in; readers will not see it',
  'wording-plural-forms': "the message has forms by count that keep the tool's words; reword them as well",
  'wording-one-language': "the words are changed in this language only; the other languages keep the tool's",
  'wording-unused': 'the issue is not published in this language, so this wording is not used',
  'config-band-words': 'the status band has no words in {locale}',
  // The archive (src/ingest/issues.ts).
  'archive-link': 'an archive entry is a symbolic link; it is not followed',
  'issue-twice': 'the same issue and revision is also in {other}',
  // Series tables of `limnopress trend` (src/ingest/seriesTable.ts, src/cli/trend.ts).
  'time-too-large': 'the time is too large for the trend arithmetic',
  'time-invalid': 'the time cannot be read',
  'value-too-large': 'the value is too large for the trend arithmetic',
  'series-too-long': 'series "{key}" has {count} values, more than the pairwise trend methods are run on',
  'duplicate-time': 'series "{key}" already has this time on line {line}',
  'time-not-monthly': '--seasonal needs monthly times; series "{key}" has plain numbers',
  // The list itself (src/ingest/problems.ts).
  'more-problems': '{count} more problem(s) of this kind ({code}) not listed',
} as const;

export type ProblemMessageId = keyof typeof PROBLEM_MESSAGES;

/** The names of the `{placeholders}` of a message. */
type Placeholders<Text extends string> = Text extends `${string}{${infer Name}}${infer Rest}` ? Name | Placeholders<Rest> : never;

type ParamsOf<Id extends ProblemMessageId> = [Placeholders<(typeof PROBLEM_MESSAGES)[Id]>] extends [never]
  ? []
  : [params: Record<Placeholders<(typeof PROBLEM_MESSAGES)[Id]>, string | number>];

/** A problem's words, made only by `say` from the catalogue. */
export type ProblemText = string & { readonly __problemText: unique symbol };

/** The catalogue's words for `id`, each `{name}` filled from `params`. */
export function say<Id extends ProblemMessageId>(id: Id, ...[params]: ParamsOf<Id>): ProblemText {
  const template: string = PROBLEM_MESSAGES[id];
  const values = (params ?? {}) as Record<string, string | number>;
  return template.replace(/\{(\w+)\}/g, (_, name: string) => String(values[name])) as ProblemText;
}
