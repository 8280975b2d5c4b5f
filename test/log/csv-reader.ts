// A reader for the CSV tests, written from the grammar of RFC 4180 §2, stricter than spreadsheets are.
/** A strict RFC 4180 reader (§2 grammar: CRLF records, optional double quotes, "" inside quotes). */
export function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let i = 0;
  let quoted = false;
  let atFieldStart = true;
  while (i < text.length) {
    const c = text[i]!;
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        field += '"';
        i += 2;
      } else if (c === '"') {
        quoted = false;
        i++;
        if (i < text.length && text[i] !== ',' && !text.startsWith('\r\n', i)) throw new Error(`text after a closing quote at ${i}`);
      } else {
        field += c;
        i++;
      }
      continue;
    }
    if (c === '"' && atFieldStart) {
      quoted = true;
      atFieldStart = false;
      i++;
    } else if (c === ',') {
      row.push(field);
      field = '';
      atFieldStart = true;
      i++;
    } else if (text.startsWith('\r\n', i)) {
      row.push(field);
      rows.push(row);
      row = [];
      field = '';
      atFieldStart = true;
      i += 2;
    } else if (c === '"' || c === '\r' || c === '\n') {
      throw new Error(`${JSON.stringify(c)} outside quotes at ${i} (RFC 4180 §2.6)`);
    } else {
      field += c;
      atFieldStart = false;
      i++;
    }
  }
  if (quoted) throw new Error('unclosed quote');
  if (field !== '' || row.length > 0) {
    row.push(field);
    rows.push(row);
  }
  return rows;
}

/**
 * How a spreadsheet splits a CSV text on the separator of its locale: a double quote at the start of a cell
 * groups it, whatever the separator; elsewhere a quote is a plain character (what LibreOffice Calc and Excel do on
 * import; from memory). Lenient where parseCsv is strict. Returns every cell of every line in one list.
 */
export function spreadsheetCells(text: string, separator: string): string[] {
  const cells: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') (cell += '"'), i++;
      else if (c === '"') quoted = false;
      else cell += c;
    } else if (c === '"' && cell === '') quoted = true;
    else if (c === separator || c === '\n') (cells.push(cell), (cell = ''));
    else if (c === '\r' && text[i + 1] === '\n') continue;
    else cell += c;
  }
  cells.push(cell);
  return cells;
}
