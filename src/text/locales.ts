/**
 * The languages the tool speaks: adding one means an entry here and its catalogue
 * (content/locales/<locale>.json, with every English key; test/text/locales.test.ts checks it).
 * Everything else (the configuration's choices, the language switch, chart number and date
 * formats, init's placeholder texts) reads this table.
 *
 * Chart formats are d3-format and d3-time-format locale definitions (Vega-Lite `config.locale`);
 * null keeps Vega's default (en-US). The French definitions follow the fr-FR locale files shipped
 * with d3-format and d3-time-format (written out from memory of those files, then checked against
 * Intl's French output for the decimal mark, grouping and month names).
 */
const FRENCH_CHARTS = {
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

export interface LocaleEntry {
  /** The language's own name, in the language switch. */
  name: string;
  /** Number and time formats of its charts; null for Vega's default. */
  charts: typeof FRENCH_CHARTS | null;
}

export const LOCALES = {
  en: { name: 'English', charts: null },
  fr: { name: 'Français', charts: FRENCH_CHARTS },
} as const satisfies Record<string, LocaleEntry>;

export type Locale = keyof typeof LOCALES;

/** The locale codes, in the table's order. */
export const LOCALE_CODES = Object.keys(LOCALES) as [Locale, ...Locale[]];

/** The registry's entry of a locale, or undefined for a code it does not know. */
export const localeEntry = (locale: string): LocaleEntry | undefined => (LOCALES as Record<string, LocaleEntry>)[locale];
