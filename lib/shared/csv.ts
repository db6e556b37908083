// CSV for spreadsheets: RFC 4180 quoting, and cells that a spreadsheet would run as a formula are
// prefixed with an apostrophe. A spreadsheet may split a line on commas, semicolons or tabs
// (depending on its locale), so every cell holding any of them is quoted (quotes are honoured
// whatever the separator), and a cell counts as a formula when it starts, after spaces or quote
// marks, with = + - @ (or their full-width forms), or with a tab or carriage return.
const FORMULA_START = /^(?:[\t\r]|[\s"']*[=+\-@\uFF1D\uFF0B\uFF0D\uFF20])/;
const NEEDS_QUOTES = /[",;\t\r\n|]/;

/** One cell, quoted when needed, defused when it could be read as a formula. */
export function csvCell(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return '';
  let text = String(value);
  if (typeof value === 'string' && FORMULA_START.test(text)) text = `'${text}`;
  return NEEDS_QUOTES.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** One line of cells, CRLF-terminated. */
export function csvRow(cells: (string | number | null | undefined)[]): string {
  return `${cells.map(csvCell).join(',')}\r\n`;
}
