/**
 * CSV text for spreadsheets: RFC 4180 (CRLF after every record, fields with a comma, a double quote or a line
 * break enclosed in double quotes, quotes inside doubled), UTF-8, optionally with a byte order mark.
 *
 * Formula injection (OWASP, "CSV Injection"): a spreadsheet runs a cell that starts with = + - @ tab or CR as a
 * formula. Text cells (names, notes, ids: anything a person typed or a file brought) that start with one of
 * these, or with any other control character (NUL, LF…, which some spreadsheets drop before they look at the
 * first character), get a leading single quote, which spreadsheets read as "this is text".
 * A separator inside a text can start a new cell: OWASP warns that `x;=1+1` becomes a formula cell in a
 * spreadsheet that splits on ';' (the default where the decimal mark is a comma). Two measures:
 * - text holding a comma, semicolon, tab, line break or double quote is enclosed in double quotes, which
 *   keeps it one cell for a reader that splits on the same separator as the writer, or when it is the row's
 *   first cell;
 * - but a spreadsheet splitting on ';' a row written with ',' sees a double quote in the middle of its cell as
 *   a plain character, so the quotes protect nothing there: a formula start (or a double quote) that follows
 *   a run of separators inside the text gets the single quote too (`x;=1+1` is written `x;'=1+1`).
 * (A space or a character of the user's choosing as separator is not covered: neutralising after every space
 * would change nearly every note, and the import dialogs that offer those show the split first.)
 * Number cells are not touched: they are written here from JavaScript numbers (Number#toString: digits, one
 * leading "-", ".", "e", "+"), so a negative residual such as -0.004 is a number literal a spreadsheet parses as
 * a number, with nothing in it to run; prefixing it would turn it into text and break every sum over the column.
 * The rule goes by the type of the value, not by what the text looks like: a note that reads "-5" is text and
 * is neutralised like any other text.
 */

export type CsvValue = string | number | boolean | null | undefined;

/**
 * OWASP's list of leading characters that make a spreadsheet evaluate a cell (= + - @ tab CR), widened to every
 * C0 control character and DEL: NUL and the like are invisible, and a reader that strips them would find the
 * formula behind.
 */
const FORMULA_START = /^[=+\-@\u0000-\u001f\u007f]/;

/**
 * A run of separators inside a text, followed by what would then start a formula cell: = + - or @, maybe behind
 * double quotes (a reader that takes one as the start of a quoted cell would find the formula in it) or
 * control characters (which a reader may drop).
 * The run is taken whole, so what follows it is never itself a separator (a CRLF in a note stays as it is).
 */
const CELL_START_INSIDE = /([,;\t\r\n]+)(?=["\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]*[=+\-@])/g;

export function neutraliseFormula(text: string): string {
  const inside = text.replace(CELL_START_INSIDE, "$1'");
  return FORMULA_START.test(inside) ? `'${inside}` : inside;
}

/** RFC 4180's own reasons (comma, quote, CR, LF) and the other separators spreadsheets split on (semicolon, tab). */
const NEEDS_QUOTES = /[",;\t\r\n]/;

/**
 * One field: numbers as numbers, text neutralised and quoted where RFC 4180 §2.6 requires. A number is written at
 * 12 significant digits at most, far beyond any measurement, so binary floating-point tails do not reach the
 * spreadsheet (a temperature typed as 57.2 °F is 14.000000000000004 °C inside, and "14" in the table).
 */
export function csvField(value: CsvValue): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(Number(value.toPrecision(12))) : '';
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
