/**
 * Months are handled as whole numbers (year × 12 + month − 1) so gaps and differences are plain
 * arithmetic; labels stay `YYYY-MM` everywhere a person reads them.
 */
export function parseMonth(label: string): number | null {
  const match = /^(\d{4})-(0[1-9]|1[0-2])$/.exec(label);
  if (!match) return null;
  return Number(match[1]) * 12 + Number(match[2]) - 1;
}

export function monthLabel(index: number): string {
  const year = Math.floor(index / 12);
  return `${year}-${String((index % 12) + 1).padStart(2, '0')}`;
}

export const yearOf = (index: number) => Math.floor(index / 12);
/** Calendar month 1–12. */
export const calendarMonthOf = (index: number) => (index % 12) + 1;
