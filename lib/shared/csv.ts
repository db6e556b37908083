// CSV for spreadsheets: RFC 4180 quoting, and cells that a spreadsheet would run as a formula
// (starting with = + - @, or a tab / carriage return) are prefixed with an apostrophe.

/** One cell, quoted when needed, defused when it could be read as a formula. */
export function csvCell(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return '';
  let text = String(value);
  if (typeof value === 'string' && /^[=+\-@\t\r]/.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** One line of cells, CRLF-terminated. */
export function csvRow(cells: (string | number | null | undefined)[]): string {
  return `${cells.map(csvCell).join(',')}\r\n`;
}
