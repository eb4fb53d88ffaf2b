/** Numbers and dates for people, through Intl; UTC everywhere so output never depends on the machine. */
import { translator } from './index.ts';
/** Intl formatters are costly to make (tens of microseconds) and pages format hundreds of thousands of numbers: one per style. */
const numberFormats = new Map<string, Intl.NumberFormat>();

function numberFormat(locale: string, digits: number, percent: boolean): Intl.NumberFormat {
  const key = `${locale} ${digits} ${percent}`;
  let format = numberFormats.get(key);
  if (!format) {
    format = new Intl.NumberFormat(locale, {
      ...(percent ? { style: 'percent' as const } : {}),
      maximumFractionDigits: digits,
      minimumFractionDigits: digits,
    });
    numberFormats.set(key, format);
  }
  return format;
}

export function formatPercent(locale: string, percent: number, digits = 0): string {
  return numberFormat(locale, digits, true).format(percent / 100);
}

export function formatNumber(locale: string, value: number, digits = 0): string {
  return numberFormat(locale, digits, false).format(value);
}

/** "November 2026" for month index year × 12 + month − 1. */
export function formatMonth(locale: string, monthIndex: number): string {
  const date = new Date(Date.UTC(Math.floor(monthIndex / 12), monthIndex % 12, 1));
  return new Intl.DateTimeFormat(locale, { month: 'long', year: 'numeric', timeZone: 'UTC' }).format(date);
}

/** "November" for calendar month 1–12. */
export function formatCalendarMonth(locale: string, calendarMonth: number): string {
  return new Intl.DateTimeFormat(locale, { month: 'long', timeZone: 'UTC' }).format(new Date(Date.UTC(2000, calendarMonth - 1, 1)));
}

/**
 * "3 December 2026" for an ISO date: day, month, year in every language (the English catalogue is
 * British English, so its dates are too, rather than Intl's American default for plain "en").
 */
export function formatDate(locale: string, isoDate: string): string {
  return new Intl.DateTimeFormat(locale === 'en' ? 'en-GB' : locale, {
    day: 'numeric',
    month: 'long',
    year: 'numeric',
    timeZone: 'UTC',
  }).format(new Date(`${isoDate}T00:00:00Z`));
}

/** A latitude or longitude as "12.50° S" (its hemisphere in the language's words), to `digits` decimals. */
export function formatDegrees(locale: string, value: number, axis: 'lat' | 'lon', digits: number): string {
  const t = translator(locale);
  const hemisphere = axis === 'lat' ? (value < 0 ? 'view.south' : 'view.north') : value < 0 ? 'view.west' : 'view.east';
  return `${formatNumber(locale, Math.abs(value), digits)}° ${t(hemisphere)}`;
}

/** A point as "latitude, longitude", each with its hemisphere. */
export function formatPosition(locale: string, lat: number, lon: number, digits: number): string {
  return `${formatDegrees(locale, lat, 'lat', digits)}, ${formatDegrees(locale, lon, 'lon', digits)}`;
}
