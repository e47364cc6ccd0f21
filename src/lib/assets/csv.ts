// CSV as RFC 4180 describes it: CRLF line ends, fields with commas, quotes or line breaks quoted, quotes doubled.

/** One CSV field; a leading =, +, - or @ is prefixed with ' so spreadsheets do not run it as a formula (OWASP CSV injection). */
export function csvField(value: unknown): string {
  let text = value === null || value === undefined ? '' : value instanceof Date ? value.toISOString() : String(value);
  if (/^[=+\-@\t\r]/.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** Rows (header first) as one CSV document. */
export function toCsv(rows: unknown[][]): string {
  return rows.map((r) => r.map(csvField).join(',')).join('\r\n') + '\r\n';
}
