/**
 * Number and time formats of the chart axes and legends per language, as d3-format and d3-time-format
 * locale definitions (Vega-Lite `config.locale`). English charts use Vega's default (en-US) and get
 * nothing here, so their specs stay as they were. The French definitions follow the fr-FR locale
 * files shipped with d3-format and d3-time-format (written out from memory of those files, then
 * checked against Intl's French output for the decimal mark, grouping and month names).
 */
import type { TopLevelSpec } from 'vega-lite';

const FRENCH = {
  number: { decimal: ',', thousands: '\u00a0', grouping: [3], currency: ['', '\u00a0€'], percent: '\u202f%' },
  time: {
    dateTime: '%A %e %B %Y à %X',
    date: '%d/%m/%Y',
    time: '%H:%M:%S',
    periods: ['AM', 'PM'],
    days: ['dimanche', 'lundi', 'mardi', 'mercredi', 'jeudi', 'vendredi', 'samedi'],
    shortDays: ['dim.', 'lun.', 'mar.', 'mer.', 'jeu.', 'ven.', 'sam.'],
    months: ['janvier', 'février', 'mars', 'avril', 'mai', 'juin', 'juillet', 'août', 'septembre', 'octobre', 'novembre', 'décembre'],
    shortMonths: ['janv.', 'févr.', 'mars', 'avr.', 'mai', 'juin', 'juil.', 'août', 'sept.', 'oct.', 'nov.', 'déc.'],
  },
};

const CHART_LOCALES: Record<string, typeof FRENCH> = { fr: FRENCH };

/** The spec with the language's number and time formats in its config (unchanged for English). */
export function withChartLocale(spec: TopLevelSpec, locale: string): TopLevelSpec {
  const definition = CHART_LOCALES[locale];
  return definition ? ({ ...spec, config: { ...(spec.config ?? {}), locale: definition } } as TopLevelSpec) : spec;
}
