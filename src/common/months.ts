/**
 * Months are handled as whole numbers (year × 12 + month − 1) so gaps and differences are plain
 * arithmetic; labels stay `YYYY-MM` everywhere a person reads them.
 */
/** The earliest month a table may hold; older rows are refused as out of range. */
export const FIRST_MONTH = 1950 * 12;

export function parseMonth(label: string): number | null {
  // By character codes: this runs for every row of the large tables.
  if (label.length !== 7 || label.charCodeAt(4) !== 45) return null;
  let year = 0;
  for (let k = 0; k < 4; k++) {
    const digit = label.charCodeAt(k) - 48;
    if (digit < 0 || digit > 9) return null;
    year = year * 10 + digit;
  }
  const tens = label.charCodeAt(5) - 48;
  const units = label.charCodeAt(6) - 48;
  if (tens < 0 || tens > 1 || units < 0 || units > 9) return null;
  const month = tens * 10 + units;
  if (month < 1 || month > 12) return null;
  return year * 12 + month - 1;
}

export function monthLabel(index: number): string {
  const year = Math.floor(index / 12);
  return `${year}-${String((index % 12) + 1).padStart(2, '0')}`;
}

export const yearOf = (index: number) => Math.floor(index / 12);
/** Calendar month 1–12. */
export const calendarMonthOf = (index: number) => (index % 12) + 1;
