/** The language's chart number and time formats (src/text/locales.ts) in a spec's config; English specs stay as they are. */
import type { TopLevelSpec } from 'vega-lite';
import { localeEntry } from '../text/locales.ts';

/** The spec with the language's number and time formats in its config (unchanged for English). */
export function withChartLocale(spec: TopLevelSpec, locale: string): TopLevelSpec {
  const definition = localeEntry(locale)?.charts;
  return definition ? ({ ...spec, config: { ...(spec.config ?? {}), locale: definition } } as TopLevelSpec) : spec;
}
