/**
 * CSV text for spreadsheets: RFC 4180 (CRLF after every record, fields with a comma, a double quote or a line
 * break enclosed in double quotes, quotes inside doubled), UTF-8, optionally with a byte order mark.
 *
 * Formula injection (OWASP, "CSV Injection"): a spreadsheet runs a cell that starts with = + - @ tab or CR as a
 * formula. Text cells (names, notes, ids: anything a person typed or a file brought) that start with one of
 * these get a leading single quote, which spreadsheets read as "this is text".
 * Number cells are not touched: they are written here from JavaScript numbers (Number#toString: digits, one
 * leading "-", ".", "e", "+"), so a negative residual such as -0.004 is a number literal a spreadsheet parses as
 * a number, with nothing in it to run; prefixing it would turn it into text and break every sum over the column.
 * The rule goes by the type of the value, not by what the text looks like: a note that reads "-5" is text and
 * is neutralised like any other text.
 */

export type CsvValue = string | number | boolean | null | undefined;

/** OWASP's list of leading characters that make a spreadsheet evaluate a cell. */
const FORMULA_START = new Set(['=', '+', '-', '@', '\t', '\r']);

export function neutraliseFormula(text: string): string {
  return text.length > 0 && FORMULA_START.has(text[0]!) ? `'${text}` : text;
}

const NEEDS_QUOTES = /[",\r\n]/;

/** One field: numbers as numbers, text neutralised and quoted where RFC 4180 §2.6 requires. */
export function csvField(value: CsvValue): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  const text = neutraliseFormula(value);
  return NEEDS_QUOTES.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export interface CsvOptions {
  /** Start with a UTF-8 byte order mark, which spreadsheets use to tell UTF-8 (default true). */
  bom?: boolean;
}

/** A whole CSV text: the header, then one record per row, each ended by CRLF. */
export function toCsv(header: readonly string[], rows: readonly (readonly CsvValue[])[], options: CsvOptions = {}): string {
  const lines = [header.map(csvField).join(',')];
  for (const row of rows) lines.push(row.map(csvField).join(','));
  return `${options.bom === false ? '' : '\ufeff'}${lines.join('\r\n')}\r\n`;
}
