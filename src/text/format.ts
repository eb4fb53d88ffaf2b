/** Numbers and dates for people, through Intl; UTC everywhere so output never depends on the machine. */
export function formatPercent(locale: string, percent: number, digits = 0): string {
  return new Intl.NumberFormat(locale, { style: 'percent', maximumFractionDigits: digits, minimumFractionDigits: digits }).format(percent / 100);
}

export function formatNumber(locale: string, value: number, digits = 0): string {
  return new Intl.NumberFormat(locale, { maximumFractionDigits: digits, minimumFractionDigits: digits }).format(value);
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

/** "3 December 2026" for an ISO date. */
export function formatDate(locale: string, isoDate: string): string {
  return new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' }).format(new Date(`${isoDate}T00:00:00Z`));
}
