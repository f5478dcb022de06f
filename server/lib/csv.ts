// CSV as RFC 4180 describes it: CRLF between records, a field in double quotes when it holds
// a comma, a quote, CR or LF, and a quote inside a field doubled.

export type CsvCell = string | number | boolean | null | undefined | Date;

// A text cell that a spreadsheet would run as a formula gets a leading apostrophe (OWASP,
// "CSV Injection"): exports can hold titles copied from other members' journals.
const FORMULA_START = /^[=+\-@\t\r]/;

function cellText(value: CsvCell): string {
  if (value === null || value === undefined) return '';
  if (value instanceof Date) return value.toISOString();
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  return FORMULA_START.test(value) ? `'${value}` : value;
}

/** Returns one CSV field, quoted when RFC 4180 requires it. */
export function csvField(value: CsvCell): string {
  const text = cellText(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** Returns a whole CSV document: a header record, then one record per row, CRLF-separated. */
export function toCsv(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  const lines = [header, ...rows].map((row) => row.map(csvField).join(','));
  return `${lines.join('\r\n')}\r\n`;
}
