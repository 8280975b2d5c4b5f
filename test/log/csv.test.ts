import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { csvField, neutraliseFormula, toCsv } from '../../src/log/csv';
import { parseCsv, spreadsheetCells } from './csv-reader';

describe('CSV text (RFC 4180)', () => {
  it('ends every record, the last one too, with CRLF (§2.1, §2.2)', () => {
    expect(toCsv(['a', 'b'], [[1, 2]], { bom: false })).toBe('a,b\r\n1,2\r\n');
  });

  it('encloses a field holding a comma, a double quote or a line break in double quotes (§2.6)', () => {
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('line 1\nline 2')).toBe('"line 1\nline 2"');
    expect(csvField('x\r\ny')).toBe('"x\r\ny"');
  });

  it('doubles a double quote inside a quoted field (§2.7)', () => {
    expect(csvField('the "big" ball')).toBe('"the ""big"" ball"');
  });

  it('leaves plain text and numbers bare', () => {
    expect(csvField('steel ball 25 mm')).toBe('steel ball 25 mm');
    expect(csvField(1.642)).toBe('1.642');
    expect(csvField(96120)).toBe('96120');
  });

  it('writes an empty field for a missing value or a number that is not finite', () => {
    expect([null, undefined, Number.NaN, Infinity].map(csvField)).toEqual(['', '', '', '']);
  });

  it('starts with a UTF-8 byte order mark when asked, so spreadsheets read it as UTF-8 (common practice)', () => {
    expect(toCsv(['name'], [['Genève']]).startsWith('\ufeffname\r\n')).toBe(true);
    expect(toCsv(['name'], [['Genève']], { bom: false }).startsWith('name')).toBe(true);
  });

  it('reads back, by a strict RFC 4180 reader, as the same cells', () => {
    const text = fc.string({ unit: fc.constantFrom('a', ',', '"', '\r', '\n', ' ', 'é', '1', '=', '-') });
    fc.assert(
      fc.property(fc.array(fc.array(text, { minLength: 3, maxLength: 3 }), { maxLength: 5 }), (rows) => {
        const parsed = parseCsv(toCsv(['x', 'y', 'z'], rows, { bom: false }));
        expect(parsed).toEqual([['x', 'y', 'z'], ...rows.map((r) => r.map(neutraliseFormula))]);
      }),
    );
  });
});

describe('neutralising formulas (OWASP, "CSV Injection")', () => {
  // OWASP lists the leading characters a spreadsheet treats as a formula: = + - @ tab (0x09) and CR (0x0D),
  // and recommends prefixing such a cell with a single quote.
  it.each(['=HYPERLINK("http://example.invalid","x")', '+1+1', '-2+3+cmd|\' /C calc\'!A0', '@SUM(A1:A9)'])(
    'prefixes the text cell %j with a single quote',
    (cell) => {
      expect(neutraliseFormula(cell)).toBe(`'${cell}`);
      expect(parseCsv(`${csvField(cell)}\r\n`)[0]![0]).toBe(`'${cell}`);
    },
  );

  // A leading tab or CR is a separator too: after it, a spreadsheet splitting on tabs (or lines) would start a
  // new cell with "=1", so that gets its own single quote (see the next block).
  it.each([
    ['\t=1', "'\t'=1"],
    ['\r=1', "'\r'=1"],
  ])('prefixes the text cell %j with a single quote, and the formula behind its separator too', (cell, neutral) => {
    expect(neutraliseFormula(cell)).toBe(neutral);
    expect(parseCsv(`${csvField(cell)}\r\n`)[0]![0]).toBe(neutral);
  });

  it('leaves text that starts with anything else alone', () => {
    for (const cell of ['quarry', ' =1', "'already quoted", '1.5', '']) expect(neutraliseFormula(cell)).toBe(cell);
  });

  it('keeps negative numbers numbers: a number cell holds only a number, so nothing can run', () => {
    expect(csvField(-0.004)).toBe('-0.004');
    expect(csvField(-1e-7)).toBe('-1e-7');
  });

  it('still neutralises text that merely looks like a negative number, since text comes from people', () => {
    expect(csvField('-5')).toBe("'-5");
  });
});

describe('neutralising formulas for every separator a spreadsheet may use (OWASP, "CSV Injection")', () => {
  // OWASP's CSV Injection guidance (from memory): besides the leading = + - @ tab and CR, "take care of the field
  // separator (e.g. ',' or ';') and quotes", since an attacker can start a new cell in the middle of the input.
  it.each([
    ['x;=1+1', `"x;'=1+1"`],
    ['x\t=1+1', `"x\t'=1+1"`],
    ['x,=1+1', `"x,'=1+1"`],
    ['x;;@SUM(A1)', `"x;;'@SUM(A1)"`],
    ['x\r\n-2+3', `"x\r\n'-2+3"`],
    ['x;\u0000=1', `"x;'\u0000=1"`],
    ['x;"=1+1', `"x;'""=1+1"`],
    ['a;b', '"a;b"'],
    ['note; -2+3', '"note; -2+3"'],
    ['line 1\r\nline 2', '"line 1\r\nline 2"'],
  ])('writes %j so that a spreadsheet splitting on ; or tab finds no formula cell in it', (cell, written) => {
    expect(csvField(cell)).toBe(written);
  });

  it.each([
    ['\u0000=1+1', 'NUL'],
    ['\u0001=1+1', 'SOH'],
    ['\u0008=1+1', 'backspace'],
    ['\u000b=1+1', 'vertical tab'],
    ['\u000c=1+1', 'form feed'],
    ['\u001f=1+1', 'unit separator'],
    ['\u007f=1+1', 'DEL'],
  ])('prefixes a cell that starts with a control character (%j, %s) with a single quote', (cell) => {
    expect(neutraliseFormula(cell)).toBe(`'${cell}`);
  });

  it('reads back through the strict RFC 4180 reader as the neutralised cells', () => {
    const cells = ['x;=1+1', '\u0000=1+1', 'a\tb', 'plain'];
    expect(parseCsv(toCsv(['c1', 'c2', 'c3', 'c4'], [cells], { bom: false }))[1]).toEqual(["x;'=1+1", "'\u0000=1+1", 'a\tb', 'plain']);
  });

  it('leaves no cell that starts a formula, whether the spreadsheet splits on comma, semicolon or tab', () => {
    const unit = fc.constantFrom('a', ',', ';', '\t', '"', '\r', '\n', '\u0000', ' ', '=', '+', '-', '@', "'", '1');
    fc.assert(
      fc.property(fc.array(fc.array(fc.string({ unit }), { minLength: 1, maxLength: 4 }), { maxLength: 4 }), (rows) => {
        const text = toCsv(['x'], rows, { bom: false });
        for (const separator of [',', ';', '\t']) {
          // A formula start, maybe behind control characters a reader may drop.
          for (const cell of spreadsheetCells(text, separator)) expect(cell).not.toMatch(/^[\u0000-\u001f\u007f]*[=+\-@]/);
        }
      }),
      { numRuns: 2000, seed: 13 },
    );
  });
});
