/**
 * CSV fields as every CSV the tool writes spells them (RFC 4180): a field with a comma, quote or line
 * break is quoted with its quotes doubled. A text that a spreadsheet would run as a formula (it
 * starts with =, +, -, @, a tab or a carriage return) gets a leading apostrophe, as the OWASP
 * guidance on CSV injection advises; numbers are written as they are, so -0.5 stays a number.
 */
export function csvField(value: string | number | boolean | null | undefined): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  let text = String(value);
  if (/^[=+\-@\t\r]/.test(text) && !/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}
