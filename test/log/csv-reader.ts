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
